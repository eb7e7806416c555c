// getLandingView against MariaDB: what each kind of viewer sees of a version in each state (lib/access decides).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AccessDeniedError } from '@/lib/access';
import { getLandingView } from '@/lib/datasets/get-landing-view';
import { AppError } from '@/lib/errors';
import {
  anonymous, asUser, closeDb, dropLandingLabs, dropOwnBlobs, fixtureMeta, insertAnalysedFile, insertDataset, insertVersion, makeLandingLab,
  reviewer, type LandingLab,
} from './fixtures';

// Fixed instants: the embargo below ends at 2027-04-01 00:00 UTC.
const PUBLISHED_AT = new Date(Date.UTC(2026, 11, 2, 20, 56, 4));
const BEFORE_EMBARGO_END = new Date(Date.UTC(2027, 2, 31, 23, 59, 59));
const EMBARGO_END = new Date(Date.UTC(2027, 3, 1, 0, 0, 0));

const copper = fixtureMeta('cu-wire-rt.meta.json');
const copperRecord = {
  ...copper,
  description: 'Four-wire **R(T)** of an annealed wire.\n\n| T | R |\n|---|---|\n| 2 K | 0.3 mΩ |',
  keywords: ['copper', 'residual resistivity'],
  relatedIdentifiers: [{ identifier: '10.80123/paper.demo-1', identifierType: 'DOI', relationType: 'IsSupplementTo' }],
};

let lab: LandingLab;
const ids: Record<string, { datasetId: string; versionId: string; doi: string | null; conceptDoi: string; fileId?: string }> = {};

async function dataset(key: string, versions: Parameters<typeof insertVersion>[2][], fileOn?: number) {
  const { datasetId, conceptDoi } = await insertDataset(lab);
  for (const spec of versions) {
    const { versionId, doi } = await insertVersion(datasetId, lab, spec);
    const fileId = spec.number === fileOn ? await insertAnalysedFile(versionId, 'cu-wire-rt.csv', copper) : undefined;
    ids[`${key}.v${spec.number}`] = { datasetId, versionId, doi, conceptDoi, fileId };
  }
}

async function refusal(promise: Promise<unknown>): Promise<{ name: string; code: string }> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof AppError || error instanceof AccessDeniedError) return { name: error.name, code: error.code };
    throw error;
  }
  throw new Error('expected a refusal, got a view');
}

beforeAll(async () => {
  lab = await makeLandingLab();
  await dataset('open', [{ number: 1, state: 'published', metadata: copperRecord, publishedAt: PUBLISHED_AT }], 1);
  await dataset('locked', [{ number: 1, state: 'published', metadata: copperRecord, publishedAt: PUBLISHED_AT, embargoUntil: '2027-04-01' }], 1);
  await dataset('gone', [{
    number: 1, state: 'withdrawn', metadata: copperRecord, publishedAt: PUBLISHED_AT, withdrawnAt: new Date(Date.UTC(2026, 11, 20, 9, 30)),
    withdrawalReason: 'The thermometer calibration was wrong by 2 K below 20 K.',
  }], 1);
  await dataset('mixed', [
    { number: 1, state: 'published', metadata: copperRecord, publishedAt: PUBLISHED_AT },
    { number: 2, state: 'draft', metadata: { ...copperRecord, title: 'Copper wire, second annealing (draft)' } },
  ], 2);
});

afterAll(async () => {
  await dropLandingLabs();
  await dropOwnBlobs();
  await closeDb();
});

describe('a published version', () => {
  it('shows an anonymous visitor everything: creators with ORCID, citations, curves, derived values, file links and JSON-LD', async () => {
    const { datasetId, doi, conceptDoi, fileId } = ids['open.v1'];
    const view = await getLandingView({ target: { datasetId }, actor: anonymous, now: BEFORE_EMBARGO_END });
    expect(view.version).toMatchObject({ number: 1, state: 'published', title: copper.title, doi, doiUrl: `https://doi.org/${doi}`, doiRegistered: true, isLatest: true });
    expect(view.version.publishedAt).toBe('2026-12-02T20:56:04.000Z');
    expect(view.dataset.conceptDoiUrl).toBe(`https://doi.org/${conceptDoi}`);
    expect(view.creators).toEqual([{ name: 'Imogen Vale', orcid: '0000-0000-3141-5920', orcidUrl: 'https://orcid.org/0000-0000-3141-5920', affiliations: ['Larkspur Cryogenic Lab'] }]);
    expect(view.group).toEqual({ slug: lab.slug, name: lab.name, institution: 'Meridian Transport Consortium (invented)' });
    // DataCite Metadata Schema 4.7, "Citation": Creator (PublicationYear): Title. Version. Publisher. (resourceTypeGeneral). Identifier
    expect(view.citations?.text).toBe(`Vale, Imogen (2026): R(T) of annealed copper wire LCL-Cu-W07, 2–300 K. Version 1. Ohmstead. (Dataset). https://doi.org/${doi}`);
    expect(view.citations?.bibtex).toContain(`doi = {${doi}}`);
    expect(view.citations?.ris).toMatch(/^TY {2}- DATA/);
    expect(JSON.parse(view.citations!['csl-json'])[0]).toMatchObject({ type: 'dataset', DOI: doi, author: [{ family: 'Vale', given: 'Imogen' }] });
    expect(view.record.geometry).toEqual([{ label: 'Voltage-contact spacing', value: '20 mm' }, { label: 'Diameter', value: '0.1 mm' }]);
    expect(view.record.excitation).toEqual([{ label: 'Type', value: 'AC' }, { label: 'Current', value: '1 mA' }, { label: 'Frequency', value: '13.7 Hz' }]);
    expect(view.record.environment[0]).toEqual({ label: 'Temperature', value: '2–300 K' });
    expect(view.record.related).toEqual([{ relation: 'Is supplement to', identifier: '10.80123/paper.demo-1', href: 'https://doi.org/10.80123/paper.demo-1' }]);
    expect(view.curves?.files).toHaveLength(1);
    expect(view.curves!.files[0].previews.length).toBeGreaterThan(0);
    expect(view.curves!.units.K.map((u) => u.ucum)).toEqual(['K', 'mK', 'Cel', '[degF]']);
    // ρ at 2 K is the fixture's residual resistivity, 1.0×10⁻¹⁰ Ω·m (CU_WIRE.residualOhmM in tests/fixtures/transport/params.ts).
    const rho2K = view.derived?.[0].derived.find((d) => d.key === 'resistivity.at-min-temperature');
    expect(rho2K).toMatchObject({ ucum: 'Ohm.m', at: { 'temperature[K]': 2 } });
    expect(Math.abs(rho2K!.value - 1.0e-10) / 1.0e-10).toBeLessThan(1e-3);
    expect(view.derived?.[0].quality.map((q) => q.code)).toEqual(['lock-in-sweep-lag']);
    expect(view.curvesLock).toBeNull();
    expect(view.files).toEqual([expect.objectContaining({ id: fileId, name: 'cu-wire-rt.csv', downloadUrl: `/api/v1/files/${fileId}/download` })]);
    expect(view.files![0].sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(view.filesLock).toBeNull();
    expect(view.allowedActions).toEqual(['view_metadata', 'view_curves', 'download_files']);
    const ld = JSON.parse(view.jsonLd!);
    expect(ld).toMatchObject({ '@type': 'Dataset', '@id': `https://doi.org/${doi}`, name: copper.title, version: '1', license: 'https://spdx.org/licenses/CC-BY-4.0.html' });
    expect(ld.url).toMatch(new RegExp(`/datasets/${datasetId}/versions/1$`));
    expect(ld.distribution[0]).toMatchObject({ name: 'cu-wire-rt.csv', sha256: view.files![0].sha256 });
    expect(ld.distribution[0].contentUrl).toMatch(new RegExp(`/api/v1/files/${fileId}/download$`));
    expect(ld.variableMeasured.find((v: { unitCode?: string }) => v.unitCode === 'UCUM:K')).toMatchObject({ minValue: expect.any(Number), maxValue: expect.any(Number) });
  });
});

describe('an embargoed version', () => {
  it('keeps curves and downloads from an anonymous visitor until 00:00 UTC of the date, but lists the files and the lock', async () => {
    const { datasetId } = ids['locked.v1'];
    const view = await getLandingView({ target: { datasetId, versionNumber: 1 }, actor: anonymous, now: BEFORE_EMBARGO_END });
    expect(view.embargo).toEqual({ until: '2027-04-01', opensAt: '2027-04-01T00:00:00.000Z', active: true });
    expect(view.curves).toBeNull();
    expect(view.derived).toBeNull();
    expect(view.curvesLock).toEqual({ code: 'embargoed', reason: 'The curves and files of this version are under embargo until 2027-04-01 at 00:00 UTC.' });
    expect(view.files?.map((f) => f.downloadUrl)).toEqual([null]);
    expect(view.filesLock?.code).toBe('embargoed');
    const ld = JSON.parse(view.jsonLd!);
    expect(ld.conditionsOfAccess).toBe('Files are under embargo until 2027-04-01; the metadata is public.');
    // The measured ranges come from the files, so they stay out of the public record while the files are locked.
    expect(ld.variableMeasured.every((v: Record<string, unknown>) => !('minValue' in v) && !('maxValue' in v))).toBe(true);
    expect(view.citations?.text).toContain('Vale, Imogen (2026)');
  });

  it('opens at 00:00 UTC on the date for everyone', async () => {
    const view = await getLandingView({ target: { datasetId: ids['locked.v1'].datasetId }, actor: anonymous, now: EMBARGO_END });
    expect(view.embargo?.active).toBe(false);
    expect(view.curves?.files).toHaveLength(1);
    expect(view.files![0].downloadUrl).toBe(`/api/v1/files/${ids['locked.v1'].fileId}/download`);
  });

  it('shows the group its curves and downloads before the date', async () => {
    const view = await getLandingView({ target: { datasetId: ids['locked.v1'].datasetId }, actor: asUser(lab.member, 'member'), now: BEFORE_EMBARGO_END });
    expect(view.embargo?.active).toBe(true);
    expect(view.curves?.files).toHaveLength(1);
    expect(view.files![0].downloadUrl).not.toBeNull();
    expect(view.allowedActions).toContain('create_version');
  });

  it('refuses curves to a signed-in outsider just as to an anonymous visitor', async () => {
    const view = await getLandingView({ target: { datasetId: ids['locked.v1'].datasetId }, actor: asUser(lab.outsider), now: BEFORE_EMBARGO_END });
    expect(view.curvesLock?.code).toBe('embargoed');
    expect(view.files![0].downloadUrl).toBeNull();
  });
});

describe('a withdrawn version', () => {
  it('is a tombstone: reason, date and DOI stay, files and curves are gone, the citation remains', async () => {
    const { datasetId, doi } = ids['gone.v1'];
    const view = await getLandingView({ target: { datasetId }, actor: anonymous, now: BEFORE_EMBARGO_END });
    expect(view.version.state).toBe('withdrawn');
    expect(view.withdrawal).toEqual({ at: '2026-12-20T09:30:00.000Z', reason: 'The thermometer calibration was wrong by 2 K below 20 K.' });
    expect(view.version.doiUrl).toBe(`https://doi.org/${doi}`);
    expect(view.files).toBeNull();
    expect(view.curves).toBeNull();
    expect(view.curvesLock?.code).toBe('wrong_state');
    expect(view.citations?.text).toContain(`https://doi.org/${doi}`);
    expect(JSON.parse(view.jsonLd!).distribution).toEqual([]);
  });

  it('still shows the files to the site admin (support access), and to nobody else in the group', async () => {
    const asAdmin = await getLandingView({ target: { datasetId: ids['gone.v1'].datasetId }, actor: asUser(lab.admin), now: BEFORE_EMBARGO_END });
    expect(asAdmin.files).toHaveLength(1);
    const asOwner = await getLandingView({ target: { datasetId: ids['gone.v1'].datasetId }, actor: asUser(lab.owner, 'owner'), now: BEFORE_EMBARGO_END });
    expect(asOwner.files).toBeNull();
  });
});

describe('drafts and the version picker', () => {
  it('shows an anonymous visitor the latest published version and only the versions the public may open', async () => {
    const { datasetId } = ids['mixed.v1'];
    const view = await getLandingView({ target: { datasetId }, actor: anonymous });
    expect(view.version.number).toBe(1);
    expect(view.version.isLatest).toBe(false);
    expect(view.versions.map((v) => [v.number, v.state, v.current, v.href])).toEqual([[1, 'published', true, `/datasets/${datasetId}/versions/1`]]);
  });

  it('hides a draft from anonymous visitors and outsiders with the same not_found', async () => {
    const target = { datasetId: ids['mixed.v2'].datasetId, versionNumber: 2 };
    expect(await refusal(getLandingView({ target, actor: anonymous }))).toEqual({ name: 'AccessDeniedError', code: 'not_found' });
    expect(await refusal(getLandingView({ target, actor: asUser(lab.outsider) }))).toEqual({ name: 'AccessDeniedError', code: 'not_found' });
    expect(await refusal(getLandingView({ target: { datasetId: target.datasetId, versionNumber: 9 }, actor: anonymous }))).toEqual({ name: 'AppError', code: 'not_found' });
    expect(await refusal(getLandingView({ target: { datasetId: 'not-a-uuid' }, actor: anonymous }))).toEqual({ name: 'AppError', code: 'not_found' });
  });

  it('shows the group its draft, with no citation or JSON-LD yet and the draft in the picker', async () => {
    const { datasetId } = ids['mixed.v2'];
    const member = asUser(lab.member, 'member');
    const latest = await getLandingView({ target: { datasetId }, actor: member });
    expect(latest.version.number).toBe(1);
    expect(latest.versions.map((v) => v.number)).toEqual([2, 1]);
    const draft = await getLandingView({ target: { datasetId, versionNumber: 2 }, actor: member });
    expect(draft.version).toMatchObject({ state: 'draft', title: 'Copper wire, second annealing (draft)', doiRegistered: false });
    expect(draft.citations).toBeNull();
    expect(draft.citationNote).toBe('A citation is offered once this version is published and its DOI registered.');
    expect(draft.jsonLd).toBeNull();
    expect(draft.curves?.files).toHaveLength(1);
    expect(draft.allowedActions).toEqual(expect.arrayContaining(['edit', 'submit', 'manage_links']));
  });
});

describe('a reviewer link', () => {
  it('opens its own draft; anonymous mode hides creators, group, affiliations, related work, citation and JSON-LD', async () => {
    const { versionId, fileId } = ids['mixed.v2'];
    const view = await getLandingView({
      target: { versionId }, actor: reviewer(versionId, { anonymous: true }),
      links: { version: (_d, n) => `/review/token-x/v${n}`, file: (id) => `/review/token-x/files/${id}` },
    });
    expect(view.anonymousMode).toBe(true);
    expect(view.creators).toBeNull();
    expect(view.group).toBeNull();
    expect(view.record.related).toEqual([]);
    expect(view.citations).toBeNull();
    expect(view.jsonLd).toBeNull();
    expect(JSON.stringify(view)).not.toContain('Imogen Vale');
    expect(JSON.stringify(view)).not.toContain('Larkspur Cryogenic Lab');
    expect(JSON.stringify(view)).not.toContain(lab.name);
    expect(view.curves?.files).toHaveLength(1);
    expect(view.files![0].downloadUrl).toBe(`/review/token-x/files/${fileId}`);
    expect(view.versions.map((v) => [v.number, v.href])).toEqual([[2, '/review/token-x/v2']]);
  });

  it('shows names when the link is not anonymous, and nothing of another version', async () => {
    const { versionId } = ids['mixed.v2'];
    const named = await getLandingView({ target: { versionId }, actor: reviewer(versionId) });
    expect(named.creators?.[0].name).toBe('Imogen Vale');
    expect(await refusal(getLandingView({ target: { versionId: ids['open.v1'].versionId }, actor: reviewer(versionId) })))
      .toEqual({ name: 'AccessDeniedError', code: 'not_found' });
  });

  it('refuses an expired or revoked link with its own code', async () => {
    const { versionId } = ids['mixed.v2'];
    const expired = reviewer(versionId, { expiresAt: new Date(Date.UTC(2026, 0, 1)) });
    expect(await refusal(getLandingView({ target: { versionId }, actor: expired }))).toEqual({ name: 'AccessDeniedError', code: 'link_expired' });
    const revoked = reviewer(versionId, { revokedAt: new Date(Date.UTC(2026, 0, 1)) });
    expect(await refusal(getLandingView({ target: { versionId }, actor: revoked }))).toEqual({ name: 'AccessDeniedError', code: 'link_revoked' });
  });
});
