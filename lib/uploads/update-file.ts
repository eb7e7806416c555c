import 'server-only';
import { AppError } from '@/lib/errors';
import { validateWith } from '@/lib/validation/validate';
import schema from '@/schemas/api/update-file.schema.json';
import { toFileView, type FileView } from './list-files';
import { fileGone, loadFileFor } from './load-file';
import { findFileRow, updateFileRole, type FileRole } from './repo';

type UserLike = { id: string; siteRole: 'admin' | 'user' };

/** Changes a file's role (raw / processed / other) in a draft. */
export async function updateFile(args: { user: UserLike; fileId: string; input: unknown }): Promise<{ file: FileView }> {
  const { file } = await loadFileFor(args.fileId, args.user, 'edit');
  const parsed = validateWith<{ role: FileRole }>(schema, args.input);
  if (!parsed.ok) throw new AppError('validation_failed', 'The change has errors.', { fieldErrors: parsed.fieldErrors });
  await updateFileRole(file.id, parsed.value.role);
  const row = await findFileRow(file.id);
  if (!row) throw fileGone();
  return { file: toFileView(row) };
}
