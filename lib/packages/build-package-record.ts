// metadata/ohmstead-record.json: the version's record, identifiers and file list, as one self-describing JSON file.
import { bareDoi, doiUrl } from '@/lib/datacite';
import type { PackageInput, PayloadEntry } from './types';

/** The record's schema (schemas/transport-dataset.schema.json $id). */
export const RECORD_SCHEMA_ID = 'https://ohmstead.example/schemas/transport-dataset/1.0.0';
export const PACKAGE_RECORD_FORMAT = 'ohmstead-package-record/1';

const iso = (value: string | Date) => (value instanceof Date ? value : new Date(value)).toISOString();

/**
 * The JSON text of metadata/ohmstead-record.json. In an anonymous copy `metadata` has no `creators` and there is no
 * `group`; `anonymousReviewCopy: true` says why.
 */
export function buildPackageRecord(input: PackageInput, payload: PayloadEntry[]): string {
  const m = input.metadata;
  const anonymous = input.anonymous === true;
  const { creators, ...withoutCreators } = m.record;
  const doi = bareDoi(m.doi);
  const document = {
    format: PACKAGE_RECORD_FORMAT,
    doi,
    doiUrl: doiUrl(doi),
    conceptDoi: bareDoi(m.conceptDoi),
    versionNumber: m.versionNumber,
    title: m.record.title,
    landingUrl: m.landingUrl,
    publisher: m.publisher.name,
    publicationYear: m.publicationYear,
    publishedAt: iso(m.publishedAt),
    ...(m.embargoUntil ? { embargoUntil: iso(m.embargoUntil) } : {}),
    ...(m.withdrawn ? { withdrawnAt: iso(m.withdrawn.at) } : {}),
    ...(anonymous ? {} : { group: m.group }),
    ...(input.reviewCopy || anonymous ? { reviewCopy: true } : {}),
    ...(anonymous ? { anonymousReviewCopy: true } : {}),
    files: payload.map((p) => ({
      path: p.path,
      ...(p.file.name !== p.path.slice('data/'.length) ? { depositedName: p.file.name } : {}),
      sizeBytes: p.file.sizeBytes,
      sha256: p.file.sha256,
      mediaType: p.file.mediaType ?? 'application/octet-stream',
    })),
    metadataSchema: RECORD_SCHEMA_ID,
    metadata: anonymous ? withoutCreators : { ...withoutCreators, creators },
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}
