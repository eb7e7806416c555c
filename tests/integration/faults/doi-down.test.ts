// The DOI agency stops during publish (issue 8 item 6): a private DOI fake is stopped before publishVersion and
// restarted afterwards; the outbox then registers the DOI exactly once. The shared DOI fake is never stopped.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { createDataset } from '@/lib/datasets/create-dataset';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { saveMetadata } from '@/lib/datasets/save-metadata';
import { doiClient } from '@/lib/doi/client';
import { defaultOutboxHandlers, processOutboxOnce, type OutboxHandlers } from '@/lib/outbox/process-outbox';
import { publishingOutboxHandlers } from '@/lib/publishing/outbox-handlers';
import { publishVersion } from '@/lib/publishing/publish-version';
import { submitVersion } from '@/lib/publishing/submit-version';
import { versionLandingUrl } from '@/lib/publishing/urls';
import { doiAuthorization } from '@/tests/support/services';
import { closeDb, completeRecord, jobsOf, makePubLab, removePubLab, type PubLab } from '../publishing/fixtures';
import { privateDoiFake, type PrivateService } from './private-services';

let lab: PubLab;
let fake: PrivateService & { apiUrl: string };

beforeAll(async () => {
  fake = await privateDoiFake();
  await fake.start();
  lab = await makePubLab();
}, 60_000);

afterAll(async () => {
  try {
    await removePubLab(lab);
    await closeDb();
  } finally {
    await fake?.dispose();
  }
}, 60_000);

type Listed = { id: string; attributes: { url?: string; state?: string } };
async function privateDois(): Promise<Listed[]> {
  const res = await fetch(`${fake.apiUrl}/dois?prefix=${encodeURIComponent(process.env.DOI_PREFIX ?? '')}`, { headers: { Authorization: doiAuthorization() } });
  expect(res.status).toBe(200);
  return ((await res.json()) as { data: Listed[] }).data;
}

describe('DOI agency down during publish', () => {
  it('publish is recorded with doi_state pending; after the restart the outbox registers exactly one DOI', async () => {
    // Every topic the app knows, with DOI work sent to the private agency.
    const privateHandlers = { ...defaultOutboxHandlers(), ...publishingOutboxHandlers({ doiApi: { apiUrl: fake.apiUrl } }) };
    const title = 'Agency restart: four-wire R(T) of a constantan strip';
    const created = await createDataset({ user: lab.member, groupSlug: lab.slug, title }, { doi: doiClient({ apiUrl: fake.apiUrl }) });
    expect(created.doiState).toBe('reserved');
    expect((await saveMetadata({ user: lab.member, versionId: created.versionId, record: completeRecord(title) })).saved).toBe(true);
    await submitVersion({ user: lab.member, versionId: created.versionId }, { handlers: privateHandlers });

    await fake.stop();
    const published = await publishVersion({ user: lab.curator, versionId: created.versionId }, { handlers: privateHandlers });
    expect(published).toMatchObject({ state: 'published', doi: created.doi, doiState: 'pending' });
    expect(await findVersionRow(created.versionId)).toMatchObject({ state: 'published', doi_state: 'pending' });
    const [failed] = await jobsOf(created.versionId, 'doi.register');
    expect(failed).toMatchObject({ attempts: 1, processed_at: null });
    expect(failed!.last_error).toBe(`The DOI registration service at ${fake.apiUrl} is unreachable (ECONNREFUSED).`);

    await fake.start();
    // Only this version's job goes to the private agency; any other due job is run as the shared worker would run it.
    const shared = publishingOutboxHandlers();
    const routed: OutboxHandlers = {
      'doi.register': (payload, row) => (row.aggregateId === created.versionId ? privateHandlers : shared)['doi.register']!(payload, row),
    };
    await db()('outbox').where({ id: failed!.id }).update({ next_attempt_at: db().raw('UTC_TIMESTAMP(3) - INTERVAL 1 SECOND') });
    await processOutboxOnce(routed, { limit: 100 });
    expect((await jobsOf(created.versionId, 'doi.register'))[0]).toMatchObject({ attempts: 2, last_error: null });
    expect((await jobsOf(created.versionId, 'doi.register'))[0]!.processed_at).toBeInstanceOf(Date);
    expect((await findVersionRow(created.versionId))?.doi_state).toBe('findable');

    const forVersion = (await privateDois()).filter((d) => d.attributes.url === versionLandingUrl(created.versionId));
    expect(forVersion.map((d) => [d.id.toLowerCase(), d.attributes.state])).toEqual([[created.doi.toLowerCase(), 'findable']]);
  }, 60_000);
});
