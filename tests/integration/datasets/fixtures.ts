// A throw-away invented lab for the dataset tests: one group, a user per role, an outsider and a site admin.
import net from 'node:net';
import { randomBytes, randomUUID } from 'node:crypto';
import { db } from '@/lib/db';
import type { DepositUser } from '@/lib/datasets/create-dataset';
import { insertUser } from '@/lib/users/repo';
import { assertLoopback, doiAuthorization, requireEnv } from '@/tests/support/services';
import { uniqueEmail } from '@/tests/support/unique';

export type TestLab = {
  groupId: string; slug: string; name: string;
  owner: DepositUser; curator: DepositUser; member: DepositUser; outsider: DepositUser; admin: DepositUser;
};

async function user(name: string, siteRole: 'admin' | 'user' = 'user'): Promise<DepositUser> {
  const row = await insertUser({ email: uniqueEmail('datasets'), name, passwordHash: null, siteRole });
  return { id: row.id, name: row.name, siteRole: row.site_role };
}

export async function makeTestLab(): Promise<TestLab> {
  const tag = randomBytes(4).toString('hex');
  const lab = {
    groupId: randomUUID(), slug: `test-bench-${tag}`, name: `Quarry Lane Test Bench ${tag} (invented)`,
    owner: await user('Sela Marchbank'), curator: await user('Ivo Thornquist'), member: await user('Pim Ostrander'),
    outsider: await user('Rhea Coldwater'), admin: await user('Bram Ellesmere', 'admin'),
  };
  await db()('groups').insert({ id: lab.groupId, slug: lab.slug, name: lab.name });
  await db()('memberships').insert([
    { group_id: lab.groupId, user_id: lab.owner.id, role: 'owner' },
    { group_id: lab.groupId, user_id: lab.curator.id, role: 'curator' },
    { group_id: lab.groupId, user_id: lab.member.id, role: 'member' },
  ]);
  return lab;
}

/** Removes the lab, its datasets, their outbox jobs and their draft DOIs at the fake. */
export async function removeTestLab(lab: TestLab): Promise<void> {
  const versions: { id: string; doi: string | null; concept_doi: string | null }[] = await db()('dataset_versions as v')
    .join('datasets as d', 'd.id', 'v.dataset_id').where('d.group_id', lab.groupId).select('v.id', 'v.doi', 'd.concept_doi');
  // Jobs first, so no worker reserves a DOI after the fake's copy is deleted.
  await db()('outbox').whereIn('aggregate_id', versions.map((v) => v.id)).delete();
  await db()('datasets').where('group_id', lab.groupId).delete();
  for (const doi of new Set(versions.flatMap((v) => [v.doi, v.concept_doi]).filter((d): d is string => !!d))) {
    await doiFake('DELETE', `/dois/${encodeURIComponent(doi)}`);
  }
  await db()('memberships').where('group_id', lab.groupId).delete();
  await db()('groups').where('id', lab.groupId).delete();
  await db()('users').whereIn('id', [lab.owner.id, lab.curator.id, lab.member.id, lab.outsider.id, lab.admin.id]).delete();
}

type DoiDoc = { data?: { id: string; attributes: Record<string, unknown> }[] | { id: string; attributes: Record<string, unknown> } };

/** Asks the DOI fake directly (HTTP Basic with the repository's credentials). */
export async function doiFake(method: string, path: string): Promise<{ status: number; body: DoiDoc | null }> {
  const api = assertLoopback(requireEnv('DOI_API_URL'), 'DOI API').origin;
  const res = await fetch(`${api}${path}`, { method, headers: { Authorization: doiAuthorization() } });
  const text = await res.text();
  return { status: res.status, body: text ? (JSON.parse(text) as DoiDoc) : null };
}

/** One DOI's record at the fake, or null when the fake does not know it. */
export async function fakeDoiRecord(doi: string): Promise<Record<string, unknown> | null> {
  const { status, body } = await doiFake('GET', `/dois/${encodeURIComponent(doi)}`);
  if (status === 404) return null;
  if (status !== 200 || !body?.data || Array.isArray(body.data)) throw new Error(`DOI fake answered ${status} for ${doi}`);
  return body.data.attributes;
}

/** A loopback URL where nothing listens: a port the OS just handed out and took back. */
export async function closedPortUrl(): Promise<string> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return `http://127.0.0.1:${port}`;
}

export async function closeDb(): Promise<void> {
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
}
