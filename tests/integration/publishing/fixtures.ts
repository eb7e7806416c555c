// A throw-away invented lab for the publishing tests, its drafts, and helpers to read the DOI fake and run jobs.
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { expect } from 'vitest';
import { db } from '@/lib/db';
import { createDataset } from '@/lib/datasets/create-dataset';
import { saveMetadata } from '@/lib/datasets/save-metadata';
import { processOutboxOnce, type OutboxHandlers } from '@/lib/outbox/process-outbox';
import type { ActingUser } from '@/lib/publishing/version-transitions';
import type { TransportDataset } from '@/lib/schema';
import { insertUser } from '@/lib/users/repo';
import { assertLoopback, doiAuthorization, requireEnv } from '@/tests/support/services';

export type LabUser = ActingUser & { email: string };
export type PubLab = {
  groupId: string; slug: string; name: string;
  owner: LabUser; curator: LabUser; member: LabUser; outsider: LabUser; admin: LabUser;
};

async function user(name: string, siteRole: 'admin' | 'user' = 'user'): Promise<LabUser> {
  const email = `publishing-${randomBytes(5).toString('hex')}@tests.ohmstead.example`;
  const row = await insertUser({ email, name, passwordHash: null, siteRole });
  return { id: row.id, name: row.name, siteRole: row.site_role, email: row.email };
}

export async function makePubLab(): Promise<PubLab> {
  const tag = randomBytes(4).toString('hex');
  const lab = {
    groupId: randomUUID(), slug: `pub-bench-${tag}`, name: `Saltmarsh Publishing Bench ${tag} (invented)`,
    owner: await user('Odile Brackenridge'), curator: await user('Tamsin Quillfeather'), member: await user('Wendel Ashgrove'),
    outsider: await user('Corin Halloway'), admin: await user('Ysolde Marrick', 'admin'),
  };
  await db()('groups').insert({ id: lab.groupId, slug: lab.slug, name: lab.name });
  await db()('memberships').insert([
    { group_id: lab.groupId, user_id: lab.owner.id, role: 'owner' },
    { group_id: lab.groupId, user_id: lab.curator.id, role: 'curator' },
    { group_id: lab.groupId, user_id: lab.member.id, role: 'member' },
  ]);
  return lab;
}

/** Removes the lab, its datasets (versions, files, publications cascade), their outbox jobs, blobs and draft DOIs. */
export async function removePubLab(lab: PubLab, blobs: string[] = []): Promise<void> {
  const versions: { id: string; doi: string | null; concept_doi: string | null }[] = await db()('dataset_versions as v')
    .join('datasets as d', 'd.id', 'v.dataset_id').where('d.group_id', lab.groupId).select('v.id', 'v.doi', 'd.concept_doi');
  for (const doi of new Set(versions.flatMap((v) => [v.doi, v.concept_doi]).filter((d): d is string => !!d))) {
    await doiFake('DELETE', `/dois/${encodeURIComponent(doi)}`); // only drafts go; registered DOIs stay, as at the agency
  }
  await db()('outbox').whereIn('aggregate_id', versions.map((v) => v.id)).delete();
  await db()('datasets').where('group_id', lab.groupId).delete();
  if (blobs.length) await db()('blobs').whereIn('sha256', blobs).delete();
  await db()('memberships').where('group_id', lab.groupId).delete();
  await db()('groups').where('id', lab.groupId).delete();
  await db()('users').whereIn('id', [lab.owner.id, lab.curator.id, lab.member.id, lab.outsider.id, lab.admin.id]).delete();
}

const FIXTURE = path.resolve(import.meta.dirname, '../../fixtures/transport/cu-wire-rt.meta.json');
/** The related paper of the fixture record (an invented DOI under the test prefix 10.99999). */
export const PAPER_DOI = '10.99999/ohmstead.demo.0042';

/** A complete record (tests/fixtures/transport/cu-wire-rt.meta.json) with a related paper and the given title. */
export function completeRecord(title: string): TransportDataset {
  const record = JSON.parse(readFileSync(FIXTURE, 'utf8')) as TransportDataset;
  return { ...record, title, relatedIdentifiers: [{ identifier: PAPER_DOI, identifierType: 'DOI', relationType: 'IsSupplementTo' }] };
}

/** The UTC calendar day `n` days from now (embargo dates that stay valid whenever the tests run). */
export function inDays(n: number, from: Date = new Date()): string {
  return new Date(from.getTime() + n * 86_400_000).toISOString().slice(0, 10);
}

export type Draft = { datasetId: string; versionId: string; doi: string; conceptDoi: string };

/** A draft created through createDataset (DOIs reserved at the fake) with a complete record saved by `author`. */
export async function makeDraft(lab: PubLab, author: LabUser, title: string, record: unknown = completeRecord(title)): Promise<Draft> {
  const created = await createDataset({ user: author, groupSlug: lab.slug, title: title.slice(0, 300) });
  const saved = await saveMetadata({ user: author, versionId: created.versionId, record });
  expect(saved.saved).toBe(true);
  return { datasetId: created.datasetId, versionId: created.versionId, doi: created.doi, conceptDoi: created.conceptDoi };
}

/** A verified file of the version whose content is an (invented) blob row; returns the blob's SHA-256. */
export async function addVerifiedFile(versionId: string, name: string, sizeBytes: number): Promise<string> {
  const sha256 = createHash('sha256').update(`${versionId}/${name}/${randomUUID()}`).digest('hex');
  await db()('blobs').insert({ sha256, size_bytes: sizeBytes, storage_key: `blobs/sha256/${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}` });
  await db()('files').insert({
    id: randomUUID(), version_id: versionId, name, role: 'raw', media_type: 'text/csv', size_bytes: sizeBytes, sha256, upload_state: 'verified',
    analysis_state: 'done', analysis_progress: 1,
  });
  return sha256;
}

type DoiDoc = { data?: { id: string; attributes: Record<string, unknown> }[] | { id: string; attributes: Record<string, unknown> } };

export async function doiFake(method: string, urlPath: string): Promise<{ status: number; body: DoiDoc | null }> {
  const api = assertLoopback(requireEnv('DOI_API_URL'), 'DOI API').origin;
  const res = await fetch(`${api}${urlPath}`, { method, headers: { Authorization: doiAuthorization() } });
  const text = await res.text();
  return { status: res.status, body: text ? (JSON.parse(text) as DoiDoc) : null };
}

/** One DOI's attributes at the fake, or null when it does not know the DOI. */
export async function fakeDoi(doi: string): Promise<Record<string, unknown> | null> {
  const { status, body } = await doiFake('GET', `/dois/${encodeURIComponent(doi)}`);
  if (status === 404) return null;
  if (status !== 200 || !body?.data || Array.isArray(body.data)) throw new Error(`DOI fake answered ${status} for ${doi}`);
  return body.data.attributes;
}

/** Every DOI the fake holds under our prefix whose landing URL is `url` (a duplicate would show up here). */
export async function fakeDoisWithUrl(url: string): Promise<string[]> {
  const { body } = await doiFake('GET', `/dois?prefix=${encodeURIComponent(requireEnv('DOI_PREFIX'))}`);
  const list = Array.isArray(body?.data) ? body.data : [];
  return list.filter((d) => d.attributes.url === url).map((d) => d.id);
}

/** The DataCite XML the fake stored with a DOI (sent base64 in attributes.xml). */
export function storedXml(attributes: Record<string, unknown> | null): string {
  if (typeof attributes?.xml !== 'string') throw new Error('the DOI fake holds no XML for this DOI');
  return Buffer.from(attributes.xml, 'base64').toString('utf8');
}

export type OutboxRowView = { id: number; topic: string; attempts: number; processed_at: Date | null; last_error: string | null; payload: unknown };

export async function jobsOf(versionId: string, topic: string): Promise<OutboxRowView[]> {
  const rows = await db()('outbox').where({ aggregate_id: versionId, topic }).orderBy('id').select('id', 'topic', 'attempts', 'processed_at', 'last_error', 'payload');
  return rows.map((r: OutboxRowView) => ({ ...r, id: Number(r.id), payload: typeof r.payload === 'string' ? JSON.parse(r.payload) : r.payload }));
}

/**
 * Makes the version's unfinished jobs due now (as if their retry time had come) and runs the outbox until they are
 * done. A worker running against the same database may take some of them; the end state is what counts.
 */
export async function drainJobs(versionId: string, handlers: OutboxHandlers, rounds = 5): Promise<void> {
  for (let i = 0; i < rounds; i++) {
    const open = db()('outbox').where('aggregate_id', versionId).whereIn('topic', Object.keys(handlers)).whereNull('processed_at');
    if (!(await open.clone().first('id'))) return;
    // Only jobs held for their creator or waiting after a failure: a job the worker has leased is left to it,
    // else both would run it (the lease is what keeps a mail from going out twice).
    await open.clone().where((w) => w.where('attempts', 0).orWhereNotNull('last_error'))
      .update({ next_attempt_at: db().raw('UTC_TIMESTAMP(3) - INTERVAL 1 SECOND') });
    await new Promise((resolve) => setTimeout(resolve, i === 0 ? 0 : 250));
    await processOutboxOnce(handlers, { limit: 100 });
  }
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

/** The error a promise rejects with (fails the test if it resolves). */
export async function rejection(promise: Promise<unknown>): Promise<Error & { code?: string; status?: number; details?: Record<string, unknown> }> {
  const outcome = await promise.then(() => 'resolved' as const, (e: unknown) => e);
  if (outcome === 'resolved') throw new Error('expected a refusal, but the call succeeded');
  return outcome as Error & { code?: string; status?: number };
}
