import { LocalDateTime } from '@/components/dataset/local-date-time';
import type { OpenInvitation } from '@/lib/groups/get-members-view';
import { ActionForm, SubmitButton, type GroupAction } from './action-form';
import { RoleBadge } from './role-badge';

export type InvitationListProps = { slug: string; invitations: OpenInvitation[]; revoke: GroupAction };

/** Unanswered invitations; expired ones stay listed so they can be sent again. */
export function InvitationList({ slug, invitations, revoke }: InvitationListProps) {
  if (invitations.length === 0) return <p className="text-sm text-slate-600">No open invitations.</p>;
  return (
    <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white">
      {invitations.map((i) => (
        <li key={i.id} className="flex flex-wrap items-start justify-between gap-3 px-4 py-3">
          <div className="min-w-0 text-sm">
            <p className="break-all font-medium text-slate-900">{i.email} <RoleBadge role={i.role} /></p>
            <p className="text-slate-600">
              {i.status === 'expired' ? (
                <span className="font-medium text-amber-800">Expired <LocalDateTime iso={i.expiresAt} /></span>
              ) : (
                <>Valid until <LocalDateTime iso={i.expiresAt} /></>
              )}
              {i.invitedBy && <> · invited by {i.invitedBy}</>}
            </p>
            {i.status === 'expired' && <p className="text-xs text-slate-500">Invite the address again to send a fresh link.</p>}
          </div>
          <ActionForm action={revoke} className="flex flex-wrap items-center gap-2" label={`Withdraw the invitation to ${i.email}`}>
            <input type="hidden" name="slug" value={slug} />
            <input type="hidden" name="invitationId" value={i.id} />
            <SubmitButton variant="secondary" pendingText="Withdrawing…" className="px-3 py-1.5">Withdraw</SubmitButton>
          </ActionForm>
        </li>
      ))}
    </ul>
  );
}
