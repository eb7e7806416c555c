import 'server-only';
import { CITATION_FORMATS, formatCitation, type CitationFormat } from '@/lib/citation';
import { validateTransportDataset } from '@/lib/schema';
import { buildDatasetJsonLd, serializeJsonLd, variablesFromSummaries } from '@/lib/jsonld';
import { versionInput } from '@/lib/publishing/datacite-input';
import type { DatasetRegistrationRows, PublishedFileRow } from '@/lib/publishing/repo';
import type { FileSummary } from '@/lib/transport/summary/types';
import type { LandingDatasetRow, LandingFileRow, LandingVersionRow } from './repo-landing';

// Citations and schema.org JSON-LD of one version, from the same DataCite input the DOI registration sends.

export type CitationParts = { citations: Record<CitationFormat, string> | null; citationNote: string | null; jsonLd: string | null };

export type CitationArgs = {
  dataset: LandingDatasetRow;
  versions: LandingVersionRow[];
  version: LandingVersionRow;
  /** Files the public record lists (none once withdrawn). */
  files: LandingFileRow[];
  summaries: FileSummary[];
  /** False while files are embargoed: JSON-LD then names the variables without their measured ranges. */
  rangesPublic: boolean;
  landingUrl: string;
  /** Absolute download address of a file, for JSON-LD's contentUrl. */
  fileUrl: (fileId: string) => string;
  anonymousMode: boolean;
  now: Date;
};

const PUBLIC_STATES = new Set(['published', 'withdrawn']);

function registrationRows(a: CitationArgs): DatasetRegistrationRows {
  return {
    datasetId: a.dataset.dataset_id,
    conceptDoi: a.dataset.concept_doi,
    group: { name: a.dataset.group_name, rorId: a.dataset.group_ror_id },
    versions: a.versions,
  };
}

const publishedFileRows = (files: LandingFileRow[]): PublishedFileRow[] =>
  files.map((f) => ({ name: f.name, size_bytes: f.size_bytes, media_type: f.media_type, sha256: f.sha256 }));

/** Why a version has no citation yet, or null when it can be cited. */
function citationGap(a: CitationArgs): string | null {
  if (a.anonymousMode) return 'The citation names the authors, so it is left out of this anonymous review copy.';
  if (!PUBLIC_STATES.has(a.version.state)) return 'A citation is offered once this version is published and its DOI registered.';
  if (!a.version.doi || !a.dataset.concept_doi) return 'This version has no DOI yet, so it cannot be cited here; the DOI is assigned shortly.';
  if (!validateTransportDataset(a.version.metadata).ok) return 'The metadata of this version is incomplete, so no citation can be formatted.';
  return null;
}

/** The four citation formats (formatted here, on the server) and the JSON-LD, or why there are none. */
export function buildCitationParts(a: CitationArgs): CitationParts {
  const gap = citationGap(a);
  if (gap) return { citations: null, citationNote: gap, jsonLd: null };
  const input = versionInput(registrationRows(a), a.version, publishedFileRows(a.files), a.now);
  const citations = Object.fromEntries(
    (Object.keys(CITATION_FORMATS) as CitationFormat[]).map((format) => [format, formatCitation(input, format)]),
  ) as Record<CitationFormat, string>;
  const downloads = new Map(a.files.map((f) => [f.name, a.fileUrl(f.id)]));
  const variables = variablesFromSummaries(a.summaries).map((v) => (a.rangesPublic ? v : { name: v.name, quantity: v.quantity, ucum: v.ucum }));
  const jsonLd = buildDatasetJsonLd({
    ...input,
    landingUrl: a.landingUrl,
    files: input.files.map((f) => ({ ...f, downloadUrl: downloads.get(f.name) })),
    variables,
    now: a.now,
  });
  return { citations, citationNote: null, jsonLd: serializeJsonLd(jsonLd) };
}
