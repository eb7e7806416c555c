import { LocalDateTime } from '@/components/dataset/local-date-time';
import type { MembersView } from '@/lib/groups/get-members-view';
import { ActionForm, SubmitButton, type GroupAction } from './action-form';
import { RoleBadge } from './role-badge';

export type MemberListProps = {
  view: MembersView;
  viewerId: string;
  changeRole: GroupAction;
  remove: GroupAction;
};

const ROLES = ['owner', 'curator', 'member'] as const;

/** Members with their roles; owners get a role menu and a remove step per person, everyone a "leave" step. */
export function MemberList({ view, viewerId, changeRole, remove }: MemberListProps) {
  const { slug, name: groupName } = view.group;
  return (
    <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white">
      {view.members.map((m) => {
        const you = m.userId === viewerId;
        return (
          <li key={m.userId} className="flex flex-wrap items-start justify-between gap-3 px-4 py-3">
            <div className="min-w-0">
              <p className="font-medium text-slate-900">{m.name}{you && <span className="ml-2 text-xs font-normal text-slate-500">(you)</span>}</p>
              {m.email && <p className="break-all text-sm text-slate-600">{m.email}</p>}
              {m.joinedAt && <p className="text-xs text-slate-500">joined <LocalDateTime iso={m.joinedAt} withTime={false} /></p>}
            </div>
            <div className="flex flex-wrap items-start gap-2">
              {view.can.manageMembers ? (
                <ActionForm action={changeRole} className="flex flex-wrap items-center gap-2">
                  <input type="hidden" name="slug" value={slug} />
                  <input type="hidden" name="userId" value={m.userId} />
                  <label htmlFor={`role-${m.userId}`} className="sr-only">Role of {m.name}</label>
                  <select id={`role-${m.userId}`} name="role" defaultValue={m.role} className="rounded-md border border-slate-400 bg-white px-2 py-1.5 text-sm">
                    {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
                  </select>
                  <SubmitButton variant="secondary" pendingText="Saving…" className="px-3 py-1.5">Save role</SubmitButton>
                </ActionForm>
              ) : (
                <RoleBadge role={m.role} />
              )}
              {(view.can.manageMembers || you) && (
                <details className="group">
                  <summary className="cursor-pointer list-none rounded-md px-3 py-1.5 text-sm font-semibold text-copper-700 hover:bg-copper-50">
                    {you ? 'Leave…' : 'Remove…'}
                  </summary>
                  <ActionForm action={remove} className="mt-2 flex max-w-xs flex-col gap-2 rounded-md border border-red-200 bg-red-50 p-3 text-sm text-red-950">
                    <input type="hidden" name="slug" value={slug} />
                    <input type="hidden" name="userId" value={m.userId} />
                    <p>
                      {you
                        ? `You will no longer see ${groupName}'s drafts or deposit for it. An owner can invite you again.`
                        : `${m.name} will no longer see ${groupName}'s drafts or deposit for it. Their datasets stay with the group.`}
                    </p>
                    <SubmitButton pendingText="Removing…" className="bg-red-700 hover:bg-red-800">
                      {you ? `Leave ${groupName}` : `Remove ${m.name}`}
                    </SubmitButton>
                  </ActionForm>
                </details>
              )}
            </div>
          </li>
        );
      })}
    </ul>
  );
}
