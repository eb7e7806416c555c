// lib/doi/client.ts against the DOI fake (JSON:API shape and rules of the registration agency's REST API;
// see tests/integration/fakes/doi-fake.test.ts for the fake itself).
import { afterAll, describe, expect, it } from 'vitest';
import { doiClient, DoiServiceError } from '@/lib/doi/client';
import { newDoi } from '@/lib/doi/doi-suffix';
import { requireEnv } from '@/tests/support/services';
import { closedPortUrl, doiFake } from './fixtures';

const prefix = requireEnv('DOI_PREFIX');
const made: string[] = [];

afterAll(async () => {
  for (const doi of made) await doiFake('DELETE', `/dois/${encodeURIComponent(doi)}`);
});

async function failure(promise: Promise<unknown>): Promise<DoiServiceError> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(DoiServiceError);
  return error as DoiServiceError;
}

describe('DOI client', () => {
  it('creates a draft, and treats creating it again as done (same record, createdNow false)', async () => {
    const doi = newDoi(prefix);
    made.push(doi);
    const client = doiClient();
    const first = await client.createDraft(doi, { titles: [{ title: 'Nb wire transition near 9 K' }] });
    expect(first).toMatchObject({ doi, state: 'draft', createdNow: true });
    const second = await client.createDraft(doi, { titles: [{ title: 'A different title' }] });
    expect(second).toMatchObject({ doi, state: 'draft', createdNow: false, created: first.created, updated: first.updated });
    expect((await client.get(doi))?.attributes.titles).toEqual([{ title: 'Nb wire transition near 9 K' }]);
  });

  it('returns null for a DOI the agency does not know', async () => {
    expect(await doiClient().get(`${prefix}/ohm.0000-zzzz`)).toBeNull();
  });

  it('reports a refusal with the HTTP status and the agency\'s reason', async () => {
    const error = await failure(doiClient().createDraft('10.99999/ohm.abcd-efgh'));
    expect(error.status).toBe(422);
    expect(error.message).toBe(`The DOI registration service refused to create the draft DOI 10.99999/ohm.abcd-efgh (HTTP 422: prefix 10.99999 is not assigned to repository ${requireEnv('DOI_REPOSITORY_ID')}).`);
  });

  it('reports wrong credentials as a 401 refusal', async () => {
    const error = await failure(doiClient({ password: 'not-the-password' }).get(`${prefix}/ohm.0000-zzzz`));
    expect(error.status).toBe(401);
    expect(error.message).toContain('HTTP 401: Bad credentials');
  });

  it('reports an unreachable service with no status', async () => {
    const url = await closedPortUrl();
    const error = await failure(doiClient({ apiUrl: url }).createDraft(newDoi(prefix)));
    expect(error.status).toBeNull();
    expect(error.message).toBe(`The DOI registration service at ${url} is unreachable (ECONNREFUSED).`);
  });
});
