'use server';

import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { createGroup } from '@/lib/groups/create-group';
import { formValues, runAction, type ActionState } from '@/lib/http/action';

/** "Create the group": the signed-in user becomes its owner, then on to its members page to invite people. */
export async function createGroupAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const user = await currentUser();
  if (!user) redirect('/sign-in?callbackUrl=%2Fgroups%2Fnew');
  const values = formValues(form, ['name', 'slug', 'institution', 'description']);
  const result = await runAction(() => createGroup({ user, input: values }), values);
  if (result?.ok && result.data) redirect(`/groups/${result.data.slug}/members`);
  return result;
}
