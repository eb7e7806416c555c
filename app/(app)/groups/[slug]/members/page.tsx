import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { GroupNav } from '@/components/groups/group-nav';
import { InvitationList } from '@/components/groups/invitation-list';
import { InviteForm } from '@/components/groups/invite-form';
import { MemberList } from '@/components/groups/member-list';
import { StorageBar } from '@/components/groups/storage-bar';
import { TransferOwnershipPanel } from '@/components/groups/transfer-ownership-panel';
import { Notice } from '@/components/ui/notice';
import { PageTitle } from '@/components/ui/page-title';
import { AppError } from '@/lib/errors';
import { getMembersView, type MembersView } from '@/lib/groups/get-members-view';
import { requireSignedIn } from '../../../_auth/require-signed-in';
import { changeRoleAction, inviteAction, removeMemberAction, revokeInvitationAction, transferOwnershipAction } from './actions';

export const dynamic = 'force-dynamic';
export const metadata: Metadata = { title: 'Members' };

type Props = { params: Promise<{ slug: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

async function loadView(user: Parameters<typeof getMembersView>[0]['user'], slug: string): Promise<MembersView> {
  try {
    return await getMembersView({ user, slug });
  } catch (error) {
    if (error instanceof AppError && error.code === 'not_found') notFound();
    throw error;
  }
}

export default async function MembersPage({ params, searchParams }: Props) {
  const { slug } = await params;
  const query = await searchParams;
  const user = await requireSignedIn(`/groups/${slug}/members`);
  const view = await loadView(user, slug);
  const { group } = view;

  if (view.access !== 'full') {
    return (
      <div className="mx-auto max-w-xl">
        <PageTitle>{group.name}: members</PageTitle>
        <Notice tone="info" title="For members of the group">
          Addresses, invitations and roles are managed here by the group itself. You can see who belongs to {group.name} on its{' '}
          <Link href={`/groups/${group.slug}`} className="text-copper-700 underline">group page</Link>; to join, ask one of its owners or curators to invite you.
        </Notice>
      </div>
    );
  }

  const transferTo = one(query.transferTo);
  const stepDownTo = one(query.stepDownTo) === 'member' ? 'member' : 'curator';
  const candidates = view.members.filter((m) => m.userId !== user.id);
  const chosenMember = view.can.transferOwnership && transferTo ? candidates.find((m) => m.userId === transferTo) : undefined;
  // Only ids and flags come from the query; names shown are looked up, so a crafted link cannot put words on the page.
  const transferred = view.members.find((m) => m.userId === one(query.transferred) && m.role === 'owner');
  const welcome = one(query.welcome) === '1' && view.viewerRole;

  return (
    <div className="flex flex-col gap-8">
      <div>
        <PageTitle lead={view.viewerRole ? `You are ${view.viewerRole === 'owner' ? 'an' : 'a'} ${view.viewerRole} of this group.` : 'You see this group as site admin.'}>
          {group.name}
        </PageTitle>
        <GroupNav slug={group.slug} current="members" showMembers showAudit={view.can.viewAudit} />
        {(welcome || transferred) && (
          <div className="mt-4">
            {welcome && <Notice tone="success" title={`Welcome to ${group.name}`}>You joined as {welcome}. Datasets for the group start on the Deposit page.</Notice>}
            {transferred && <Notice tone="success">Ownership transferred to {transferred.name}.</Notice>}
          </div>
        )}
      </div>

      {view.storage && <StorageBar storage={view.storage} groupName={group.name} />}

      <section aria-labelledby="members-heading">
        <h2 id="members-heading" className="mb-1 text-lg font-semibold">Members ({view.members.length})</h2>
        <p className="mb-3 text-sm text-slate-600">
          {view.can.manageMembers
            ? 'Owners change roles and remove members. A group always keeps at least one owner.'
            : 'Only owners change roles and remove members. You may leave the group yourself.'}
        </p>
        <MemberList view={view} viewerId={user.id} changeRole={changeRoleAction} remove={removeMemberAction} />
      </section>

      {view.can.invite && (
        <section aria-labelledby="invite-heading" className="rounded-lg border border-slate-200 bg-white p-6">
          <h2 id="invite-heading" className="text-lg font-semibold">Invite someone</h2>
          <p className="mb-4 mt-1 text-sm text-slate-600">
            We e-mail a link that is valid for 14 days. Inviting the same address again replaces the earlier link.
          </p>
          <InviteForm action={inviteAction} slug={group.slug} roles={view.invitableRoles} />
          <h3 className="mb-2 mt-6 font-semibold">Open invitations</h3>
          <InvitationList slug={group.slug} invitations={view.invitations} revoke={revokeInvitationAction} />
        </section>
      )}

      {view.can.transferOwnership && (
        <section aria-labelledby="transfer-heading" className="rounded-lg border border-slate-200 bg-white p-6">
          <h2 id="transfer-heading" className="text-lg font-semibold">Transfer ownership</h2>
          <p className="mb-4 mt-1 text-sm text-slate-600">Hand the group to another member and step down in one go, e.g. when you move to another lab.</p>
          <TransferOwnershipPanel
            slug={group.slug}
            groupName={group.name}
            candidates={candidates}
            chosen={chosenMember ? { member: chosenMember, stepDownTo } : null}
            transfer={transferOwnershipAction}
          />
        </section>
      )}
    </div>
  );
}
