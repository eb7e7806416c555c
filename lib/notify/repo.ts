import 'server-only';
import { db } from '@/lib/db';
import type { Recipient } from './mail-jobs';

// Who is told about a version: its group's stewards, or its authors. Disabled accounts get no mail.

/** The group's curators and owners, except `exceptUserId` (the person who acted). */
export async function listStewardRecipients(groupId: string, exceptUserId?: string): Promise<Recipient[]> {
  const q = db()('memberships as m').join('users as u', 'u.id', 'm.user_id')
    .where('m.group_id', groupId).whereIn('m.role', ['curator', 'owner']).whereNull('u.disabled_at')
    .orderBy('u.email').select('u.email', 'u.name');
  if (exceptUserId) q.whereNot('u.id', exceptUserId);
  return q;
}

/** The authors: whoever created the version and whoever created the dataset. */
export async function listAuthorRecipients(versionId: string): Promise<Recipient[]> {
  const ids = await db()('dataset_versions as v').join('datasets as d', 'd.id', 'v.dataset_id').where('v.id', versionId)
    .first('v.created_by as version_author', 'd.created_by as dataset_author');
  const userIds = [ids?.version_author, ids?.dataset_author].filter((x): x is string => typeof x === 'string');
  if (userIds.length === 0) return [];
  return db()('users').whereIn('id', userIds).whereNull('disabled_at').orderBy('email').select('email', 'name');
}
