// saveMetadata, getVersionView and listDrafts against real MariaDB. Expected behaviour: issue 4
// (put metadata); who may do what: the permission table in lib/access/permissions.ts; field messages and
// paths: lib/schema/validate-transport-dataset.ts; the complete record: tests/fixtures/transport/cu-wire-rt.meta.json.
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { createDataset, type CreatedDataset, type DepositUser } from '@/lib/datasets/create-dataset';
import { getVersionView } from '@/lib/datasets/get-version-view';
import { listDrafts } from '@/lib/datasets/list-drafts';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { MAX_METADATA_BYTES, needsFixingError, saveMetadata } from '@/lib/datasets/save-metadata';
import completeRecord from '@/tests/fixtures/transport/cu-wire-rt.meta.json';
import { closeDb, makeTestLab, removeTestLab, type TestLab } from './fixtures';

let lab: TestLab;
const blobs: string[] = [];

beforeAll(async () => {
  lab = await makeTestLab();
});
afterAll(async () => {
  await removeTestLab(lab);
  await db()('blobs').whereIn('sha256', blobs).delete();
  await closeDb();
});

const draft = (title: string): Promise<CreatedDataset> => createDataset({ user: lab.member, groupSlug: lab.slug, title });

async function refusal(promise: Promise<unknown>): Promise<{ status: number; code: string; message: string }> {
  const error = (await promise.then(() => undefined, (e: unknown) => e)) as { status: number; code: string; message: string } | undefined;
  expect(error?.status).toBeTypeOf('number');
  return error!;
}

/** A file row as part B's upload path leaves it (verified, with its blob), written directly for these tests. */
async function addFile(versionId: string, name: string, state: { upload: 'verified' | 'pending'; analysis: 'none' | 'done' }): Promise<string> {
  const sha256 = createHash('sha256').update(randomBytes(16)).digest('hex');
  if (state.upload === 'verified') {
    blobs.push(sha256);
    await db()('blobs').insert({ sha256, size_bytes: 2048, storage_key: `blobs/sha256/${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}` });
  }
  const id = randomUUID();
  await db()('files').insert({
    id, version_id: versionId, name, role: 'raw', size_bytes: 2048, sha256: state.upload === 'verified' ? sha256 : null,
    upload_state: state.upload, analysis_state: state.analysis, analysis_progress: state.analysis === 'done' ? 1 : 0, created_by: lab.member.id,
  });
  return id;
}

const storedMetadata = async (versionId: string) => (await findVersionRow(versionId))?.metadata;

describe('saveMetadata', () => {
  it('stores a complete record, sets the title column and the change time', async () => {
    const { versionId } = await draft('Copper wire, to be described');
    await db()('dataset_versions').where({ id: versionId }).update({ updated_at: new Date('2026-01-01T00:00:00Z') });
    const result = await saveMetadata({ user: lab.curator, versionId, record: completeRecord });
    expect(result).toEqual({ saved: true, complete: true, errors: [], invalid: [] });
    expect(needsFixingError(result)).toBeNull();
    const row = await findVersionRow(versionId);
    expect(row?.metadata).toEqual(completeRecord);
    expect(row?.title).toBe('R(T) of annealed copper wire LCL-Cu-W07, 2–300 K');
    expect(Date.now() - row!.updated_at.getTime()).toBeLessThan(60_000);
  });

  it('keeps an invalid draft exactly as sent and reports the wrong values by field path (the API answers 422)', async () => {
    const { versionId } = await draft('Nb wire transition, half described');
    const record = {
      title: 'Nb wire transition near 9 K', creators: [{ name: 'Pim Ostrander' }],
      sample: { geometry: { diameter: { value: -1, unit: 'mm' } } },
      measurement: { excitation: { frequency: { value: 13.7, unit: 'parsec' } } },
    };
    const result = await saveMetadata({ user: lab.member, versionId, record });
    expect(await storedMetadata(versionId)).toEqual(record);
    expect(result.complete).toBe(false);
    expect(result.invalid.map((e) => [e.path, e.message])).toEqual([
      ['sample.geometry.diameter.value', 'Diameter must be greater than 0.'],
      ['measurement.excitation.frequency.unit', 'Excitation frequency unit must be one of: Hz, kHz.'],
    ]);
    expect(result.errors.map((e) => e.path)).toEqual([
      'sample.name', 'sample.geometry.diameter.value', 'measurement.quantity', 'measurement.excitation.type', 'measurement.excitation.frequency.unit',
    ]);
    const error = needsFixingError(result)!;
    expect(error.status).toBe(422);
    expect(error.message).toBe('Saved as draft, but 2 fields need fixing.');
    expect(error.details).toEqual({
      saved: true,
      fieldErrors: {
        'sample.geometry.diameter.value': 'Diameter must be greater than 0.',
        'measurement.excitation.frequency.unit': 'Excitation frequency unit must be one of: Hz, kHz.',
      },
      errors: result.errors,
    });
  });

  it('answers 200 for a draft that is only incomplete, listing what is missing', async () => {
    const { versionId } = await draft('Only a title so far');
    const result = await saveMetadata({ user: lab.member, versionId, record: { title: 'Only a title so far' } });
    expect(result.invalid).toEqual([]);
    expect(needsFixingError(result)).toBeNull();
    expect(result.errors.map((e) => [e.path, e.keyword])).toEqual([['creators', 'required'], ['sample', 'required'], ['measurement', 'required']]);
  });

  it.each([
    ['a list', [completeRecord]],
    ['a string', 'R(T) of copper'],
    ['null', null],
    ['a number', 42],
  ])('refuses a body that is %s (422) and changes nothing', async (what, record) => {
    const { versionId } = await draft(`Body check: ${what}`);
    const before = await findVersionRow(versionId);
    const error = await refusal(saveMetadata({ user: lab.member, versionId, record }));
    expect(error).toMatchObject({ status: 422, code: 'validation_failed' });
    expect(error.message).toBe(`The metadata must be a JSON object (the dataset record); this was ${what}. Nothing was saved.`);
    expect(await findVersionRow(versionId)).toEqual(before);
  });

  it('refuses a record over 1 MiB (413) and changes nothing', async () => {
    const { versionId } = await draft('Too much metadata');
    const record = { title: 'Too much', description: 'x'.repeat(MAX_METADATA_BYTES) };
    const error = await refusal(saveMetadata({ user: lab.member, versionId, record }));
    expect(error).toMatchObject({ status: 413, code: 'payload_too_large' });
    const bytes = Buffer.byteLength(JSON.stringify(record));
    expect(bytes).toBe(MAX_METADATA_BYTES + 37); // {"title":"Too much","description":""} (37 bytes) around the padding
    expect(error.message).toBe(`The metadata record is ${bytes} bytes, over the limit of 1048576 bytes (1.00 MiB). Put large tables in files. Nothing was saved.`);
    expect((await findVersionRow(versionId))?.title).toBe('Too much metadata');
  });

  it('refuses a version in review (403), someone outside the group (404) and the site admin (403)', async () => {
    const { versionId } = await draft('Submitted already');
    const record = { title: 'Changed after submission' };
    await db()('dataset_versions').where({ id: versionId }).update({ state: 'in_review' });
    expect(await refusal(saveMetadata({ user: lab.member, versionId, record }))).toMatchObject({
      status: 403, code: 'wrong_state', message: 'You cannot edit this version while this version is in review.',
    });
    await db()('dataset_versions').where({ id: versionId }).update({ state: 'draft' });
    expect(await refusal(saveMetadata({ user: lab.outsider, versionId, record }))).toMatchObject({ status: 404, code: 'not_found' });
    expect(await refusal(saveMetadata({ user: null, versionId, record }))).toMatchObject({ status: 404 });
    expect(await refusal(saveMetadata({ user: lab.admin, versionId, record }))).toMatchObject({
      status: 403, message: 'Your role does not allow you to edit this version.',
    });
    expect((await findVersionRow(versionId))?.title).toBe('Submitted already');
  });

  it('queues the analysis again when columns, sample or measurement change, not for other fields', async () => {
    const { versionId } = await draft('Requeue check');
    await saveMetadata({ user: lab.member, versionId, record: completeRecord });
    const fileId = await addFile(versionId, 'cu-wire-rt.csv', { upload: 'verified', analysis: 'done' });
    const analysisState = async () => (await db()('files').where({ id: fileId }).first('analysis_state')).analysis_state;

    await saveMetadata({ user: lab.member, versionId, record: { ...completeRecord, description: 'Cooling run 2.' } });
    expect(await analysisState()).toBe('done');
    // Same sample, keys in another order: not a change.
    const { name, ...restOfSample } = completeRecord.sample;
    await saveMetadata({ user: lab.member, versionId, record: { ...completeRecord, sample: { ...restOfSample, name } } });
    expect(await analysisState()).toBe('done');

    const thinner = { ...completeRecord.sample, geometry: { ...completeRecord.sample.geometry, diameter: { value: 0.05, unit: 'mm' } } };
    await saveMetadata({ user: lab.member, versionId, record: { ...completeRecord, sample: thinner } });
    // Queued again; the stack's worker may take it at once, and fails it here because this blob has no stored bytes.
    expect(['queued', 'running', 'failed']).toContain(await analysisState());
  });
});

describe('getVersionView', () => {
  it('shows a draft to its group with the record, its validation, files and allowed actions', async () => {
    const created = await draft('Viewed draft');
    const fileId = await addFile(created.versionId, 'rho.dat', { upload: 'verified', analysis: 'none' });
    const view = await getVersionView({ user: lab.member, versionId: created.versionId });
    expect(view.version).toMatchObject({
      id: created.versionId, datasetId: created.datasetId, versionNumber: 1, state: 'draft', title: 'Viewed draft', doi: created.doi,
      doiState: 'reserved', conceptDoi: created.conceptDoi, group: { slug: lab.slug, name: lab.name },
      metadata: { title: 'Viewed draft', creators: [{ name: 'Pim Ostrander' }] },
    });
    expect(view.version.updatedAt).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.000Z$/);
    expect(view.validation).toEqual({
      complete: false,
      errors: [
        { path: 'sample', keyword: 'required', message: 'Sample is required.' },
        { path: 'measurement', keyword: 'required', message: 'Measurement is required.' },
      ],
    });
    expect(view.files).toHaveLength(1);
    expect(view.files[0]).toMatchObject({ id: fileId, name: 'rho.dat', role: 'raw', sizeBytes: 2048, uploadState: 'verified', analysisState: 'none' });
    expect(view.allowedActions).toEqual(['view_metadata', 'view_curves', 'download_files', 'edit', 'submit', 'manage_links', 'delete_draft']);

    const curator = await getVersionView({ user: lab.curator, versionId: created.versionId });
    expect(curator.allowedActions).toEqual([
      'view_metadata', 'view_curves', 'download_files', 'edit', 'submit', 'publish', 'manage_links', 'view_access_log', 'invite_members', 'delete_draft',
    ]);
    const admin = await getVersionView({ user: lab.admin, versionId: created.versionId });
    expect(admin.allowedActions).toEqual(['view_metadata', 'view_curves', 'download_files', 'view_access_log', 'manage_members', 'invite_members']);
  });

  it('hides a draft from everyone outside the group (404), and unknown ids look the same', async () => {
    const { versionId } = await draft('Hidden draft');
    for (const user of [lab.outsider, null] as (DepositUser | null)[]) {
      expect(await refusal(getVersionView({ user, versionId }))).toMatchObject({
        status: 404, message: 'We could not find this dataset version, or you do not have access to it.',
      });
    }
    expect(await refusal(getVersionView({ user: lab.member, versionId: randomUUID() }))).toMatchObject({ status: 404 });
    expect(await refusal(getVersionView({ user: lab.member, versionId: 'not-a-uuid' }))).toMatchObject({ status: 404 });
  });
});

describe('listDrafts', () => {
  it("lists the drafts of the user's groups, most recently changed first, counting verified files only", async () => {
    const other = await makeTestLab();
    try {
      const member = other.member;
      const a = await createDataset({ user: member, groupSlug: other.slug, title: 'Older draft' });
      const b = await createDataset({ user: other.owner, groupSlug: other.slug, title: 'Newer draft by the owner' });
      const c = await createDataset({ user: member, groupSlug: other.slug, title: 'Submitted, so not a draft' });
      await db()('dataset_versions').where({ id: a.versionId }).update({ updated_at: new Date('2026-11-01T08:00:00Z') });
      await db()('dataset_versions').where({ id: b.versionId }).update({ updated_at: new Date('2026-11-02T09:30:00Z') });
      await db()('dataset_versions').where({ id: c.versionId }).update({ state: 'in_review' });
      await addFile(a.versionId, 'run1.csv', { upload: 'verified', analysis: 'done' });
      await addFile(a.versionId, 'run2.csv', { upload: 'pending', analysis: 'none' });

      expect(await listDrafts(member)).toEqual([
        { versionId: b.versionId, datasetId: b.datasetId, title: 'Newer draft by the owner', versionNumber: 1, groupSlug: other.slug, groupName: other.name, updatedAt: '2026-11-02T09:30:00.000Z', fileCount: 0 },
        { versionId: a.versionId, datasetId: a.datasetId, title: 'Older draft', versionNumber: 1, groupSlug: other.slug, groupName: other.name, updatedAt: '2026-11-01T08:00:00.000Z', fileCount: 1 },
      ]);
      expect(await listDrafts(other.outsider)).toEqual([]);
      expect(await listDrafts(other.admin)).toEqual([]); // site admins see drafts on request, not in their own list
    } finally {
      await removeTestLab(other);
    }
  });
});
