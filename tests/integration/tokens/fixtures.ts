// A throw-away invented lab for the token tests: one group, a member with one draft, and an outsider.
import { randomBytes, randomUUID } from 'node:crypto';
import { db } from '@/lib/db';
import { insertUser } from '@/lib/users/repo';
import { uniqueEmail } from '@/tests/support/unique';

export type TokenLab = { groupId: string; member: { id: string }; outsider: { id: string }; draftVersionId: string; draftTitle: string };

export async function makeTokenLab(): Promise<TokenLab> {
  const tag = randomBytes(4).toString('hex');
  const member = await insertUser({ email: uniqueEmail('tokens'), name: 'Perrin Waddesdon', passwordHash: null });
  const outsider = await insertUser({ email: uniqueEmail('tokens'), name: 'Lisle Ambrose', passwordHash: null });
  const groupId = randomUUID();
  const datasetId = randomUUID();
  const draftVersionId = randomUUID();
  const draftTitle = `R(T) of a token-test wire ${tag}`;
  await db()('groups').insert({ id: groupId, slug: `token-bench-${tag}`, name: `Harrier Lane Token Bench ${tag} (invented)` });
  await db()('memberships').insert({ group_id: groupId, user_id: member.id, role: 'member' });
  await db()('datasets').insert({ id: datasetId, group_id: groupId, created_by: member.id });
  await db()('dataset_versions').insert({
    id: draftVersionId, dataset_id: datasetId, version_number: 1, state: 'draft', title: draftTitle,
    metadata: JSON.stringify({ title: draftTitle }), created_by: member.id,
  });
  return { groupId, member: { id: member.id }, outsider: { id: outsider.id }, draftVersionId, draftTitle };
}

export async function removeTokenLab(lab: TokenLab): Promise<void> {
  const users = [lab.member.id, lab.outsider.id];
  await db()('audit_log').whereIn('actor_user_id', users).delete();
  await db()('datasets').where({ group_id: lab.groupId }).delete();
  await db()('memberships').where({ group_id: lab.groupId }).delete();
  await db()('groups').where({ id: lab.groupId }).delete();
  await db()('users').whereIn('id', users).delete(); // api_tokens go with them (ON DELETE CASCADE)
}

/** Waits for the next fixed one-minute window when fewer than `marginMs` remain in this one. */
export async function awayFromWindowEdge(windowMs = 60_000, marginMs = 10_000): Promise<void> {
  const left = windowMs - (Date.now() % windowMs);
  if (left < marginMs) await new Promise((r) => setTimeout(r, left + 50));
}
