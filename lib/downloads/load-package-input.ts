import 'server-only';
import type { DataCiteInput } from '@/lib/datacite';
import { AppError } from '@/lib/errors';
import { plural } from '@/lib/format/plural';
import type { PackageInput } from '@/lib/packages/types';
import { loadVersionDataCiteInput } from '@/lib/publishing/datacite-input';
import type { VersionRow } from '@/lib/datasets/repo-versions';
import type { Downloader } from './authorise-download';
import { listDownloadableFiles } from './repo';

async function versionRecord(versionId: string, now: Date): Promise<DataCiteInput> {
  try {
    return await loadVersionDataCiteInput(versionId, now);
  } catch (error) {
    // The package carries the full record (DataCite XML, README, CITATION.cff): a draft still missing fields has none.
    if (error instanceof AppError && error.code === 'validation_failed') {
      const fields = Object.keys(error.details?.fieldErrors ?? {}).length;
      throw new AppError(
        'conflict',
        `This version cannot be packaged until its measurement record is complete (${plural(fields, 'field')} to fix). Its files can still be downloaded one by one.`,
        error.details,
      );
    }
    throw error;
  }
}

/**
 * What the package of a version is built from: its DataCite record and verified files. A reviewer's copy is marked
 * confidential (reviewCopy), and in anonymous mode leaves out creators, affiliations and the group; drafts and
 * versions in review claim no publication date (unpublished). The worker's cache builds load it as an anonymous user's.
 */
export async function loadPackageInput(grant: { version: Pick<VersionRow, 'id' | 'state'> }, downloader: Downloader, now: Date): Promise<PackageInput> {
  const record: Partial<DataCiteInput> = await versionRecord(grant.version.id, now);
  // The payload list comes from the files below; the kind is always 'version' for a package.
  delete record.files;
  delete record.kind;
  const metadata = record as PackageInput['metadata'];
  const files = await listDownloadableFiles(grant.version.id);
  const reviewer = downloader.kind === 'reviewer';
  return {
    metadata,
    files: files.map((f) => ({ name: f.name, sizeBytes: f.sizeBytes, sha256: f.sha256, storageKey: f.storageKey, ...(f.mediaType ? { mediaType: f.mediaType } : {}) })),
    anonymous: reviewer && downloader.link.grant.anonymous,
    reviewCopy: reviewer,
    unpublished: grant.version.state === 'draft' || grant.version.state === 'in_review',
  };
}
