// DOI registration through the outbox against the DOI fake: agency down during publish, retry, replay without a
// second DOI, version relations, withdrawal, and every stored record checked against the official DataCite 4.7 XSD.
// Expected relations: domain.md "Standards the product speaks" (IsVersionOf/HasVersion, IsNewVersionOf/
// IsPreviousVersionOf, IsSupplementTo, dateType Available).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatCitation } from '@/lib/citation';
import { db } from '@/lib/db';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { saveMetadata } from '@/lib/datasets/save-metadata';
import { createNewVersion } from '@/lib/publishing/create-new-version';
import { loadVersionDataCiteInput } from '@/lib/publishing/datacite-input';
import { doiRegistrar } from '@/lib/publishing/doi-registrar';
import { getCitation } from '@/lib/publishing/get-citation';
import { getDataCiteRecord } from '@/lib/publishing/get-datacite-record';
import { publishingOutboxHandlers } from '@/lib/publishing/outbox-handlers';
import { publishVersion } from '@/lib/publishing/publish-version';
import { registerVersionDoi } from '@/lib/publishing/register-version-doi';
import { submitVersion } from '@/lib/publishing/submit-version';
import { conceptLandingUrl, versionLandingUrl } from '@/lib/publishing/urls';
import { withdrawVersion } from '@/lib/publishing/withdraw-version';
import { validateWithXsd } from '@/tests/unit/datacite/xsd';
import {
  closeDb, closedPortUrl, completeRecord, drainJobs, fakeDoi, fakeDoisWithUrl, inDays, jobsOf, makeDraft, makePubLab, PAPER_DOI,
  rejection, removePubLab, storedXml, type PubLab,
} from './fixtures';

let lab: PubLab;
const real = publishingOutboxHandlers();

beforeAll(async () => {
  lab = await makePubLab();
});
afterAll(async () => {
  await removePubLab(lab);
  await closeDb();
});

type Related = { relatedIdentifier: string; relationType: string };
const relations = (a: Record<string, unknown> | null) =>
  ((a?.relatedIdentifiers as Related[] | undefined) ?? []).map((r) => `${r.relationType} ${r.relatedIdentifier}`);

function expectXsdValid(attributes: Record<string, unknown> | null): string {
  const xml = storedXml(attributes);
  const verdict = validateWithXsd(xml);
  expect(verdict.messages).toMatch(/validates$/);
  expect(verdict.ok).toBe(true);
  return xml;
}

describe('publishing while the DOI agency is down', () => {
  it('records the publication, shows registration pending, retries later and never duplicates the DOI', async () => {
    const d = await makeDraft(lab, lab.member, 'Agency down: four-wire R(T) of a copper wire');
    const embargo = inDays(30);
    await submitVersion({ user: lab.member, versionId: d.versionId, embargoUntil: embargo }, { handlers: real });

    const down = publishingOutboxHandlers({ doiApi: { apiUrl: await closedPortUrl() } });
    const published = await publishVersion({ user: lab.curator, versionId: d.versionId }, { handlers: down });
    expect(published).toMatchObject({ state: 'published', doi: d.doi, doiState: 'pending', embargoUntil: embargo });
    expect(await findVersionRow(d.versionId)).toMatchObject({ state: 'published', doi_state: 'pending' });
    const [job] = await jobsOf(d.versionId, 'doi.register');
    expect(job).toMatchObject({ attempts: 1, processed_at: null, payload: { versionId: d.versionId } });
    expect(job!.last_error).toMatch(/^The DOI registration service at http:\/\/127\.0\.0\.1:\d+ is unreachable \(ECONNREFUSED\)\.$/);
    expect((await fakeDoi(d.doi))?.state).toBe('draft'); // reserved at creation, not yet registered

    await drainJobs(d.versionId, real);
    expect((await jobsOf(d.versionId, 'doi.register'))[0]!.processed_at).toBeInstanceOf(Date);
    expect((await findVersionRow(d.versionId))?.doi_state).toBe('findable');

    const version = await fakeDoi(d.doi);
    expect(version).toMatchObject({ state: 'findable', url: versionLandingUrl(d.versionId), version: '1', publisher: { name: 'Ohmstead' } });
    expect(relations(version)).toEqual([`IsVersionOf ${d.conceptDoi}`, `IsSupplementTo ${PAPER_DOI}`]);
    expect(version?.dates).toEqual([
      { date: new Date().toISOString().slice(0, 10), dateType: 'Issued' },
      { date: embargo, dateType: 'Available' },
    ]);
    const xml = expectXsdValid(version);
    expect(xml).toContain(`<date dateType="Available">${embargo}</date>`);

    const concept = await fakeDoi(d.conceptDoi);
    expect(concept).toMatchObject({ state: 'findable', url: conceptLandingUrl(d.datasetId) });
    expect(relations(concept)).toEqual([`HasVersion ${d.doi}`, `IsSupplementTo ${PAPER_DOI}`]);
    expectXsdValid(concept);

    // Replay (a lost reply, a second worker): the same DOIs are updated, none is created.
    const registeredAt = version?.registered;
    expect(await registerVersionDoi(d.versionId, doiRegistrar())).toBe('registered');
    expect(await fakeDoisWithUrl(versionLandingUrl(d.versionId))).toEqual([d.doi]);
    expect(await fakeDoisWithUrl(conceptLandingUrl(d.datasetId))).toEqual([d.conceptDoi]);
    expect((await fakeDoi(d.doi))?.registered).toBe(registeredAt);
    expect(await db()('outbox').where({ aggregate_id: d.versionId, topic: 'doi.register' }).count({ n: '*' }).first()).toEqual({ n: 1 });
  });
});

describe('versions and withdrawal at the agency', () => {
  it('links v1 and v2 both ways, lists both under the all-versions DOI, and hides a withdrawn version', async () => {
    const d = await makeDraft(lab, lab.member, 'Versioned at the agency, v1');
    await publishVersion({ user: lab.owner, versionId: d.versionId }, { handlers: real });
    const v2 = await createNewVersion({ user: lab.member, versionId: d.versionId });
    await saveMetadata({ user: lab.member, versionId: v2.versionId, record: completeRecord('Versioned at the agency, v2') });
    await submitVersion({ user: lab.member, versionId: v2.versionId }, { handlers: real });
    expect((await publishVersion({ user: lab.curator, versionId: v2.versionId }, { handlers: real })).doiState).toBe('findable');

    const [one, two, concept] = await Promise.all([fakeDoi(d.doi), fakeDoi(v2.doi), fakeDoi(d.conceptDoi)]);
    expect(relations(two)).toEqual([`IsVersionOf ${d.conceptDoi}`, `IsNewVersionOf ${d.doi}`, `IsSupplementTo ${PAPER_DOI}`]);
    expect(relations(one)).toEqual([`IsVersionOf ${d.conceptDoi}`, `IsPreviousVersionOf ${v2.doi}`, `IsSupplementTo ${PAPER_DOI}`]);
    expect(relations(concept)).toEqual([`HasVersion ${d.doi}`, `HasVersion ${v2.doi}`, `IsSupplementTo ${PAPER_DOI}`]);
    expect(concept?.titles).toEqual([{ title: 'Versioned at the agency, v2' }]);
    for (const record of [one, two, concept]) expectXsdValid(record);

    await withdrawVersion({ user: lab.curator, versionId: d.versionId, reason: 'Contacts drifted: <b>remeasured</b> in v2' }, { handlers: real });
    const withdrawn = await fakeDoi(d.doi);
    expect(withdrawn?.state).toBe('registered'); // still resolves, no longer findable in search
    expect(withdrawn?.dates).toContainEqual({ date: new Date().toISOString().slice(0, 10), dateType: 'Withdrawn', dateInformation: 'Contacts drifted: <b>remeasured</b> in v2' });
    const xml = expectXsdValid(withdrawn);
    expect(xml).toContain('dateInformation="Contacts drifted: &lt;b&gt;remeasured&lt;/b&gt; in v2"');
    expect((await findVersionRow(d.versionId))?.doi_state).toBe('registered');
    expect((await fakeDoi(d.conceptDoi))?.state).toBe('findable');
  });
});

describe('DataCite record and citation for API clients', () => {
  it('serves the published record as XSD-valid XML and JSON:API, and the citation in four formats, to anyone', async () => {
    const d = await makeDraft(lab, lab.member, 'Citable: ρ(T) of copper, 2–300 K');
    await publishVersion({ user: lab.curator, versionId: d.versionId }, { handlers: real });
    const xml = await getDataCiteRecord({ user: null, versionId: d.versionId, format: 'xml' });
    expect(xml.contentType).toBe('application/xml; charset=utf-8');
    expect(validateWithXsd(xml.body).ok).toBe(true);
    const json = JSON.parse((await getDataCiteRecord({ user: null, versionId: d.versionId, format: null })).body);
    expect(json).toMatchObject({ data: { id: d.doi, type: 'dois', attributes: { doi: d.doi, version: '1' } }, meta: { preview: false } });

    const year = new Date().getUTCFullYear();
    const text = await getCitation({ user: null, versionId: d.versionId, format: 'text' });
    // DataCite's recommended form (domain.md): Creator (PublicationYear): Title. Version. Publisher. (resourceTypeGeneral). Identifier.
    expect(text.body).toBe(`Vale, Imogen (${year}): Citable: ρ(T) of copper, 2–300 K. Version 1. Ohmstead. (Dataset). https://doi.org/${d.doi}`);
    const input = await loadVersionDataCiteInput(d.versionId);
    for (const format of ['bibtex', 'ris', 'csl-json'] as const) {
      expect((await getCitation({ user: null, versionId: d.versionId, format })).body).toBe(formatCitation(input, format));
    }
    expect((await getCitation({ user: null, versionId: d.versionId, format: 'ris' })).body).toMatch(/^TY {2}- DATA$/m);
    expect((await rejection(getCitation({ user: null, versionId: d.versionId, format: 'docx' }))).status).toBe(422);
  });

  it('shows drafts only to the group, as a preview, and refuses an incomplete record with the field list', async () => {
    const d = await makeDraft(lab, lab.member, 'Preview only');
    expect((await rejection(getDataCiteRecord({ user: null, versionId: d.versionId, format: 'json' }))).status).toBe(404);
    const preview = JSON.parse((await getDataCiteRecord({ user: lab.member, versionId: d.versionId, format: 'json' })).body);
    expect(preview.meta).toEqual({ preview: true });
    await saveMetadata({ user: lab.member, versionId: d.versionId, record: { title: 'Preview only', creators: [] } });
    const e = await rejection(getDataCiteRecord({ user: lab.member, versionId: d.versionId, format: 'xml' }));
    expect([e.status, Object.keys(e.details?.fieldErrors as object).sort()]).toEqual([422, ['creators', 'measurement', 'sample']]);
  });
});
