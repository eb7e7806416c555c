// The version state machine against MariaDB and the DOI fake: every allowed and refused transition.
// Expected behaviour: product.md "Life of a dataset" and "Roles and access"; who may do what is lib/access/permissions.ts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { saveMetadata } from '@/lib/datasets/save-metadata';
import { createNewVersion } from '@/lib/publishing/create-new-version';
import { publishingOutboxHandlers } from '@/lib/publishing/outbox-handlers';
import { publishVersion } from '@/lib/publishing/publish-version';
import { returnToDraft } from '@/lib/publishing/return-to-draft';
import { submitVersion } from '@/lib/publishing/submit-version';
import { withdrawVersion } from '@/lib/publishing/withdraw-version';
import { addVerifiedFile, closeDb, completeRecord, inDays, makeDraft, makePubLab, rejection, removePubLab, type PubLab } from './fixtures';

let lab: PubLab;
const blobs: string[] = [];
const deps = { handlers: publishingOutboxHandlers() };

beforeAll(async () => {
  lab = await makePubLab();
});
afterAll(async () => {
  await removePubLab(lab, blobs);
  await closeDb();
});

async function auditActions(versionId: string): Promise<string[]> {
  const rows: { action: string }[] = await db()('audit_log').where({ target_id: versionId }).orderBy('id').select('action');
  return rows.map((r) => r.action);
}

describe('submit (draft → in review)', () => {
  it('lets a member submit, stores the requested embargo and audits it', async () => {
    const d = await makeDraft(lab, lab.member, 'Submit by member: ρ(T) of a copper wire');
    const result = await submitVersion({ user: lab.member, versionId: d.versionId, embargoUntil: inDays(180) }, deps);
    expect(result).toEqual({ versionId: d.versionId, state: 'in_review', requestedEmbargoUntil: inDays(180), notified: 2 });
    const row = await db()('dataset_versions').where('id', d.versionId).first('state', 'submitted_at', db().raw("DATE_FORMAT(requested_embargo_until, '%Y-%m-%d') as req"));
    expect(row.state).toBe('in_review');
    expect(row.req).toBe(inDays(180));
    expect(row.submitted_at).toBeInstanceOf(Date);
    expect(await auditActions(d.versionId)).toEqual(['version.submit']);
  });

  it('lets curators and owners submit too', async () => {
    for (const user of [lab.curator, lab.owner]) {
      const d = await makeDraft(lab, user, `Submit by ${user.name}`);
      expect((await submitVersion({ user, versionId: d.versionId }, deps)).state).toBe('in_review');
    }
  });

  it('hides a draft from outsiders and anonymous visitors (404) and refuses a site admin outside the group (403)', async () => {
    const d = await makeDraft(lab, lab.member, 'Submit refused for others');
    for (const user of [lab.outsider, null]) {
      const e = await rejection(submitVersion({ user, versionId: d.versionId }, deps));
      expect([e.status, e.code]).toEqual([404, 'not_found']);
    }
    const e = await rejection(submitVersion({ user: lab.admin, versionId: d.versionId }, deps));
    expect([e.status, e.code, e.message]).toEqual([403, 'forbidden', 'Your role does not allow you to submit this version for review.']);
    expect((await findVersionRow(d.versionId))?.state).toBe('draft');
  });

  it('refuses an incomplete record with the field list (422) and a second submission (403 wrong state)', async () => {
    const d = await makeDraft(lab, lab.member, 'Incomplete', { title: 'Incomplete', creators: [{ name: 'Wendel Ashgrove' }] });
    const e = await rejection(submitVersion({ user: lab.member, versionId: d.versionId }, deps));
    expect(e.status).toBe(422);
    expect(e.message).toBe('This version cannot be submitted for review until 2 fields are fixed: sample, measurement.');
    expect(Object.keys(e.details?.fieldErrors as object)).toEqual(['sample', 'measurement']);

    const ok = await makeDraft(lab, lab.member, 'Submitted twice');
    await submitVersion({ user: lab.member, versionId: ok.versionId }, deps);
    const again = await rejection(submitVersion({ user: lab.member, versionId: ok.versionId }, deps));
    expect([again.status, again.code]).toEqual([403, 'wrong_state']);
    expect(again.message).toBe('You cannot submit this version for review while this version is in review.');
  });

  it('refuses while an upload is unfinished (409), naming the file', async () => {
    const d = await makeDraft(lab, lab.member, 'Pending upload');
    await db()('files').insert({ id: crypto.randomUUID(), version_id: d.versionId, name: 'sweep-3.csv', size_bytes: 10, upload_state: 'pending' });
    const e = await rejection(submitVersion({ user: lab.member, versionId: d.versionId }, deps));
    expect([e.status, e.message]).toEqual([409, 'Finish or cancel 1 upload before the version is submitted: sweep-3.csv.']);
  });
});

describe('return to draft (in review → draft)', () => {
  it('lets a curator return it with a comment; the member may edit again', async () => {
    const d = await makeDraft(lab, lab.member, 'Returned with comment');
    await submitVersion({ user: lab.member, versionId: d.versionId }, deps);
    const r = await returnToDraft({ user: lab.curator, versionId: d.versionId, comment: '  Please add the sweep rate.  ' }, deps);
    expect(r).toEqual({ versionId: d.versionId, state: 'draft', comment: 'Please add the sweep rate.', notified: 1 });
    expect(await findVersionRow(d.versionId)).toMatchObject({ state: 'draft', review_comment: 'Please add the sweep rate.' });
    expect((await saveMetadata({ user: lab.member, versionId: d.versionId, record: completeRecord('Returned, edited') })).saved).toBe(true);
    expect(await auditActions(d.versionId)).toEqual(['version.submit', 'version.return']);
  });

  it('requires the comment (422), refuses members and admins (403), outsiders (404), and drafts (403)', async () => {
    const d = await makeDraft(lab, lab.member, 'Return refusals');
    const onDraft = await rejection(returnToDraft({ user: lab.owner, versionId: d.versionId, comment: 'x' }, deps));
    expect([onDraft.status, onDraft.code]).toEqual([403, 'wrong_state']);
    await submitVersion({ user: lab.member, versionId: d.versionId }, deps);
    const blank = await rejection(returnToDraft({ user: lab.owner, versionId: d.versionId, comment: '   ' }, deps));
    expect([blank.status, blank.details?.fieldErrors]).toEqual([422, { comment: 'Give a comment for the authors; it is required.' }]);
    for (const user of [lab.member, lab.admin]) expect((await rejection(returnToDraft({ user, versionId: d.versionId, comment: 'no' }, deps))).status).toBe(403);
    expect((await rejection(returnToDraft({ user: lab.outsider, versionId: d.versionId, comment: 'no' }, deps))).status).toBe(404);
    expect((await findVersionRow(d.versionId))?.state).toBe('in_review');
  });
});

describe('publish', () => {
  it('lets a curator publish a submitted version, keeping the requested embargo; published is immutable', async () => {
    const d = await makeDraft(lab, lab.member, 'Published with requested embargo');
    await submitVersion({ user: lab.member, versionId: d.versionId, embargoUntil: inDays(90) }, deps);
    const p = await publishVersion({ user: lab.curator, versionId: d.versionId }, deps);
    expect(p).toMatchObject({ state: 'published', doi: d.doi, doiState: 'findable', embargoUntil: inDays(90) });
    expect(await findVersionRow(d.versionId)).toMatchObject({ state: 'published', embargo_until: inDays(90), doi_state: 'findable' });
    const pub = await db()('version_publications').where('version_id', d.versionId).first();
    expect(pub).toMatchObject({ dataset_id: d.datasetId, approved_by: lab.curator.id });
    const edit = await rejection(saveMetadata({ user: lab.member, versionId: d.versionId, record: completeRecord('Changed after publication') }));
    expect([edit.status, edit.code]).toEqual([403, 'wrong_state']);
    expect(await auditActions(d.versionId)).toEqual(['version.submit', 'version.publish']);
  });

  it('lets an owner change the embargo (null: none) and a curator publish straight from draft, as the table allows', async () => {
    const a = await makeDraft(lab, lab.member, 'Owner drops embargo');
    await submitVersion({ user: lab.member, versionId: a.versionId, embargoUntil: inDays(90) }, deps);
    expect((await publishVersion({ user: lab.owner, versionId: a.versionId, embargoUntil: null }, deps)).embargoUntil).toBeNull();
    const b = await makeDraft(lab, lab.member, 'Curator publishes a draft');
    expect((await publishVersion({ user: lab.curator, versionId: b.versionId, embargoUntil: inDays(400) }, deps)).embargoUntil).toBe(inDays(400));
  });

  it('refuses members and site admins (403), outsiders and anonymous visitors (404), and a published version (403)', async () => {
    const d = await makeDraft(lab, lab.member, 'Publish refusals');
    await submitVersion({ user: lab.member, versionId: d.versionId }, deps);
    for (const user of [lab.member, lab.admin]) {
      const e = await rejection(publishVersion({ user, versionId: d.versionId }, deps));
      expect([e.status, e.message]).toEqual([403, 'Your role does not allow you to publish this version.']);
    }
    for (const user of [lab.outsider, null]) expect((await rejection(publishVersion({ user, versionId: d.versionId }, deps))).status).toBe(404);
    await publishVersion({ user: lab.curator, versionId: d.versionId }, deps);
    expect((await rejection(publishVersion({ user: lab.owner, versionId: d.versionId }, deps))).code).toBe('wrong_state');
  });

  it('refuses a record that fails the schema with the field list (422) and leaves it in review', async () => {
    const d = await makeDraft(lab, lab.member, 'Broken after submit');
    await submitVersion({ user: lab.member, versionId: d.versionId }, deps);
    // A record that passed at submission but not under today's schema (e.g. after a schema change).
    await db()('dataset_versions').where('id', d.versionId).update({ metadata: JSON.stringify({ ...completeRecord('Broken'), creators: [] }) });
    const e = await rejection(publishVersion({ user: lab.curator, versionId: d.versionId }, deps));
    expect([e.status, e.message]).toEqual([422, 'This version cannot be published until 1 field is fixed: creators.']);
    expect(Object.keys(e.details?.fieldErrors as object)).toEqual(['creators']);
    expect((await findVersionRow(d.versionId))?.state).toBe('in_review');
  });

  it('refuses embargo dates in the past or more than five years ahead (422), also a requested date that has passed', async () => {
    const d = await makeDraft(lab, lab.member, 'Embargo dates');
    const past = await rejection(submitVersion({ user: lab.member, versionId: d.versionId, embargoUntil: inDays(-1) }, deps));
    expect([past.status, past.message]).toEqual([422, expect.stringMatching(new RegExp(`^${inDays(-1)} is not after today\\. The embargo date must be after today`))]);
    expect((await findVersionRow(d.versionId))?.state).toBe('draft');
    await submitVersion({ user: lab.member, versionId: d.versionId, embargoUntil: inDays(10) }, deps);
    const far = await rejection(publishVersion({ user: lab.curator, versionId: d.versionId, embargoUntil: inDays(5 * 366 + 2) }, deps));
    expect([far.status, far.message]).toEqual([422, expect.stringMatching(/is more than 5 years ahead\. .*at most 5 years ahead/)]);
    // The requested day went by while the version waited for review (as if 11 days had passed).
    await db()('dataset_versions').where('id', d.versionId).update({ requested_embargo_until: inDays(-1) });
    const stale = await rejection(publishVersion({ user: lab.curator, versionId: d.versionId }, deps));
    expect([stale.status, Object.keys(stale.details?.fieldErrors as object)]).toEqual([422, ['embargoUntil']]);
    expect((await findVersionRow(d.versionId))?.state).toBe('in_review');
    expect((await publishVersion({ user: lab.curator, versionId: d.versionId, embargoUntil: inDays(20) }, deps)).embargoUntil).toBe(inDays(20));
  });

  it('gives exactly one publication when two stewards approve at once', async () => {
    const d = await makeDraft(lab, lab.member, 'Two approvals at once');
    await submitVersion({ user: lab.member, versionId: d.versionId }, deps);
    const results = await Promise.allSettled([
      publishVersion({ user: lab.curator, versionId: d.versionId }, deps),
      publishVersion({ user: lab.owner, versionId: d.versionId }, deps),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual(['fulfilled', 'rejected']);
    const loser = results.find((r) => r.status === 'rejected') as PromiseRejectedResult;
    expect(loser.reason).toMatchObject({ code: 'conflict', status: 409 });
    expect(String(loser.reason.message)).toMatch(/^This version is published now \(it was in review when you started\)/);
    expect(await db()('version_publications').where('version_id', d.versionId).count({ n: '*' }).first()).toEqual({ n: 1 });
    expect(await db()('outbox').where({ aggregate_id: d.versionId, topic: 'doi.register' }).count({ n: '*' }).first()).toEqual({ n: 1 });
    expect((await auditActions(d.versionId)).filter((a) => a === 'version.publish')).toHaveLength(1);
  });
});

describe('new version and withdraw', () => {
  it('copies metadata and file references into draft v2 with its own reserved DOI; only from the latest version', async () => {
    const d = await makeDraft(lab, lab.member, 'Versioned dataset');
    blobs.push(await addVerifiedFile(d.versionId, 'rt-cooling.csv', 2048), await addVerifiedFile(d.versionId, 'rt-warming.csv', 4096));
    await publishVersion({ user: lab.curator, versionId: d.versionId }, deps);
    const v2 = await createNewVersion({ user: lab.member, versionId: d.versionId });
    expect(v2).toMatchObject({ datasetId: d.datasetId, versionNumber: 2, doiState: 'reserved', fileCount: 2 });
    expect(v2.doi).not.toBe(d.doi);
    const row = await findVersionRow(v2.versionId);
    expect(row).toMatchObject({ state: 'draft', title: 'Versioned dataset', created_by: lab.member.id, concept_doi: d.conceptDoi });
    expect(row?.metadata).toEqual(completeRecord('Versioned dataset'));
    const files = await db()('files').where('version_id', v2.versionId).orderBy('name').select('name', 'sha256', 'size_bytes', 'upload_state');
    const originals = await db()('files').where('version_id', d.versionId).orderBy('name').select('name', 'sha256', 'size_bytes', 'upload_state');
    expect(files).toEqual(originals);

    const notLatest = await rejection(createNewVersion({ user: lab.member, versionId: d.versionId }));
    expect([notLatest.status, notLatest.message]).toEqual([403, 'A new version can only be started from the latest version of the dataset.']);
    const onDraft = await rejection(createNewVersion({ user: lab.member, versionId: v2.versionId }));
    expect([onDraft.status, onDraft.code]).toEqual([403, 'wrong_state']);
  });

  it('refuses outsiders (403) and anonymous visitors (401); two starts at once give one draft', async () => {
    const d = await makeDraft(lab, lab.member, 'Concurrent new versions');
    await publishVersion({ user: lab.owner, versionId: d.versionId }, deps);
    expect((await rejection(createNewVersion({ user: lab.outsider, versionId: d.versionId }))).status).toBe(403);
    expect((await rejection(createNewVersion({ user: null, versionId: d.versionId }))).status).toBe(401);
    const both = await Promise.allSettled([createNewVersion({ user: lab.member, versionId: d.versionId }), createNewVersion({ user: lab.curator, versionId: d.versionId })]);
    expect(both.map((r) => r.status).sort()).toEqual(['fulfilled', 'rejected']);
    expect((both.find((r) => r.status === 'rejected') as PromiseRejectedResult).reason).toMatchObject({ status: 409 });
    expect(await db()('dataset_versions').where('dataset_id', d.datasetId).count({ n: '*' }).first()).toEqual({ n: 2 });
  });

  it('lets a curator or site admin withdraw with a reason; members may not; withdrawn is final', async () => {
    const d = await makeDraft(lab, lab.member, 'Withdrawn dataset');
    await publishVersion({ user: lab.curator, versionId: d.versionId }, deps);
    const member = await rejection(withdrawVersion({ user: lab.member, versionId: d.versionId, reason: 'mine' }, deps));
    expect([member.status, member.message]).toEqual([403, 'Your role does not allow you to withdraw this version.']);
    const blank = await rejection(withdrawVersion({ user: lab.curator, versionId: d.versionId, reason: '' }, deps));
    expect(blank.status).toBe(422);
    const w = await withdrawVersion({ user: lab.admin, versionId: d.versionId, reason: 'Thermometer calibration error found' }, deps);
    expect(w).toMatchObject({ state: 'withdrawn', reason: 'Thermometer calibration error found' });
    expect(await findVersionRow(d.versionId)).toMatchObject({ state: 'withdrawn', withdrawal_reason: 'Thermometer calibration error found', doi_state: 'registered' });
    // Started one at a time: a second promise created up front could reject before it is awaited (unhandled).
    for (const op of [() => withdrawVersion({ user: lab.curator, versionId: d.versionId, reason: 'again' }, deps), () => createNewVersion({ user: lab.member, versionId: d.versionId })]) {
      expect((await rejection(op())).code).toBe('wrong_state');
    }
    expect(await auditActions(d.versionId)).toEqual(['version.publish', 'version.withdraw']);
  });
});
