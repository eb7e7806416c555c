// An invented lab with datasets in every state, written straight to the database (the page reads; publishing is
// tested elsewhere), and files whose stored analysis is the real summary of a transport fixture.
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Actor } from '@/lib/access';
import { db } from '@/lib/db';
import type { TransportDatasetDraft } from '@/lib/schema';
import { bytesFromBuffer } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';
import { uniqueEmail } from '@/tests/support/unique';

const FIXTURES = path.resolve(import.meta.dirname, '../../fixtures/transport');

export const fixtureMeta = (name: string) => JSON.parse(readFileSync(path.join(FIXTURES, name), 'utf8')) as TransportDatasetDraft;

export type LabUser = { id: string; siteRole: 'admin' | 'user'; name: string };
export type LandingLab = {
  groupId: string; slug: string; name: string;
  owner: LabUser; member: LabUser; outsider: LabUser; admin: LabUser;
  datasetIds: string[];
};

const labs: LandingLab[] = [];
/** Blob rows this file inserted (a blob that was there before is never removed). */
const ownBlobs = new Set<string>();

async function user(name: string, siteRole: 'admin' | 'user' = 'user'): Promise<LabUser> {
  const id = randomUUID();
  await db()('users').insert({ id, email: uniqueEmail('landing'), name, site_role: siteRole, email_verified_at: new Date() });
  return { id, siteRole, name };
}

export async function makeLandingLab(): Promise<LandingLab> {
  const tag = randomBytes(4).toString('hex');
  const lab: LandingLab = {
    groupId: randomUUID(), slug: `landing-test-${tag}`, name: `Fernhollow Landing Test Lab ${tag} (invented)`,
    owner: await user('Wren Halloway'), member: await user('Ludo Fairweather'), outsider: await user('Maelis Dunmore'),
    admin: await user('Corrin Blackwood', 'admin'), datasetIds: [],
  };
  await db()('groups').insert({ id: lab.groupId, slug: lab.slug, name: lab.name, institution: 'Meridian Transport Consortium (invented)' });
  await db()('memberships').insert([
    { group_id: lab.groupId, user_id: lab.owner.id, role: 'owner' },
    { group_id: lab.groupId, user_id: lab.member.id, role: 'member' },
  ]);
  labs.push(lab);
  return lab;
}

/** A test DOI under the dev prefix; the random part keeps the unique index happy across runs. */
export const testDoi = () => `10.80123/ohm.t${randomBytes(3).toString('hex')}`;

export async function insertDataset(lab: LandingLab): Promise<{ datasetId: string; conceptDoi: string }> {
  const datasetId = randomUUID();
  const conceptDoi = testDoi();
  await db()('datasets').insert({ id: datasetId, group_id: lab.groupId, concept_doi: conceptDoi, created_by: lab.owner.id });
  lab.datasetIds.push(datasetId);
  return { datasetId, conceptDoi };
}

export type VersionSpec = {
  number: number;
  state: 'draft' | 'in_review' | 'published' | 'withdrawn';
  metadata: Record<string, unknown>;
  doi?: string | null;
  embargoUntil?: string | null;
  publishedAt?: Date | null;
  withdrawnAt?: Date | null;
  withdrawalReason?: string | null;
};

export async function insertVersion(datasetId: string, lab: LandingLab, spec: VersionSpec): Promise<{ versionId: string; doi: string | null }> {
  const versionId = randomUUID();
  const doi = spec.doi === undefined ? testDoi() : spec.doi;
  await db()('dataset_versions').insert({
    id: versionId, dataset_id: datasetId, version_number: spec.number, state: spec.state, title: String(spec.metadata.title ?? 'Untitled'),
    metadata: JSON.stringify(spec.metadata), doi, doi_state: spec.state === 'published' || spec.state === 'withdrawn' ? 'findable' : 'reserved',
    embargo_until: spec.embargoUntil ?? null, published_at: spec.publishedAt ?? null, withdrawn_at: spec.withdrawnAt ?? null,
    withdrawal_reason: spec.withdrawalReason ?? null, created_by: lab.owner.id,
  });
  return { versionId, doi };
}

/** A verified file holding a fixture's bytes (blob row only: the page never reads the object), analysed for real. */
export async function insertAnalysedFile(versionId: string, fixture: string, metadata: TransportDatasetDraft): Promise<string> {
  const bytes = readFileSync(path.join(FIXTURES, fixture));
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const summary = await summariseFile(bytesFromBuffer(bytes), { metadata, fileName: fixture });
  if (!(await db()('blobs').where({ sha256 }).first('sha256'))) {
    await db()('blobs').insert({ sha256, size_bytes: bytes.length, storage_key: `blobs/sha256/${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}` });
    ownBlobs.add(sha256);
  }
  const fileId = randomUUID();
  await db()('files').insert({
    id: fileId, version_id: versionId, name: fixture, role: 'raw', media_type: 'text/csv', size_bytes: bytes.length, sha256,
    upload_state: 'verified', analysis_state: 'done', analysis_progress: 1, analysis: JSON.stringify(summary),
  });
  return fileId;
}

export const anonymous: Actor = { kind: 'anonymous' };
export const asUser = (u: LabUser, groupRole?: 'owner' | 'curator' | 'member'): Actor =>
  ({ kind: 'user', userId: u.id, siteRole: u.siteRole, ...(groupRole ? { groupRole } : {}) });
export const reviewer = (versionId: string, opts: { anonymous?: boolean; expiresAt?: Date; revokedAt?: Date | null } = {}): Actor => ({
  kind: 'reviewer',
  link: { versionId, anonymous: opts.anonymous ?? false, expiresAt: opts.expiresAt ?? new Date(Date.UTC(2030, 0, 1)), revokedAt: opts.revokedAt ?? null },
});

/** Removes every lab made here: files, datasets (versions cascade), memberships, group, users. */
export async function dropLandingLabs(): Promise<void> {
  for (const lab of labs.splice(0)) {
    const versionIds = lab.datasetIds.length ? await db()('dataset_versions').whereIn('dataset_id', lab.datasetIds).pluck('id') : [];
    if (versionIds.length) await db()('files').whereIn('version_id', versionIds).delete();
    if (lab.datasetIds.length) await db()('datasets').whereIn('id', lab.datasetIds).delete();
    await db()('memberships').where('group_id', lab.groupId).delete();
    await db()('groups').where('id', lab.groupId).delete();
    await db()('users').whereIn('id', [lab.owner.id, lab.member.id, lab.outsider.id, lab.admin.id]).delete();
  }
}

export async function dropOwnBlobs(): Promise<void> {
  for (const sha of ownBlobs) {
    if (!(await db()('files').where('sha256', sha).first('id'))) await db()('blobs').where('sha256', sha).delete();
  }
  ownBlobs.clear();
}

export async function closeDb(): Promise<void> {
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
}
