// The deposit API over HTTP against the production build `npm test` serves, signed in as the demo author: routes,
// statuses and the error body `{ error: { code, message, details, requestId } }` (lib/http/handler.ts); demo
// accounts: db/seeds/demo-accounts.json.
import { describe, expect, it } from 'vitest';
import demo from '@/db/seeds/demo-accounts.json';
import completeRecord from '@/tests/fixtures/transport/cu-wire-rt.meta.json';
import { baseUrl } from '@/tests/support/e2e';
import { HttpSession } from '@/tests/support/http-session';

const author = demo.accounts.find((a) => a.email.startsWith('ada.'))!; // member of larkspur-cryogenic (and tidewater)
const curator = demo.accounts.find((a) => a.email.startsWith('tobin.'))!; // curator of larkspur-cryogenic
const reuser = demo.accounts.find((a) => a.email.startsWith('reuser@'))!; // in no group

type ApiError = { error: { code: string; message: string; details?: Record<string, unknown>; requestId: string } };

async function signedIn(email: string): Promise<HttpSession> {
  const http = new HttpSession(baseUrl);
  expect((await http.signInWithPassword(email, demo.password)).status).toBe(200);
  return http;
}

function sendJson(http: HttpSession, method: string, path: string, body: unknown): Promise<Response> {
  return http.fetch(path, { method, headers: { 'content-type': 'application/json' }, body: typeof body === 'string' ? body : JSON.stringify(body) });
}

async function expectError(response: Response, status: number, code: string): Promise<ApiError['error']> {
  expect(response.status).toBe(status);
  const body = (await response.json()) as ApiError;
  expect(body.error.code).toBe(code);
  expect(body.error.requestId).toBe(response.headers.get('x-request-id'));
  return body.error;
}

describe('deposit API', () => {
  it('refuses callers who are not signed in (401) on every route', async () => {
    const anon = new HttpSession(baseUrl);
    await expectError(await sendJson(anon, 'POST', '/api/v1/datasets', { group: 'larkspur-cryogenic', title: 'Anonymous' }), 401, 'not_signed_in');
    await expectError(await anon.fetch('/api/v1/drafts'), 401, 'not_signed_in');
  });

  it('creates a draft with a reserved DOI, shows it, lists it and saves its metadata', async () => {
    const http = await signedIn(author.email);
    const title = 'E2E deposit: four-wire ρ(T) of a copper wire';
    const created = await sendJson(http, 'POST', '/api/v1/datasets', { group: 'larkspur-cryogenic', title });
    expect(created.status).toBe(201);
    const dataset = (await created.json()) as { datasetId: string; versionId: string; versionNumber: number; doi: string; conceptDoi: string; doiState: string };
    expect(dataset).toMatchObject({ versionNumber: 1, doiState: 'reserved' });
    expect(dataset.doi).toMatch(/^10\.\d{4,9}\/ohm\.[0-9a-hjkmnp-tv-z]{4}-[0-9a-hjkmnp-tv-z]{4}$/);

    const viewed = await http.fetch(`/api/v1/versions/${dataset.versionId}`);
    expect(viewed.status).toBe(200);
    const view = (await viewed.json()) as { version: Record<string, unknown>; validation: { complete: boolean }; files: unknown[]; allowedActions: string[] };
    expect(view.version).toMatchObject({
      id: dataset.versionId, state: 'draft', title, doi: dataset.doi, doiState: 'reserved', group: { slug: 'larkspur-cryogenic', name: 'Larkspur Cryogenic Lab' },
      metadata: { title, creators: [{ name: author.name }] },
    });
    expect(view.validation.complete).toBe(false);
    expect(view.files).toEqual([]);
    expect(view.allowedActions).toContain('edit');

    const drafts = (await (await http.fetch('/api/v1/drafts')).json()) as { drafts: { versionId: string; title: string; groupSlug: string; fileCount: number }[] };
    expect(drafts.drafts.find((d) => d.versionId === dataset.versionId)).toMatchObject({ title, groupSlug: 'larkspur-cryogenic', fileCount: 0 });

    // A wrong value: saved anyway, answered 422 with the field paths.
    const wrong = { ...completeRecord, sample: { ...completeRecord.sample, geometry: { diameter: { value: -0.1, unit: 'mm' } } } };
    const error = await expectError(await sendJson(http, 'PUT', `/api/v1/versions/${dataset.versionId}/metadata`, wrong), 422, 'validation_failed');
    expect(error.message).toBe('Saved as draft, but 1 field needs fixing.');
    expect(error.details).toMatchObject({ saved: true, fieldErrors: { 'sample.geometry.diameter.value': 'Diameter must be greater than 0.' } });
    const kept = (await (await http.fetch(`/api/v1/versions/${dataset.versionId}`)).json()) as { version: { metadata: unknown } };
    expect(kept.version.metadata).toEqual(wrong);

    // Any depositor of the group may edit the draft: the curator completes it.
    const steward = await signedIn(curator.email);
    const saved = await sendJson(steward, 'PUT', `/api/v1/versions/${dataset.versionId}/metadata`, completeRecord);
    expect(saved.status).toBe(200);
    expect(await saved.json()).toEqual({ saved: true, complete: true, errors: [] });
    const after = (await (await http.fetch(`/api/v1/versions/${dataset.versionId}`)).json()) as { version: { title: string }; validation: { complete: boolean } };
    expect(after.version.title).toBe(completeRecord.title);
    expect(after.validation.complete).toBe(true);
  });

  it('refuses bad bodies and callers without access, with JSON errors', async () => {
    const http = await signedIn(author.email);
    const blank = await expectError(await sendJson(http, 'POST', '/api/v1/datasets', { group: 'larkspur-cryogenic', title: '   ' }), 422, 'validation_failed');
    expect(blank.details).toEqual({ fieldErrors: { title: 'Give the dataset a title.' } });
    await expectError(await sendJson(http, 'POST', '/api/v1/datasets', '{"group": '), 422, 'validation_failed');
    const notMine = await expectError(await sendJson(http, 'POST', '/api/v1/datasets', { group: 'cobalt-ridge-magnetotransport', title: 'Not my lab' }), 403, 'forbidden');
    expect(notMine.message).toBe('Only members, curators and owners of Cobalt Ridge Magnetotransport Lab can start a dataset there.');
    await expectError(await sendJson(http, 'POST', '/api/v1/datasets', { group: 'no-such-lab', title: 'Lost' }), 404, 'not_found');

    const created = (await (await sendJson(http, 'POST', '/api/v1/datasets', { group: 'tidewater-thin-films', title: 'E2E: bodies that are refused' })).json()) as { versionId: string };
    const path = `/api/v1/versions/${created.versionId}/metadata`;
    await expectError(await sendJson(http, 'PUT', path, [completeRecord]), 422, 'validation_failed');
    await expectError(await sendJson(http, 'PUT', path, { title: 'x', description: 'y'.repeat(1024 * 1024) }), 413, 'payload_too_large');
    const view = (await (await http.fetch(`/api/v1/versions/${created.versionId}`)).json()) as { version: { metadata: unknown } };
    expect(view.version.metadata).toEqual({ title: 'E2E: bodies that are refused', creators: [{ name: author.name }] });

    // A signed-in user outside the group cannot see or change the draft: 404, as if it did not exist.
    const outsider = await signedIn(reuser.email);
    await expectError(await outsider.fetch(`/api/v1/versions/${created.versionId}`), 404, 'not_found');
    await expectError(await sendJson(outsider, 'PUT', path, { title: 'Hijacked' }), 404, 'not_found');
    const outsiderDrafts = (await (await outsider.fetch('/api/v1/drafts')).json()) as { drafts: unknown[] };
    expect(outsiderDrafts.drafts).toEqual([]);
  });
});
