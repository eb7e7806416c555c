// A throw-away invented lab with versions in each state, written straight into MariaDB (no DOIs needed here).
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { db } from '@/lib/db';
import { insertUser } from '@/lib/users/repo';

export type LabUser = { id: string; name: string; siteRole: 'admin' | 'user'; email: string };
export type ReviewLab = {
  groupId: string; slug: string; name: string; datasetId: string;
  owner: LabUser; curator: LabUser; member: LabUser; outsider: LabUser;
};

async function user(prefix: string, name: string): Promise<LabUser> {
  const email = `${prefix}-${randomBytes(5).toString('hex')}@tests.ohmstead.example`;
  const row = await insertUser({ email, name, passwordHash: null });
  return { id: row.id, name: row.name, siteRole: row.site_role, email: row.email };
}

export async function makeReviewLab(prefix = 'review'): Promise<ReviewLab> {
  const tag = randomBytes(4).toString('hex');
  const lab: ReviewLab = {
    groupId: randomUUID(), slug: `${prefix}-bench-${tag}`, name: `Fernhollow Review Bench ${tag} (invented)`, datasetId: randomUUID(),
    owner: await user(prefix, 'Maren Tolliver'), curator: await user(prefix, 'Oskar Pennywhistle'),
    member: await user(prefix, 'Liesl Damaris'), outsider: await user(prefix, 'Quill Harrowgate'),
  };
  await db()('groups').insert({ id: lab.groupId, slug: lab.slug, name: lab.name });
  await db()('memberships').insert([
    { group_id: lab.groupId, user_id: lab.owner.id, role: 'owner' },
    { group_id: lab.groupId, user_id: lab.curator.id, role: 'curator' },
    { group_id: lab.groupId, user_id: lab.member.id, role: 'member' },
  ]);
  await db()('datasets').insert({ id: lab.datasetId, group_id: lab.groupId, created_by: lab.member.id });
  return lab;
}

let nextNumber = 1;

/** A version of the lab's dataset in the given state; published ones may carry an embargo date (YYYY-MM-DD). */
export async function makeVersion(
  lab: ReviewLab, state: 'draft' | 'in_review' | 'published' | 'withdrawn', title: string, embargoUntil: string | null = null,
): Promise<string> {
  const id = randomUUID();
  await db()('dataset_versions').insert({
    id, dataset_id: lab.datasetId, version_number: nextNumber++, state, title, metadata: JSON.stringify({ title }),
    embargo_until: embargoUntil, created_by: lab.member.id, published_at: state === 'published' ? new Date() : null,
  });
  return id;
}

/** Removes everything the lab made: outbox jobs of its links, audit rows, events, versions, group and users. */
export async function removeReviewLab(lab: ReviewLab): Promise<void> {
  const versionIds: string[] = (await db()('dataset_versions').where('dataset_id', lab.datasetId).select('id')).map((r: { id: string }) => r.id);
  const linkIds: string[] = (await db()('reviewer_links').whereIn('version_id', versionIds).select('id')).map((r: { id: string }) => r.id);
  await db()('outbox').whereIn('aggregate_id', [...linkIds, ...versionIds]).delete();
  // Buckets as lib/rate-limit names them: limit name and the first 40 hex characters of SHA-256(key).
  const buckets = linkIds.map((id) => `review-mail-link:${createHash('sha256').update(id).digest('hex').slice(0, 40)}`);
  await db()('rate_limit_hits').whereIn('bucket', buckets).delete();
  await db()('audit_log').where('group_id', lab.groupId).delete();
  await db()('download_events').whereIn('version_id', versionIds).delete();
  await db()('datasets').where('id', lab.datasetId).delete();
  await db()('memberships').where('group_id', lab.groupId).delete();
  await db()('groups').where('id', lab.groupId).delete();
  await db()('users').whereIn('id', [lab.owner.id, lab.curator.id, lab.member.id, lab.outsider.id]).delete();
}

export async function closeDb(): Promise<void> {
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
}

/** The error a promise rejects with (fails the test if it resolves). */
export async function rejection(promise: Promise<unknown>): Promise<Error & { code?: string; status?: number; details?: { fieldErrors?: Record<string, string> } }> {
  const outcome = await promise.then(() => 'resolved' as const, (e: unknown) => e);
  if (outcome === 'resolved') throw new Error('expected a refusal, but the call succeeded');
  return outcome as Error & { code?: string; status?: number };
}
