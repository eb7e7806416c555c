import type { Metadata } from 'next';
import Link from 'next/link';
import type { ReactNode } from 'react';
import { LocalDateTime } from '@/components/dataset/local-date-time';
import { ActionForm, SubmitButton } from '@/components/groups/action-form';
import { EmailSignInButton, SignOutToSwitch } from '@/components/groups/invitation-sign-in';
import { Notice } from '@/components/ui/notice';
import { PageTitle } from '@/components/ui/page-title';
import { currentUser } from '@/lib/auth/session';
import { getInvitation } from '@/lib/groups/get-invitation';
import { ROLE_DUTIES, ROLE_WORDS } from '@/lib/groups/group-access';
import { acceptInvitationAction, declineInvitationAction } from './actions';

export const dynamic = 'force-dynamic';
// The token is in the address: keep it out of Referer headers and search engines.
export const metadata: Metadata = { title: 'Invitation', referrer: 'no-referrer', robots: { index: false, follow: false } };

type Props = { params: Promise<{ token: string }> };

function Closed({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="mx-auto max-w-xl">
      <PageTitle>{title}</PageTitle>
      <div className="rounded-lg border border-slate-200 bg-white p-6 text-slate-700">{children}</div>
    </div>
  );
}

export default async function InvitationPage({ params }: Props) {
  const { token } = await params;
  const user = await currentUser();
  const inv = await getInvitation({ user, token });
  const here = `/invitations/${encodeURIComponent(token)}`;

  if (inv.status === 'not_found') {
    return (
      <Closed title="This invitation link is not valid">
        <p>It may have been replaced by a newer invitation, or withdrawn by the group. Check that the whole link was copied, or ask the group to invite you again.</p>
        <p className="mt-4"><Link href="/groups" className="text-copper-700 underline">See all groups</Link></p>
      </Closed>
    );
  }
  const group = <Link href={`/groups/${inv.groupSlug}`} className="text-copper-700 underline">{inv.groupName}</Link>;
  if (inv.status === 'expired') {
    return (
      <Closed title="This invitation has expired">
        <p>The invitation to join {group} as {ROLE_WORDS[inv.role]} was valid until <LocalDateTime iso={inv.expiresAt} />.</p>
        <p className="mt-2">Ask {inv.invitedBy ?? 'an owner or curator of the group'} to invite you again; the new mail carries a fresh link.</p>
      </Closed>
    );
  }
  if (inv.status === 'declined') {
    return <Closed title="Invitation declined"><p>You declined the invitation to join {group}. Nothing else happens. If you change your mind, ask the group to invite you again.</p></Closed>;
  }
  if (inv.status === 'accepted') {
    const member = inv.viewer.kind === 'invitee' && inv.viewer.memberAs;
    return (
      <Closed title="Invitation accepted">
        <p>This invitation to join {group} has been accepted.</p>
        {member && <p className="mt-4"><Link href={`/groups/${inv.groupSlug}/members`} className="font-semibold text-copper-700 underline">Go to the group’s members</Link></p>}
      </Closed>
    );
  }

  return (
    <div className="mx-auto max-w-2xl">
      <PageTitle lead={`${inv.invitedBy ?? 'The group'} invited ${inv.email} to join as ${ROLE_WORDS[inv.role]}.`}>Join {inv.groupName}?</PageTitle>
      <div className="flex flex-col gap-5 rounded-lg border border-slate-200 bg-white p-6">
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="text-slate-500">Group</dt><dd>{group}</dd>
          <dt className="text-slate-500">Role</dt><dd>{inv.role}: {ROLE_DUTIES[inv.role]}</dd>
          <dt className="text-slate-500">Invited address</dt><dd className="break-all">{inv.email}</dd>
          <dt className="text-slate-500">Valid until</dt><dd><LocalDateTime iso={inv.expiresAt} /></dd>
        </dl>

        {inv.viewer.kind === 'anonymous' && (
          <div className="flex flex-col gap-3 border-t border-slate-100 pt-4">
            <p className="text-sm text-slate-700">To accept, sign in with <strong className="break-all">{inv.email}</strong>. A sign-in link by e-mail creates your account if you have none.</p>
            <div className="flex flex-wrap gap-2">
              <EmailSignInButton email={inv.email} callbackUrl={here} />
              <Link href={`/sign-in?callbackUrl=${encodeURIComponent(here)}`} className="rounded-md border border-slate-300 bg-white px-4 py-2 text-sm font-semibold text-slate-800 hover:bg-slate-100">Sign in with a password</Link>
            </div>
          </div>
        )}
        {inv.viewer.kind === 'other' && (
          <div className="flex flex-col gap-3 border-t border-slate-100 pt-4">
            <Notice tone="caution" title="Signed in with another address">
              You are signed in as <span className="break-all">{inv.viewer.email}</span>, but this invitation is for <span className="break-all">{inv.email}</span>. Only that account can accept it: sign out, then sign in with {inv.email}.
            </Notice>
            <div><SignOutToSwitch callbackUrl={here} /></div>
          </div>
        )}

        <div className="flex flex-wrap items-start gap-3 border-t border-slate-100 pt-4">
          {inv.viewer.kind === 'invitee' && (
            <ActionForm action={acceptInvitationAction} label="Accept the invitation">
              <input type="hidden" name="token" value={token} />
              {inv.viewer.memberAs && <p className="mb-2 text-sm text-slate-600">You are already {ROLE_WORDS[inv.viewer.memberAs]} of {inv.groupName}; accepting keeps that role.</p>}
              <SubmitButton pendingText="Joining…">Accept and join {inv.groupName}</SubmitButton>
            </ActionForm>
          )}
          <ActionForm action={declineInvitationAction} label="Decline the invitation">
            <input type="hidden" name="token" value={token} />
            <SubmitButton variant="secondary" pendingText="Declining…">Decline</SubmitButton>
          </ActionForm>
        </div>
        <p className="text-xs text-slate-500">Declining needs no account. If you did not expect this invitation, decline it or simply ignore it.</p>
      </div>
    </div>
  );
}
