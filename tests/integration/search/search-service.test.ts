// The search index follows publications and withdrawals through the outbox log, and a rebuilt index (a restarted
// instance) holds what was published while it was down. Real MariaDB; the lab and its datasets are invented.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { createNewVersion } from '@/lib/publishing/create-new-version';
import { publishVersion } from '@/lib/publishing/publish-version';
import { withdrawVersion } from '@/lib/publishing/withdraw-version';
import { SEARCH_CHANGED_TOPIC } from '@/lib/search/repo';
import { CATCH_UP_INTERVAL_MS, forgetSearchIndex, searchIndexHealth, searchIndexStatus, searchPublished } from '@/lib/search/search-service';
import { closeDb, makeDraft, makePubLab, removePubLab, type PubLab } from '../publishing/fixtures';

let lab: PubLab;
const noJobs = { handlers: {} }; // DOI registration is not under test here; the jobs stay queued and are removed with the lab

beforeAll(async () => {
  lab = await makePubLab();
});

afterAll(async () => {
  forgetSearchIndex();
  await removePubLab(lab);
  await closeDb();
});

const titles = async (q: string, extra: Record<string, unknown> = {}) =>
  (await searchPublished({ q, group: [lab.slug], ...extra })).hits.map((h) => [h.doc.title, h.doc.versionNumber]);

describe('search index kept current from the outbox', () => {
  it('tells /api/health how the index stands without building it or waiting for it', async () => {
    forgetSearchIndex();
    expect(searchIndexHealth()).toEqual({ state: 'not-started' });
    const status = searchIndexStatus(); // the first search (or the server's start) begins the build
    expect(searchIndexHealth()).toEqual({ state: 'building' });
    const built = await status;
    expect(searchIndexHealth()).toMatchObject({ state: 'ready', versions: built.versions, cursor: built.cursor, builtAt: built.builtAt });
    const { caughtUpSecondsAgo } = searchIndexHealth() as { caughtUpSecondsAgo: number };
    expect(caughtUpSecondsAgo).toBeGreaterThanOrEqual(0);
    expect(caughtUpSecondsAgo).toBeLessThan(60);
  });

  it('finds a version once published, follows a new version, and drops a withdrawn one', async () => {
    forgetSearchIndex();
    await searchIndexStatus(); // built before the publication: the change must arrive through the log
    const d = await makeDraft(lab, lab.member, 'Indexed copper wire quillfeather');
    expect(await titles('quillfeather')).toEqual([]); // drafts are never indexed
    await publishVersion({ user: lab.owner, versionId: d.versionId }, noJobs);
    expect(await titles('quillfeather')).toEqual([['Indexed copper wire quillfeather', 1]]);

    const v2 = await createNewVersion({ user: lab.curator, versionId: d.versionId });
    expect(await titles('quillfeather')).toEqual([['Indexed copper wire quillfeather', 1]]); // v2 is a draft
    await publishVersion({ user: lab.owner, versionId: v2.versionId }, noJobs);
    expect(await titles('quillfeather')).toEqual([['Indexed copper wire quillfeather', 2]]); // latest only by default
    expect((await titles('quillfeather', { allVersions: true })).sort()).toEqual([['Indexed copper wire quillfeather', 1], ['Indexed copper wire quillfeather', 2]]);

    await withdrawVersion({ user: lab.owner, versionId: v2.versionId, reason: 'Wrong contact spacing.' }, noJobs);
    expect(await titles('quillfeather')).toEqual([['Indexed copper wire quillfeather', 1]]);
    const log = await db()('outbox').where({ topic: SEARCH_CHANGED_TOPIC, aggregate_id: d.datasetId }).count({ n: '*' }).first();
    expect(Number(log?.n)).toBe(3);
  });

  it('an update missed while an instance was down is there after its restart', async () => {
    const d = await makeDraft(lab, lab.member, 'Missed while down brackenridge');
    await searchIndexStatus();
    forgetSearchIndex(); // the instance stops…
    await publishVersion({ user: lab.owner, versionId: d.versionId }, noJobs); // …the publication happens meanwhile…
    expect(await titles('brackenridge')).toEqual([['Missed while down brackenridge', 1]]); // …and the restarted one has it
  });

  it('a change logged by another instance is caught up without a rebuild', async () => {
    const before = await searchIndexStatus();
    const d = await makeDraft(lab, lab.member, 'Other instance halloway');
    await publishVersion({ user: lab.owner, versionId: d.versionId }, noJobs);
    const after = await searchIndexStatus();
    expect(after.builtAt).toBe(before.builtAt);
    expect(after.cursor).toBeGreaterThan(before.cursor);
    expect(await titles('halloway')).toEqual([['Other instance halloway', 1]]);
  });

  it('a change committed by another process shows within the catch-up interval', async () => {
    const d = await makeDraft(lab, lab.member, 'Renamed elsewhere copper ribbon');
    await publishVersion({ user: lab.owner, versionId: d.versionId }, noJobs);
    expect(await titles('wrenfield')).toEqual([]);
    // What another instance's transaction leaves behind: the row changed and a log entry, and no signal to this process.
    await db().transaction(async (trx) => {
      await trx('dataset_versions').where('id', d.versionId).update({ title: 'Renamed elsewhere copper ribbon wrenfield' });
      await trx('outbox').insert({ topic: SEARCH_CHANGED_TOPIC, aggregate_id: d.datasetId, payload: JSON.stringify({ versionId: d.versionId }) });
    });
    const committed = performance.now();
    let seenAfter = Infinity;
    while (performance.now() - committed < CATCH_UP_INTERVAL_MS + 2000) {
      if ((await titles('wrenfield')).length === 1) {
        seenAfter = performance.now() - committed;
        break;
      }
      await new Promise((done) => setTimeout(done, 50));
    }
    // The interval plus one catch-up (a database round trip and re-reading one dataset) and the polling step.
    expect(seenAfter).toBeLessThan(CATCH_UP_INTERVAL_MS + 1000);
    expect(await titles('wrenfield')).toEqual([['Renamed elsewhere copper ribbon wrenfield', 1]]);
  });

  it('never shows drafts, versions in review or withdrawn ones, whatever the filters say', async () => {
    const result = await searchPublished({ group: [lab.slug], allVersions: true, pageSize: 100 });
    const states = await db()('dataset_versions').whereIn('id', result.hits.map((h) => h.doc.versionId)).pluck('state');
    expect(states.length).toBeGreaterThan(0);
    expect(new Set(states)).toEqual(new Set(['published']));
  });
});
