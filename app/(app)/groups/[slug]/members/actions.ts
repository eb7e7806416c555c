'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { changeMemberRole } from '@/lib/groups/change-role';
import { inviteMember } from '@/lib/groups/invite-member';
import { removeMember } from '@/lib/groups/remove-member';
import { revokeInvitation } from '@/lib/groups/revoke-invitation';
import { transferOwnership } from '@/lib/groups/transfer-ownership';
import { formValues, runAction, type ActionState } from '@/lib/http/action';

// Server actions of the members page; each one is checked again by its lib/groups operation, under the group lock.

async function actingUser(slug: string) {
  const user = await currentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(`/groups/${slug}/members`)}`);
  return user;
}

const slugOf = (form: FormData) => String(form.get('slug') ?? '');
const membersPath = (slug: string) => `/groups/${encodeURIComponent(slug)}/members`;

export async function inviteAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  const user = await actingUser(slug);
  const values = formValues(form, ['email', 'role']);
  const result = await runAction(() => inviteMember({ user, slug, input: values }), values);
  if (!result?.ok) return result;
  revalidatePath(membersPath(slug));
  const sent = result.data?.delivery === 'sent';
  const to = result.data?.invitation.email ?? values.email;
  return { ok: true, message: sent ? `Invitation sent to ${to}.` : `Invitation saved. The mail to ${to} goes out as soon as the mail server answers.` };
}

export async function revokeInvitationAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  const user = await actingUser(slug);
  const result = await runAction(() => revokeInvitation({ user, slug, invitationId: String(form.get('invitationId') ?? '') }));
  if (result?.ok) revalidatePath(membersPath(slug));
  return result?.ok ? { ok: true, message: 'Invitation withdrawn.' } : result;
}

export async function changeRoleAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  const user = await actingUser(slug);
  const result = await runAction(() => changeMemberRole({ user, slug, userId: String(form.get('userId') ?? ''), input: { role: form.get('role') } }));
  if (!result?.ok) return result;
  revalidatePath(membersPath(slug));
  return { ok: true, message: result.data?.changed ? `Now ${result.data.member.role}.` : 'No change.' };
}

export async function removeMemberAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  const user = await actingUser(slug);
  const result = await runAction(() => removeMember({ user, slug, userId: String(form.get('userId') ?? '') }));
  if (!result?.ok) return result;
  if (result.data?.left) redirect(`/groups?left=${encodeURIComponent(slug)}`);
  revalidatePath(membersPath(slug));
  return { ok: true, message: 'Removed from the group.' };
}

export async function transferOwnershipAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  const user = await actingUser(slug);
  const input = formValues(form, ['userId', 'formerOwnerRole']);
  const result = await runAction(() => transferOwnership({ user, slug, input }));
  if (!result?.ok) return result;
  redirect(`${membersPath(slug)}?transferred=${encodeURIComponent(result.data?.newOwner.userId ?? '')}`);
}
