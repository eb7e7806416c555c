import type { Affiliation, Creator, FundingReference } from '@/lib/schema';
import type { DataCiteInput, OrganisationRef } from '@/lib/datacite/types';
import { bareDoi, doiUrl, isoDay, orcidUrl } from '@/lib/datacite/identifiers';
import { spdxLicence } from '@/lib/datacite/spdx-licences';
import { describeMeasurementTechnique, describeTechnicalInfo } from '@/lib/datacite/technical-summary';
import { splitPersonName } from '@/lib/citation/person-name';
import { labelFromUcum } from '@/lib/transport/units/label';
import type { MeasuredVariable } from './variables-from-summary';

export type DatasetJsonLdInput = DataCiteInput & {
  /** Measured variables with ranges, e.g. from variablesFromSummaries(). */
  variables?: MeasuredVariable[];
  /** "Today" for the embargo decision; defaults to now. */
  now?: Date;
};

export type JsonLdNode = { [key: string]: unknown };

const organisation = (org: OrganisationRef | Affiliation): JsonLdNode => ({
  '@type': 'Organization',
  ...(org.rorId ? { '@id': org.rorId, identifier: org.rorId } : {}),
  name: org.name,
});

function person(creator: Creator): JsonLdNode {
  const name = splitPersonName(creator.name);
  const orcid = creator.orcid ? orcidUrl(creator.orcid) : undefined;
  return {
    '@type': 'Person',
    ...(orcid ? { '@id': orcid, identifier: orcid } : {}),
    name: name.given ? `${name.given} ${name.family}` : name.family,
    ...(name.given ? { givenName: name.given } : {}),
    familyName: name.family,
    ...(creator.affiliation?.length ? { affiliation: creator.affiliation.map(organisation) } : {}),
  };
}

function funder(f: FundingReference): JsonLdNode {
  const ror = f.funderIdentifierType === 'ROR' ? f.funderIdentifier : undefined;
  return { '@type': 'Organization', ...(ror ? { '@id': ror } : {}), name: f.funderName, ...(f.funderIdentifier ? { identifier: f.funderIdentifier } : {}) };
}

// schema.org unitCode: UN/CEFACT code or URL; "other codes … may be used with a prefix followed by a colon" → "UCUM:Ohm.m".
function variable(v: MeasuredVariable): JsonLdNode {
  return {
    '@type': 'PropertyValue',
    name: v.quantity.replace(/-/g, ' '),
    alternateName: v.name,
    ...(v.ucum ? { unitCode: `UCUM:${v.ucum}`, unitText: labelFromUcum(v.ucum) } : {}),
    ...(v.min !== undefined && Number.isFinite(v.min) ? { minValue: v.min } : {}),
    ...(v.max !== undefined && Number.isFinite(v.max) ? { maxValue: v.max } : {}),
  };
}

/** True while the files are embargoed: the embargo day has not begun yet (UTC). */
export function isEmbargoed(embargoUntil: DataCiteInput['embargoUntil'], now: Date = new Date()): boolean {
  return Boolean(embargoUntil) && isoDay(embargoUntil as string | Date) > now.toISOString().slice(0, 10);
}

/** schema.org `Dataset` JSON-LD for a landing page (https://schema.org/Dataset). */
export function buildDatasetJsonLd(input: DatasetJsonLdInput): JsonLdNode {
  const { record } = input;
  const doi = bareDoi(input.doi);
  const embargoDay = input.embargoUntil && isEmbargoed(input.embargoUntil, input.now) ? isoDay(input.embargoUntil) : undefined;
  const keywords = [...(record.keywords ?? []), ...(record.sample.material ? [record.sample.material] : [])];
  return {
    '@context': 'https://schema.org',
    '@type': 'Dataset',
    '@id': doiUrl(doi),
    name: record.title.trim(),
    description: record.description?.trim() || describeTechnicalInfo(record),
    url: input.landingUrl,
    identifier: [{ '@type': 'PropertyValue', propertyID: 'DOI', value: doi, url: doiUrl(doi) }, doiUrl(doi)],
    creator: record.creators.map(person),
    ...(record.license ? { license: spdxLicence(record.license).url } : {}),
    ...(input.kind === 'version' ? { version: String(input.versionNumber) } : {}),
    datePublished: isoDay(input.publishedAt),
    publisher: organisation(input.publisher),
    sourceOrganization: organisation(input.group),
    includedInDataCatalog: { '@type': 'DataCatalog', name: input.publisher.name },
    ...(input.language ? { inLanguage: input.language } : {}),
    ...(keywords.length ? { keywords } : {}),
    isAccessibleForFree: true,
    ...(embargoDay ? { conditionsOfAccess: `Files are under embargo until ${embargoDay}; the metadata is public.` } : {}),
    ...(input.variables?.length ? { variableMeasured: input.variables.map(variable) } : {}),
    measurementTechnique: describeMeasurementTechnique(record),
    ...(record.funding?.length ? { funder: record.funding.map(funder) } : {}),
    distribution: input.files.map((f) => ({
      '@type': 'DataDownload',
      name: f.name,
      ...(f.downloadUrl ? { contentUrl: f.downloadUrl } : {}),
      encodingFormat: f.format,
      contentSize: `${f.sizeBytes} B`,
      ...(f.sha256 ? { sha256: f.sha256 } : {}),
    })),
  };
}
