// The DOI fake's rules, free of I/O: states, events and the DataCite mandatory properties.
import { randomInt } from 'node:crypto';

export type DoiState = 'draft' | 'registered' | 'findable';
export type DoiEvent = 'publish' | 'register' | 'hide';
export type Attributes = Record<string, unknown>;
export type ApiError = { status: string; source?: string; title: string };
export type DoiRecord = { doi: string; state: DoiState; attributes: Attributes; created: string; updated: string; registered: string | null };

// DataCite Metadata Schema 4.7, include/datacite-resourceType-v4.xsd: the resourceTypeGeneral enumeration.
export const RESOURCE_TYPE_GENERAL = [
  'Audiovisual', 'Award', 'Book', 'BookChapter', 'Collection', 'ComputationalNotebook', 'ConferencePaper',
  'ConferenceProceeding', 'DataPaper', 'Dataset', 'Dissertation', 'Event', 'Image', 'Instrument', 'InteractiveResource',
  'Journal', 'JournalArticle', 'Model', 'OutputManagementPlan', 'PeerReview', 'PhysicalObject', 'Poster', 'Preprint',
  'Presentation', 'Project', 'Report', 'Service', 'Software', 'Sound', 'Standard', 'StudyRegistration', 'Text',
  'Workflow', 'Other',
] as const;

/** Fields the server owns; a client cannot set them as metadata. */
export const CONTROL_FIELDS = new Set(['doi', 'prefix', 'suffix', 'event', 'state', 'created', 'updated', 'registered', 'isActive']);

const unprocessable = (source: string, title: string): ApiError => ({ status: '422', source, title });

export function isApiError(x: unknown): x is ApiError {
  return typeof x === 'object' && x !== null && 'status' in x && 'title' in x;
}

/** DOIs are case-insensitive (DOI Handbook, common practice): keep them lower-case, accept resolver and doi: forms. */
export function normalizeDoi(raw: string): string {
  return raw.trim().replace(/^https?:\/\/(dx\.)?doi\.org\//i, '').replace(/^doi:/i, '').toLowerCase();
}

export function isDoi(doi: string): boolean {
  return /^10\.\d{4,9}\/\S+$/.test(doi);
}

// Crockford-style alphabet without look-alikes (i, l, o, u), grouped like common DOI suffixes.
const ALPHABET = 'abcdefghjkmnpqrstvwxyz0123456789';
export function newSuffix(): string {
  const pick = () => Array.from({ length: 4 }, () => ALPHABET[randomInt(ALPHABET.length)]).join('');
  return `${pick()}-${pick()}`;
}

export function parseEvent(raw: unknown): DoiEvent | null | ApiError {
  if (raw === undefined || raw === null || raw === '') return null;
  if (raw === 'publish' || raw === 'register' || raw === 'hide') return raw;
  return unprocessable('event', `event must be one of publish, register, hide (got ${JSON.stringify(raw)})`);
}

/** draft→findable (publish), draft→registered (register), findable→registered (hide), registered→findable (publish). */
export function nextState(state: DoiState, event: DoiEvent | null): DoiState | ApiError {
  if (event === null) return state;
  if (event === 'publish') return 'findable';
  if (event === 'register') {
    if (state === 'findable') return unprocessable('event', 'a findable DOI cannot be registered again; use the hide event to make it registered');
    return 'registered';
  }
  if (state === 'draft') return unprocessable('event', 'a draft DOI cannot be hidden; register or publish it first');
  return 'registered';
}

const nonEmpty = (v: unknown): v is string => typeof v === 'string' && v.trim().length > 0;

function hasNamed(list: unknown, key: string): boolean {
  return Array.isArray(list) && list.length > 0 && list.every((x) => typeof x === 'object' && x !== null && nonEmpty((x as Record<string, unknown>)[key]));
}

/** DataCite Metadata Schema 4.7 mandatory properties (Identifier, Creator, Title, Publisher, PublicationYear, ResourceType) plus the landing URL a registered DOI resolves to. */
export function mandatoryErrors(doi: string, a: Attributes): ApiError[] {
  const errors: ApiError[] = [];
  if (!isDoi(doi)) errors.push(unprocessable('doi', `doi ${JSON.stringify(doi)} is not of the form 10.NNNN/suffix`));
  if (!hasNamed(a.creators, 'name')) errors.push(unprocessable('creators', "creators can't be blank: give at least one creator, each with a name"));
  if (!hasNamed(a.titles, 'title')) errors.push(unprocessable('titles', "titles can't be blank: give at least one title"));
  const pub = a.publisher;
  const pubOk = nonEmpty(pub) || (typeof pub === 'object' && pub !== null && nonEmpty((pub as Record<string, unknown>).name));
  if (!pubOk) errors.push(unprocessable('publisher', "publisher can't be blank (a string or an object with a name)"));
  const year = a.publicationYear;
  if (!((typeof year === 'number' && Number.isInteger(year)) || (typeof year === 'string' && /^\d{4}$/.test(year)))) {
    errors.push(unprocessable('publicationYear', 'publicationYear must be a four-digit year'));
  }
  const general = (a.types as Record<string, unknown> | undefined)?.resourceTypeGeneral;
  if (!(RESOURCE_TYPE_GENERAL as readonly unknown[]).includes(general)) {
    errors.push(unprocessable('types', `types.resourceTypeGeneral must be one of the DataCite 4.7 values (got ${JSON.stringify(general ?? null)})`));
  }
  let urlOk = false;
  try {
    urlOk = nonEmpty(a.url) && ['http:', 'https:'].includes(new URL(a.url).protocol);
  } catch {
    urlOk = false;
  }
  if (!urlOk) errors.push(unprocessable('url', 'url must be the http(s) landing page the DOI resolves to'));
  return errors;
}

export function metadataOf(attrs: Attributes): Attributes {
  return Object.fromEntries(Object.entries(attrs).filter(([k]) => !CONTROL_FIELDS.has(k)));
}

/** JSON:API resource object in the shape the registration agency returns. */
export function toResource(r: DoiRecord) {
  const [prefix, ...rest] = r.doi.split('/');
  return {
    id: r.doi,
    type: 'dois',
    attributes: {
      ...r.attributes,
      doi: r.doi,
      prefix,
      suffix: rest.join('/'),
      state: r.state,
      isActive: r.state === 'findable',
      created: r.created,
      updated: r.updated,
      registered: r.registered,
    },
    relationships: {},
  };
}
