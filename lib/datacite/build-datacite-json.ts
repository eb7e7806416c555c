import type { TransportDataset } from '@/lib/schema';
import { invertedName, splitPersonName } from '@/lib/citation/person-name';
import { bareDoi, isoDay, orcidUrl } from './identifiers';
import { SPDX_LIST_URL, spdxLicence } from './spdx-licences';
import { describeTechnicalInfo, quantityLabel } from './technical-summary';
import {
  DATACITE_NAMESPACE,
  type DataCiteAttributes,
  type DataCiteContributor,
  type DataCiteCreator,
  type DataCiteInput,
  type DataCiteRelatedIdentifier,
  type OrganisationRef,
} from './types';

export const RESOURCE_TYPE = 'Electrical transport measurements';
const ORCID_SCHEME_URI = 'https://orcid.org';
const ROR_SCHEME_URI = 'https://ror.org';
// OECD Fields of Science and Technology, as in DataCite's own 4.7 example records.
const FOS_SUBJECT = {
  subject: 'FOS: Physical sciences',
  subjectScheme: 'Fields of Science and Technology (FOS)',
  schemeUri: 'http://www.oecd.org/science/inno/38235147.pdf',
};

const rorAffiliation = (org: OrganisationRef) =>
  org.rorId
    ? { name: org.name, affiliationIdentifier: org.rorId, affiliationIdentifierScheme: 'ROR', schemeUri: ROR_SCHEME_URI }
    : { name: org.name };

function creators(record: TransportDataset): DataCiteCreator[] {
  return record.creators.map((creator) => {
    const name = splitPersonName(creator.name);
    return {
      name: invertedName(name),
      nameType: 'Personal',
      ...(name.given ? { givenName: name.given } : {}),
      familyName: name.family,
      nameIdentifiers: creator.orcid
        ? [{ nameIdentifier: orcidUrl(creator.orcid), nameIdentifierScheme: 'ORCID', schemeUri: ORCID_SCHEME_URI }]
        : [],
      affiliation: (creator.affiliation ?? []).map(rorAffiliation),
    };
  });
}

function groupContributor(group: OrganisationRef): DataCiteContributor {
  return {
    name: group.name,
    nameType: 'Organizational',
    contributorType: 'ResearchGroup',
    nameIdentifiers: group.rorId ? [{ nameIdentifier: group.rorId, nameIdentifierScheme: 'ROR', schemeUri: ROR_SCHEME_URI }] : [],
    affiliation: [],
  };
}

function subjects(record: TransportDataset): DataCiteAttributes['subjects'] {
  const seen = new Set<string>();
  const plain: { subject: string }[] = [];
  for (const text of [...(record.keywords ?? []), record.sample.material, record.sample.formula, quantityLabel(record.measurement.quantity)]) {
    const subject = text?.trim();
    if (!subject || seen.has(subject.toLowerCase())) continue;
    seen.add(subject.toLowerCase());
    plain.push({ subject });
  }
  return [...plain, FOS_SUBJECT];
}

function dates(input: DataCiteInput): DataCiteAttributes['dates'] {
  const out: DataCiteAttributes['dates'] = [{ date: isoDay(input.publishedAt), dateType: 'Issued' }];
  if (input.embargoUntil) out.push({ date: isoDay(input.embargoUntil), dateType: 'Available' });
  if (input.withdrawn) {
    const reason = input.withdrawn.reason?.trim();
    out.push({ date: isoDay(input.withdrawn.at), dateType: 'Withdrawn', ...(reason ? { dateInformation: reason } : {}) });
  }
  return out;
}

function versionRelations(input: DataCiteInput): DataCiteRelatedIdentifier[] {
  const dataset = (doi: string, relationType: string): DataCiteRelatedIdentifier => ({
    relatedIdentifier: bareDoi(doi),
    relatedIdentifierType: 'DOI',
    relationType,
    resourceTypeGeneral: 'Dataset',
  });
  if (input.kind === 'concept') return (input.versionDois ?? []).map((doi) => dataset(doi, 'HasVersion'));
  return [
    dataset(input.conceptDoi, 'IsVersionOf'),
    ...(input.previousVersionDoi ? [dataset(input.previousVersionDoi, 'IsNewVersionOf')] : []),
    ...(input.nextVersionDoi ? [dataset(input.nextVersionDoi, 'IsPreviousVersionOf')] : []),
  ];
}

function relatedIdentifiers(input: DataCiteInput): DataCiteRelatedIdentifier[] {
  const fromRecord = (input.record.relatedIdentifiers ?? []).map((r) => ({
    relatedIdentifier: r.identifierType === 'DOI' ? bareDoi(r.identifier) : r.identifier.trim(),
    relatedIdentifierType: r.identifierType,
    relationType: r.relationType,
  }));
  const seen = new Set<string>();
  return [...versionRelations(input), ...fromRecord].filter((r) => {
    const key = `${r.relationType} ${r.relatedIdentifierType} ${r.relatedIdentifier.toLowerCase()}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

function rightsList(record: TransportDataset): DataCiteAttributes['rightsList'] {
  if (!record.license) return [];
  const licence = spdxLicence(record.license);
  return [
    { rights: licence.name, rightsUri: licence.url, rightsIdentifier: licence.id, rightsIdentifierScheme: 'SPDX', schemeUri: SPDX_LIST_URL },
  ];
}

function descriptions(input: DataCiteInput): DataCiteAttributes['descriptions'] {
  const lang = input.language ? { lang: input.language } : {};
  const abstract = input.record.description?.trim();
  return [
    ...(abstract ? [{ description: abstract, descriptionType: 'Abstract', ...lang }] : []),
    { description: describeTechnicalInfo(input.record), descriptionType: 'TechnicalInfo', ...lang },
  ];
}

function fundingReferences(record: TransportDataset): DataCiteAttributes['fundingReferences'] {
  return (record.funding ?? []).map((f) => ({
    funderName: f.funderName,
    ...(f.funderIdentifier
      ? {
          funderIdentifier: f.funderIdentifier,
          funderIdentifierType: f.funderIdentifierType ?? 'Other',
          ...(f.funderIdentifierType === 'ROR' ? { schemeUri: ROR_SCHEME_URI } : {}),
        }
      : {}),
    ...(f.awardNumber ? { awardNumber: f.awardNumber } : {}),
    ...(f.awardTitle ? { awardTitle: f.awardTitle } : {}),
  }));
}

// Characters XML 1.0 cannot carry (§2.2); dropped from every string so the JSON and the XML say the same thing.
const NOT_XML = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;
function withoutControlCharacters<T>(value: T): T {
  if (typeof value === 'string') return value.replace(NOT_XML, '') as T;
  if (Array.isArray(value)) return value.map(withoutControlCharacters) as T;
  if (value && typeof value === 'object')
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, withoutControlCharacters(v)])) as T;
  return value;
}

function assertUsable(input: DataCiteInput): void {
  if (!bareDoi(input.doi)) throw new RangeError('A DataCite record needs a DOI.');
  if (!Number.isInteger(input.publicationYear) || input.publicationYear < 1000 || input.publicationYear > 9999)
    throw new RangeError(`publicationYear must be a four-digit year, got ${input.publicationYear}.`);
  if (!input.record.title.trim()) throw new RangeError('A DataCite record needs a title.');
  if (input.kind === 'concept' && !input.versionDois?.length) throw new RangeError('A concept record lists its version DOIs.');
}

/** The `attributes` of a DataCite REST API `dois` resource for one version or for the all-versions (concept) DOI. */
export function buildDataCiteJson(input: DataCiteInput): DataCiteAttributes {
  assertUsable(input);
  const { record, files } = input;
  const totalBytes = files.reduce((sum, f) => sum + f.sizeBytes, 0);
  return withoutControlCharacters({
    doi: bareDoi(input.doi),
    url: input.landingUrl,
    types: { resourceTypeGeneral: 'Dataset', resourceType: RESOURCE_TYPE, schemaOrg: 'Dataset', citeproc: 'dataset', bibtex: 'misc', ris: 'DATA' },
    creators: creators(record),
    titles: [{ title: record.title.trim(), ...(input.language ? { lang: input.language } : {}) }],
    publisher: {
      name: input.publisher.name,
      ...(input.publisher.rorId
        ? { publisherIdentifier: input.publisher.rorId, publisherIdentifierScheme: 'ROR', schemeUri: ROR_SCHEME_URI }
        : {}),
    },
    publicationYear: input.publicationYear,
    subjects: subjects(record),
    contributors: [groupContributor(input.group)],
    dates: dates(input),
    ...(input.language ? { language: input.language } : {}),
    relatedIdentifiers: relatedIdentifiers(input),
    sizes: files.length ? [`${files.length} ${files.length === 1 ? 'file' : 'files'}`, `${totalBytes} bytes`] : [],
    formats: [...new Set(files.map((f) => f.format.trim()).filter(Boolean))],
    ...(input.kind === 'version' ? { version: String(input.versionNumber) } : {}),
    rightsList: rightsList(record),
    descriptions: descriptions(input),
    fundingReferences: fundingReferences(record),
    schemaVersion: DATACITE_NAMESPACE,
  } satisfies DataCiteAttributes);
}
