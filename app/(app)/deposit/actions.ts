'use server';

import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { createDataset, type CreatedDataset } from '@/lib/datasets/create-dataset';
import { formValues, runAction, type ActionState } from '@/lib/http/action';

/** "Start a dataset": a draft version 1 in the chosen group, then on to its workspace. */
export async function startDatasetAction(_prev: ActionState<CreatedDataset>, form: FormData): Promise<ActionState<CreatedDataset>> {
  const user = await currentUser();
  if (!user) redirect('/sign-in?callbackUrl=%2Fdeposit');
  const values = formValues(form, ['group', 'title']);
  const result = await runAction(() => createDataset({ user, groupSlug: values.group, title: values.title }), values);
  if (result?.ok && result.data) redirect(`/deposit/${result.data.versionId}`);
  return result;
}
