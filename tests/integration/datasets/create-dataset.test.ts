// createDataset against real MariaDB and the DOI fake. Expected behaviour: issue 4 (create a dataset)
// and product.md "Life of a dataset" (a draft DOI is reserved when a dataset is created).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { createDataset, parseCreateDatasetBody } from '@/lib/datasets/create-dataset';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { doiClient } from '@/lib/doi/client';
import { AppError } from '@/lib/errors';
import { listOutboxRows } from '@/lib/outbox/repo';
import { requireEnv } from '@/tests/support/services';
import { closeDb, closedPortUrl, fakeDoiRecord, makeTestLab, removeTestLab, type TestLab } from './fixtures';

let lab: TestLab;
const prefix = requireEnv('DOI_PREFIX');
const doiPattern = new RegExp(`^${prefix.replace('.', '\\.')}/ohm\\.[0-9a-hjkmnp-tv-z]{4}-[0-9a-hjkmnp-tv-z]{4}$`);

beforeAll(async () => {
  lab = await makeTestLab();
});
afterAll(async () => {
  await removeTestLab(lab);
  await closeDb();
});

async function refusal(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

async function countRows(table: string, where: Record<string, string>): Promise<number> {
  const row = await db()(table).where(where).count({ n: '*' }).first();
  return Number(row?.n);
}

describe('createDataset', () => {
  it('creates draft version 1 with both DOIs reserved as drafts at the DOI fake', async () => {
    const title = 'Four-wire ρ(T) of a tin whisker, 1.5–10 K';
    const created = await createDataset({ user: lab.member, groupSlug: lab.slug, title: `  ${title}\n` });
    expect(created).toMatchObject({ versionNumber: 1, doiState: 'reserved' });
    expect(created.doi).toMatch(doiPattern);
    expect(created.conceptDoi).toMatch(doiPattern);
    expect(created.conceptDoi).not.toBe(created.doi);

    const version = await findVersionRow(created.versionId);
    expect(version).toMatchObject({
      dataset_id: created.datasetId, version_number: 1, state: 'draft', title, doi: created.doi, doi_state: 'reserved',
      concept_doi: created.conceptDoi, group_id: lab.groupId, created_by: lab.member.id,
    });
    expect(version?.metadata).toEqual({ title, creators: [{ name: 'Pim Ostrander' }] });

    for (const doi of [created.doi, created.conceptDoi]) {
      const remote = await fakeDoiRecord(doi);
      expect(remote).toMatchObject({ doi, state: 'draft', titles: [{ title }], types: { resourceTypeGeneral: 'Dataset' } });
    }

    const jobs = await listOutboxRows('doi.reserve', created.versionId);
    expect(jobs).toHaveLength(1);
    expect(jobs[0]).toMatchObject({ payload: { versionId: created.versionId }, attempts: 1, lastError: null });
    expect(jobs[0]!.processedAt).toBeInstanceOf(Date);

    const audit = await db()('audit_log').where({ action: 'dataset.create', target_id: created.datasetId });
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ actor_kind: 'user', actor_user_id: lab.member.id, group_id: lab.groupId, target_type: 'dataset' });
  });

  it('lets owners, curators and site admins outside the group start datasets too', async () => {
    for (const user of [lab.owner, lab.curator, lab.admin]) {
      const created = await createDataset({ user, groupSlug: lab.slug, title: `Sheet resistance check by ${user.name}` });
      expect((await findVersionRow(created.versionId))?.created_by).toBe(user.id);
    }
  });

  it('refuses a signed-in user outside the group (403) and stores nothing', async () => {
    const before = await countRows('datasets', { group_id: lab.groupId });
    const error = await refusal(createDataset({ user: lab.outsider, groupSlug: lab.slug, title: 'Not my lab' }));
    expect(error.code).toBe('forbidden');
    expect(error.status).toBe(403);
    expect(error.message).toBe(`Only members, curators and owners of ${lab.name} can start a dataset there.`);
    expect(await countRows('datasets', { group_id: lab.groupId })).toBe(before);
  });

  it('answers 404 for a group that does not exist', async () => {
    const error = await refusal(createDataset({ user: lab.admin, groupSlug: 'no-such-group-anywhere', title: 'Lost' }));
    expect(error.status).toBe(404);
    expect(error.message).toBe('There is no group "no-such-group-anywhere".');
  });

  it.each([
    ['an empty title', '', 'Give the dataset a title.'],
    ['a blank title', '   \t ', 'Give the dataset a title.'],
    ['a title of 301 characters', 'ρ'.repeat(301), 'Keep the title to 300 characters or fewer (this one has 301).'],
  ])('refuses %s with a field error (422) and stores nothing', async (_label, title, message) => {
    const before = await countRows('datasets', { group_id: lab.groupId });
    const error = await refusal(createDataset({ user: lab.member, groupSlug: lab.slug, title }));
    expect(error.status).toBe(422);
    expect(error.details?.fieldErrors).toEqual({ title: message });
    expect(await countRows('datasets', { group_id: lab.groupId })).toBe(before);
  });

  it('checks the API body against schemas/api/create-dataset.schema.json', () => {
    const problems = (body: unknown) => {
      try {
        parseCreateDatasetBody(body);
        return 'accepted';
      } catch (e) {
        return [(e as AppError).status, (e as AppError).message, (e as AppError).details?.fieldErrors];
      }
    };
    expect(parseCreateDatasetBody({ group: 'larkspur-cryogenic', title: ' Nb wire ' })).toEqual({ group: 'larkspur-cryogenic', title: 'Nb wire' });
    expect(problems([])).toEqual([422, 'Send a JSON object with "group" (the group\'s slug) and "title".', undefined]);
    expect(problems({ group: 'larkspur-cryogenic' })).toEqual([422, 'Please correct the highlighted fields.', { title: 'This field is required.' }]);
    expect(problems({ group: 7, title: 'x' })).toEqual([422, 'Please correct the highlighted fields.', { group: 'This field must be a string.' }]);
    expect(problems({ group: 'g', title: 'x', colour: 'copper' })).toEqual([422, 'Please correct the highlighted fields.', { '(record)': 'Unknown field "colour".' }]);
  });

  it('accepts a title of exactly 300 characters (counted in code points)', async () => {
    const title = 'ρ'.repeat(300);
    const created = await createDataset({ user: lab.member, groupSlug: lab.slug, title });
    expect((await findVersionRow(created.versionId))?.title).toBe(title);
  });

  it('still creates the dataset when the DOI service is down, leaving the reservation to the outbox', async () => {
    const closed = await closedPortUrl();
    const created = await createDataset(
      { user: lab.member, groupSlug: lab.slug, title: 'Hall series of an oxide film while the agency is down' },
      { doi: doiClient({ apiUrl: closed }) },
    );
    expect(created.doiState).toBe('none');
    expect(created.doi).toMatch(doiPattern);
    const version = await findVersionRow(created.versionId);
    expect(version).toMatchObject({ state: 'draft', doi: created.doi, doi_state: 'none' });
    expect(await fakeDoiRecord(created.doi)).toBeNull();
    expect(await fakeDoiRecord(created.conceptDoi)).toBeNull();

    const [job] = await listOutboxRows('doi.reserve', created.versionId);
    expect(job).toMatchObject({ attempts: 1, processedAt: null });
    expect(job!.lastError).toContain(`The DOI registration service at ${closed} is unreachable (ECONNREFUSED).`);
    // First retry 10 s after the failed try (lib/outbox/backoff.ts); DATETIME keeps whole seconds.
    const { now } = (await db().raw('SELECT UTC_TIMESTAMP() AS now'))[0][0] as { now: Date };
    const waitS = (job!.nextAttemptAt!.getTime() - now.getTime()) / 1000;
    expect(waitS).toBeGreaterThanOrEqual(8);
    expect(waitS).toBeLessThanOrEqual(11);
  });
});
