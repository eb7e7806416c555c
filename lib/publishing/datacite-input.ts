import 'server-only';
import type { DataCiteInput, PublishedFile } from '@/lib/datacite';
import { AppError } from '@/lib/errors';
import { requireCompleteRecord } from './complete-record';
import {
  datasetIdOfVersion, listPublishedFiles, loadDatasetRegistrationRows, type DatasetRegistrationRows, type PublishedFileRow,
  type RegistrationVersionRow,
} from './repo';
import { conceptLandingUrl, versionLandingUrl } from './urls';

// From database rows to the pure builders' input (lib/datacite, lib/citation, lib/jsonld all take DataCiteInput).

/** The hub as publisher of every record. */
export const PUBLISHER = { name: 'Ohmstead' } as const;

/** Versions that hold a registered DOI (published, or withdrawn after publication), oldest first. */
export function registeredVersions(rows: DatasetRegistrationRows): RegistrationVersionRow[] {
  return rows.versions.filter((v) => (v.state === 'published' || v.state === 'withdrawn') && v.doi && v.published_at);
}

function toPublishedFiles(files: PublishedFileRow[]): PublishedFile[] {
  return files.map((f) => ({ name: f.name, sizeBytes: f.size_bytes, format: f.media_type || 'application/octet-stream', ...(f.sha256 ? { sha256: f.sha256 } : {}) }));
}

/**
 * The record of one version. Unpublished versions get a preview: published "now", the requested embargo.
 * Throws 422 when the metadata is not complete.
 */
export function versionInput(rows: DatasetRegistrationRows, v: RegistrationVersionRow, files: PublishedFileRow[], now = new Date()): DataCiteInput {
  if (!v.doi || !rows.conceptDoi) throw new AppError('conflict', 'This version has no DOI yet.');
  const registered = registeredVersions(rows);
  const previous = registered.filter((r) => r.version_number < v.version_number).at(-1);
  const next = registered.find((r) => r.version_number > v.version_number);
  const isPublic = v.state === 'published' || v.state === 'withdrawn';
  const publishedAt = isPublic && v.published_at ? new Date(v.published_at) : now;
  return {
    doi: v.doi,
    kind: 'version',
    conceptDoi: rows.conceptDoi,
    versionNumber: v.version_number,
    ...(previous?.doi ? { previousVersionDoi: previous.doi } : {}),
    ...(next?.doi && isPublic ? { nextVersionDoi: next.doi } : {}),
    record: requireCompleteRecord(v.metadata, 'described as a DataCite record'),
    publisher: PUBLISHER,
    group: { name: rows.group.name, ...(rows.group.rorId ? { rorId: rows.group.rorId } : {}) },
    publicationYear: publishedAt.getUTCFullYear(),
    publishedAt,
    embargoUntil: isPublic ? v.embargo_until : v.requested_embargo_until,
    withdrawn: v.state === 'withdrawn' && v.withdrawn_at ? { at: new Date(v.withdrawn_at), reason: v.withdrawal_reason ?? undefined } : null,
    files: toPublishedFiles(files),
    landingUrl: versionLandingUrl(v.id),
  };
}

/** The all-versions record: the latest published version's metadata, HasVersion for every registered version. */
export function conceptInput(rows: DatasetRegistrationRows, latestFiles: PublishedFileRow[]): DataCiteInput | null {
  const registered = registeredVersions(rows);
  if (!rows.conceptDoi || registered.length === 0) return null;
  const latest = registered.filter((r) => r.state === 'published').at(-1) ?? registered.at(-1)!;
  const first = new Date(registered[0].published_at!);
  return {
    doi: rows.conceptDoi,
    kind: 'concept',
    conceptDoi: rows.conceptDoi,
    versionNumber: latest.version_number,
    versionDois: registered.map((r) => r.doi!),
    record: requireCompleteRecord(latest.metadata, 'described as a DataCite record'),
    publisher: PUBLISHER,
    group: { name: rows.group.name, ...(rows.group.rorId ? { rorId: rows.group.rorId } : {}) },
    publicationYear: first.getUTCFullYear(),
    publishedAt: first,
    files: toPublishedFiles(latestFiles),
    landingUrl: conceptLandingUrl(rows.datasetId),
  };
}

/** The version whose metadata the concept record carries (for loading its files). */
export function conceptSourceVersion(rows: DatasetRegistrationRows): RegistrationVersionRow | undefined {
  const registered = registeredVersions(rows);
  return registered.filter((r) => r.state === 'published').at(-1) ?? registered.at(-1);
}

/** DataCiteInput for one version, loaded from the database (for the API, landing pages and citations). */
export async function loadVersionDataCiteInput(versionId: string, now = new Date()): Promise<DataCiteInput> {
  const datasetId = await datasetIdOfVersion(versionId);
  const rows = datasetId ? await loadDatasetRegistrationRows(datasetId) : undefined;
  const version = rows?.versions.find((v) => v.id === versionId);
  if (!rows || !version) throw new AppError('not_found', 'We could not find this dataset version, or you do not have access to it.');
  return versionInput(rows, version, await listPublishedFiles(versionId), now);
}
