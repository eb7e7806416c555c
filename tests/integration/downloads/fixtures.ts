// An invented lab with versions in each state, written straight to MariaDB, and their files put into the running
// s3rver under one unique prefix. Everything made here is removed by dropDownloadLabs().
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll } from 'vitest';
import yauzl from 'yauzl';
import { db } from '@/lib/db';
import type { PackageReply } from '@/lib/downloads/download-package';
import { PACKAGE_BUILD_TOPIC } from '@/lib/downloads/repo-package-builds';
import { createReviewerLink } from '@/lib/review/create-reviewer-link';
import { resolveReviewerLink, type ResolvedLink } from '@/lib/review/resolve-reviewer-link';
import { defaultStore, deletePrefix } from '@/lib/storage/objects';
import { putObject } from '@/lib/storage/put-object';
import { uniqueEmail } from '@/tests/support/unique';

export const MiB = 1024 * 1024;
/** A small ±B magnetoresistance table (invented) used as a payload file. */
export const RXX = 'B (T),Rxx (Ohm),T (K)\n-9.0,101.25,1.80\n0.0,98.50,1.80\n9.0,101.27,1.80\n';
export const anonymous = { kind: 'user' as const, user: null };

/** Writes a package's bytes to a fresh package.zip under `scratch` (for the bag verifier and zip readers). */
export function saveZip(scratch: string, bytes: Buffer): string {
  const file = path.join(mkdtempSync(path.join(scratch, 'zip-')), 'package.zip');
  writeFileSync(file, bytes);
  return file;
}
export const prefix = `test/downloads/${randomBytes(6).toString('hex')}/`;

export type LabUser = { id: string; siteRole: 'admin' | 'user'; name: string };
export type DownloadLab = {
  groupId: string; name: string; institution: string;
  owner: LabUser; member: LabUser; outsider: LabUser; admin: LabUser;
  datasetIds: string[]; versionIds: string[];
};
export type StoredFile = { id: string; name: string; bytes: Buffer; sha256: string; storageKey: string; mediaType: string };
export type FileSpec = { name: string; bytes: Buffer | string; mediaType?: string; stored?: boolean };
export type VersionSpec = { state: 'draft' | 'in_review' | 'published' | 'withdrawn'; embargoUntil?: string | null; files: FileSpec[] };

/** Invented people and institution; identifying() lists every string an anonymous copy must not contain. */
export const CREATORS = [
  { name: 'Ashcombe, Perrin', orcid: '0000-0000-2718-2810', affiliation: [{ name: 'Brackenmoor Polytechnic (invented)' }] },
  { name: 'Quenby Marchetti', affiliation: [{ name: 'Saltire Fen Observatory (invented)' }] },
];

const labs: DownloadLab[] = [];
const blobs = new Set<string>();
const sha256Hex = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

async function user(name: string, siteRole: 'admin' | 'user' = 'user'): Promise<LabUser> {
  const id = randomUUID();
  await db()('users').insert({ id, email: uniqueEmail('downloads'), name, site_role: siteRole, email_verified_at: new Date() });
  return { id, siteRole, name };
}

export async function makeDownloadLab(): Promise<DownloadLab> {
  const tag = randomBytes(4).toString('hex');
  const lab: DownloadLab = {
    groupId: randomUUID(), name: `Thornwick Download Test Lab ${tag}`, institution: `Gorsedale Institute ${tag} (invented)`,
    owner: await user('Hesper Lindqvist'), member: await user('Tamsin Okonkwo-Reyes'), outsider: await user('Ferris Aldane'),
    admin: await user('Rowan Ellery', 'admin'), datasetIds: [], versionIds: [],
  };
  await db()('groups').insert({ id: lab.groupId, slug: `download-test-${tag}`, name: lab.name, institution: lab.institution });
  await db()('memberships').insert([
    { group_id: lab.groupId, user_id: lab.owner.id, role: 'owner' },
    { group_id: lab.groupId, user_id: lab.member.id, role: 'member' },
  ]);
  labs.push(lab);
  return lab;
}

/** A complete record (schema-valid: tests/fixtures/transport/cu-wire-rt.meta.json) with this file's invented creators. */
export function completeRecord(title: string): Record<string, unknown> {
  const base = JSON.parse(readFileSync(path.resolve(import.meta.dirname, '../../fixtures/transport/cu-wire-rt.meta.json'), 'utf8'));
  return { ...base, title, description: 'Four-wire resistance of an annealed copper wire on cooling; invented test data.', creators: CREATORS };
}

const testDoi = () => `10.80123/ohm.d${randomBytes(4).toString('hex')}`;

/** One dataset with one version in the given state; its files are verified rows whose bytes are put into s3rver. */
export async function makeVersion(lab: DownloadLab, spec: VersionSpec): Promise<{ versionId: string; doi: string; files: StoredFile[] }> {
  const datasetId = randomUUID();
  const versionId = randomUUID();
  const doi = testDoi();
  const title = `Download test ${spec.state} ${randomBytes(3).toString('hex')}: R(T) of an invented copper wire`;
  await db()('datasets').insert({ id: datasetId, group_id: lab.groupId, concept_doi: testDoi(), created_by: lab.member.id });
  const published = spec.state === 'published' || spec.state === 'withdrawn';
  await db()('dataset_versions').insert({
    id: versionId, dataset_id: datasetId, version_number: 1, state: spec.state, title, metadata: JSON.stringify(completeRecord(title)),
    doi, doi_state: published ? 'findable' : 'reserved', embargo_until: spec.embargoUntil ?? null,
    published_at: published ? new Date('2026-11-20T09:30:00Z') : null, withdrawn_at: spec.state === 'withdrawn' ? new Date() : null,
    withdrawal_reason: spec.state === 'withdrawn' ? 'Calibration error found in the thermometer.' : null, created_by: lab.member.id,
  });
  lab.datasetIds.push(datasetId);
  lab.versionIds.push(versionId);
  const files: StoredFile[] = [];
  for (const f of spec.files) {
    const bytes = Buffer.isBuffer(f.bytes) ? f.bytes : Buffer.from(f.bytes, 'utf8');
    const sha256 = sha256Hex(bytes);
    const storageKey = `${prefix}${sha256}`;
    if (!(await db()('blobs').where({ sha256 }).first('sha256'))) {
      await db()('blobs').insert({ sha256, size_bytes: bytes.length, storage_key: storageKey });
      blobs.add(sha256);
    }
    if (f.stored !== false) await putObject(defaultStore(), storageKey, bytes);
    const id = randomUUID();
    const mediaType = f.mediaType ?? 'text/csv';
    await db()('files').insert({ id, version_id: versionId, name: f.name, role: 'raw', media_type: mediaType, size_bytes: bytes.length, sha256, upload_state: 'verified' });
    files.push({ id, name: f.name, bytes, sha256, storageKey, mediaType });
  }
  return { versionId, doi, files };
}

/** A live reviewer link for the version, created by the lab's member and resolved as the routes resolve it. */
export async function reviewerLink(lab: DownloadLab, versionId: string, anonymous: boolean): Promise<{ link: ResolvedLink; token: string }> {
  const created = await createReviewerLink({ user: lab.member, versionId, input: { label: `Referee ${anonymous ? 'A' : 'B'}`, anonymous } });
  const link = await resolveReviewerLink(created.token);
  if (!link.ok) throw new Error(`the new link did not resolve: ${link.reason}`);
  return { link, token: created.token };
}

/** Every string that would identify the depositors: creator names and their parts, ORCID iDs, affiliations, the group. */
export function identifying(lab: DownloadLab): string[] {
  const out = new Set([lab.name, lab.institution, lab.member.name, lab.owner.name]);
  for (const c of CREATORS) {
    out.add(c.name);
    for (const part of c.name.split(/[\s,]+/)) if (part.length > 3) out.add(part);
    if (c.orcid) out.add(c.orcid);
    for (const a of c.affiliation) out.add(a.name);
  }
  return [...out];
}

/** A download request as the route hands it on. */
export const request = (headers: Record<string, string> = {}, method = 'GET') => ({ method, headers: new Headers(headers) });

/** Every entry of a zip file on disk, by name, with its bytes. */
export async function zipEntries(file: string): Promise<{ name: string; bytes: Buffer }[]> {
  const zip = await yauzl.openPromise(file, { autoClose: false });
  const out: { name: string; bytes: Buffer }[] = [];
  for await (const entry of zip.eachEntry()) {
    const chunks: Buffer[] = [];
    for await (const c of await zip.openReadStreamPromise(entry)) chunks.push(c as Buffer);
    out.push({ name: entry.fileName, bytes: Buffer.concat(chunks) });
  }
  zip.close();
  return out;
}

/** Reads a web stream to the end. */
export async function collect(stream: ReadableStream<Uint8Array>): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  const reader = stream.getReader();
  for (let r = await reader.read(); !r.done; r = await reader.read()) chunks.push(r.value);
  return Buffer.concat(chunks);
}

export async function dropDownloadLabs(): Promise<void> {
  for (const lab of labs.splice(0)) {
    if (lab.versionIds.length) {
      await db()('download_events').whereIn('version_id', lab.versionIds).delete();
      await db()('outbox').where('topic', PACKAGE_BUILD_TOPIC).whereIn('aggregate_id', lab.versionIds).delete();
      await db()('files').whereIn('version_id', lab.versionIds).delete();
      for (const v of lab.versionIds) await deletePrefix(defaultStore(), `packages/${v}/`);
    }
    await db()('audit_log').where('group_id', lab.groupId).delete();
    if (lab.datasetIds.length) await db()('datasets').whereIn('id', lab.datasetIds).delete();
    await db()('memberships').where('group_id', lab.groupId).delete();
    await db()('groups').where('id', lab.groupId).delete();
    await db()('users').whereIn('id', [lab.owner.id, lab.member.id, lab.outsider.id, lab.admin.id]).delete();
  }
  for (const sha of blobs) if (!(await db()('files').where('sha256', sha).first('id'))) await db()('blobs').where('sha256', sha).delete();
  blobs.clear();
  await deletePrefix(defaultStore(), prefix);
}

/** A streamed package reply's body. */
export const streamOf = (reply: PackageReply) => reply.body as ReadableStream<Uint8Array>;

/**
 * The hooks of a package test file: a download lab made before its tests (handed to `onLab`), and after them every
 * lab removed, the database closed and the scratch folder deleted. Returns the scratch folder (made now).
 */
export function downloadLabForFile(scratchPrefix: string, onLab: (lab: DownloadLab) => void): string {
  const scratch = mkdtempSync(path.join(tmpdir(), scratchPrefix));
  beforeAll(async () => {
    onLab(await makeDownloadLab());
  });
  afterAll(async () => {
    await dropDownloadLabs();
    await closeDb();
    rmSync(scratch, { recursive: true, force: true });
  });
  return scratch;
}

export async function closeDb(): Promise<void> {
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
}
