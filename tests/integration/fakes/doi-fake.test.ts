// The DOI fake started by `npm test`, over HTTP. Behaviour follows the DataCite REST API's JSON:API shape
// and its state rules (domain.md "Standards the product speaks": draft/registered/findable; publish, register, hide;
// only drafts can be deleted). Mandatory fields: DataCite Metadata Schema 4.7 (Identifier, Creator, Title,
// Publisher, PublicationYear, ResourceType) plus the landing url.
import { describe, expect, it } from 'vitest';
import { assertLoopback, doiAuthorization, requireEnv } from '@/tests/support/services';

const api = assertLoopback(requireEnv('DOI_API_URL'), 'DOI API').origin;
const prefix = requireEnv('DOI_PREFIX');
const JSON_API = 'application/vnd.api+json';

type Doc = { data?: { id: string; type: string; attributes: Record<string, unknown> }; errors?: { status: string; source?: string; title: string }[] };

async function call(method: string, path: string, attributes?: Record<string, unknown>, auth: string | null = doiAuthorization()) {
  const res = await fetch(`${api}${path}`, {
    method,
    headers: { 'Content-Type': JSON_API, ...(auth ? { Authorization: auth } : {}) },
    body: attributes ? JSON.stringify({ data: { type: 'dois', attributes } }) : undefined,
  });
  const text = await res.text();
  return { status: res.status, type: res.headers.get('content-type'), body: (text ? JSON.parse(text) : null) as Doc | null };
}

// Invented consortium metadata; resourceTypeGeneral "Dataset" is in the 4.7 enumeration (include/datacite-resourceType-v4.xsd).
const complete = {
  creators: [{ name: 'Brightwater Cryogenic Transport Lab', nameType: 'Organizational' }],
  titles: [{ title: 'Hall bar resistance of a thin NbN film, 2–300 K' }],
  publisher: { name: 'Ohmstead' },
  publicationYear: 2026,
  types: { resourceTypeGeneral: 'Dataset' },
  url: 'http://localhost:3101/datasets/nbn-hall-bar',
};
const suffix = () => `test-${Math.random().toString(36).slice(2, 10)}`;

describe('DOI fake', () => {
  it('answers the heartbeat without auth', async () => {
    const res = await fetch(`${api}/heartbeat`);
    expect(res.status).toBe(200);
    expect(await res.text()).toBe('OK');
  });

  it('refuses requests without, or with wrong, Basic credentials (401)', async () => {
    const none = await call('GET', `/dois?prefix=${prefix}`, undefined, null);
    expect(none.status).toBe(401);
    expect(none.body?.errors?.[0]?.status).toBe('401');
    const wrong = await call('GET', `/dois?prefix=${prefix}`, undefined, `Basic ${Buffer.from('OHM.HUB:not-the-password').toString('base64')}`);
    expect(wrong.status).toBe(401);
  });

  it('creates a draft from a prefix, reads it back by plain and URL-encoded DOI', async () => {
    const created = await call('POST', '/dois', { prefix });
    expect(created.status).toBe(201);
    expect(created.type).toBe(JSON_API);
    const doi = created.body?.data?.id ?? '';
    expect(doi).toMatch(new RegExp(`^${prefix.replace('.', '\\.')}/[a-z0-9]{4}-[a-z0-9]{4}$`));
    expect(created.body?.data?.type).toBe('dois');
    expect(created.body?.data?.attributes.state).toBe('draft');

    const plain = await call('GET', `/dois/${doi}`);
    const encoded = await call('GET', `/dois/${encodeURIComponent(doi)}`);
    expect(plain.status).toBe(200);
    expect(encoded.body?.data?.id).toBe(doi);
    expect((await call('GET', `/dois/${prefix}/no-such-doi`)).status).toBe(404);
  });

  it('refuses a DOI that already exists (422) and one outside the repository prefix', async () => {
    const doi = `${prefix}/${suffix()}`;
    expect((await call('POST', '/dois', { doi })).status).toBe(201);
    const again = await call('POST', '/dois', { doi: doi.toUpperCase() });
    expect(again.status).toBe(422);
    expect(again.body?.errors?.[0]).toMatchObject({ source: 'doi', title: 'This DOI has already been taken' });
    const foreign = await call('POST', '/dois', { doi: `10.99999/${suffix()}` });
    expect(foreign.status).toBe(422);
  });

  it('refuses publish without the mandatory fields, naming each missing one (422)', async () => {
    const doi = `${prefix}/${suffix()}`;
    await call('POST', '/dois', { doi, titles: complete.titles });
    const res = await call('PUT', `/dois/${doi}`, { event: 'publish' });
    expect(res.status).toBe(422);
    expect(res.body?.errors?.map((e) => e.source).sort()).toEqual(['creators', 'publicationYear', 'publisher', 'types', 'url']);
    expect((await call('GET', `/dois/${doi}`)).body?.data?.attributes.state).toBe('draft');
  });

  it('publishes a complete draft (findable), refuses to delete it, hides it (registered) and publishes it again', async () => {
    const doi = `${prefix}/${suffix()}`;
    await call('POST', '/dois', { doi, ...complete });
    const published = await call('PUT', `/dois/${encodeURIComponent(doi)}`, { event: 'publish' });
    expect(published.status).toBe(200);
    expect(published.body?.data?.attributes).toMatchObject({ state: 'findable', isActive: true, publicationYear: 2026, url: complete.url });
    expect(published.body?.data?.attributes.registered).toEqual(expect.any(String));

    const del = await call('DELETE', `/dois/${doi}`);
    expect(del.status).toBe(405);
    expect(del.body?.errors?.[0]?.source).toBe('state');

    const blanked = await call('PUT', `/dois/${doi}`, { creators: [] });
    expect(blanked.status).toBe(422);
    expect(blanked.body?.errors?.map((e) => e.source)).toEqual(['creators']);

    const hidden = await call('PUT', `/dois/${doi}`, { event: 'hide' });
    expect(hidden.body?.data?.attributes).toMatchObject({ state: 'registered', isActive: false });
    const back = await call('PUT', `/dois/${doi}`, { event: 'publish', titles: [{ title: 'Hall bar resistance of a thin NbN film, 2–300 K (v2)' }] });
    expect(back.body?.data?.attributes.state).toBe('findable');
    expect(back.body?.data?.attributes.titles).toEqual([{ title: 'Hall bar resistance of a thin NbN film, 2–300 K (v2)' }]);
  });

  it('registers a draft directly, and refuses to hide a draft', async () => {
    const a = `${prefix}/${suffix()}`;
    const registered = await call('POST', '/dois', { doi: a, ...complete, event: 'register' });
    expect(registered.status).toBe(201);
    expect(registered.body?.data?.attributes.state).toBe('registered');
    const b = `${prefix}/${suffix()}`;
    await call('POST', '/dois', { doi: b, ...complete });
    const hide = await call('PUT', `/dois/${b}`, { event: 'hide' });
    expect(hide.status).toBe(422);
    expect(hide.body?.errors?.[0]?.source).toBe('event');
  });

  it('deletes a draft (204), after which it is gone', async () => {
    const doi = `${prefix}/${suffix()}`;
    await call('POST', '/dois', { doi });
    const del = await call('DELETE', `/dois/${doi}`);
    expect(del.status).toBe(204);
    expect((await call('GET', `/dois/${doi}`)).status).toBe(404);
  });

  it('lists by prefix and state', async () => {
    const doi = `${prefix}/${suffix()}`;
    await call('POST', '/dois', { doi, ...complete, event: 'publish' });
    const list = await call('GET', `/dois?prefix=${prefix}&state=findable`);
    expect(list.status).toBe(200);
    const rows = (list.body as unknown as { data: { id: string; attributes: { state: string } }[]; meta: { total: number } });
    expect(rows.data.map((d) => d.id)).toContain(doi);
    expect(rows.data.every((d) => d.attributes.state === 'findable')).toBe(true);
    expect(rows.meta.total).toBe(rows.data.length);
  });
});
