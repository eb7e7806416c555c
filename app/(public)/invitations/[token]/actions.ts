'use server';

import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { acceptInvitation } from '@/lib/groups/accept-invitation';
import { declineInvitation } from '@/lib/groups/decline-invitation';
import { runAction, type ActionState } from '@/lib/http/action';

const tokenOf = (form: FormData) => String(form.get('token') ?? '');

/** Accept as the signed-in account; on success, to the group's members page with a welcome. */
export async function acceptInvitationAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const token = tokenOf(form);
  const result = await runAction(async () => acceptInvitation({ user: await currentUser(), token }));
  if (result?.ok && result.data) redirect(`/groups/${encodeURIComponent(result.data.groupSlug)}/members?welcome=1`);
  return result;
}

/** Decline with the link alone; the page then shows the declined invitation. */
export async function declineInvitationAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const token = tokenOf(form);
  const result = await runAction(async () => declineInvitation({ user: await currentUser(), token }));
  if (result?.ok) redirect(`/invitations/${encodeURIComponent(token)}`);
  return result;
}
