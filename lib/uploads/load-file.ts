import 'server-only';
import type { Action } from '@/lib/access';
import { AppError } from '@/lib/errors';
import { hiddenAs } from '@/lib/datasets/hidden-as';
import { requireVersionAction, type VersionContext } from '@/lib/datasets/version-access';
import { findFileRow, type FileRow } from './repo';

type UserLike = { id: string; siteRole: 'admin' | 'user' } | null;

const NOT_FOUND = 'We could not find this file, or you do not have access to it.';

/** A file and its version, once the caller may do `action` on that version; unknown ids are 404 like hidden ones. */
export async function loadFileFor(fileId: string, user: UserLike, action: Action): Promise<{ file: FileRow; ctx: VersionContext }> {
  const file = /^[0-9a-f-]{36}$/i.test(fileId) ? await findFileRow(fileId) : undefined;
  if (!file) throw new AppError('not_found', NOT_FOUND);
  const ctx = await requireVersionAction(file.version_id, user, action).catch(hiddenAs(NOT_FOUND));
  return { file, ctx };
}

export function fileGone(): AppError {
  return new AppError('not_found', NOT_FOUND);
}
