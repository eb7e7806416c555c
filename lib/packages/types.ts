import type { DataCiteInput } from '@/lib/datacite';

/** One file of a version as the database knows it; the bytes are in object storage under storageKey. */
export type PackageFile = {
  name: string;
  sizeBytes: number;
  /** Lower-case hex SHA-256 of the bytes (files are content-addressed by it). */
  sha256: string;
  storageKey: string;
  /** Media type, e.g. "text/csv"; default application/octet-stream. */
  mediaType?: string;
};

/** What a package of one version is built from. */
export type PackageInput = {
  /** The version's record and identifiers as the DataCite builder takes them (its `files` come from `files` below). */
  metadata: Omit<DataCiteInput, 'files' | 'kind'>;
  files: PackageFile[];
  /** Reviewer links in anonymous mode: no creator, group or affiliation anywhere in the package. */
  anonymous?: boolean;
  /** A copy made for a reviewer (anonymous or not): the README says it is confidential. */
  reviewCopy?: boolean;
  /** A draft or version in review: no publication date is claimed in README or CITATION.cff. */
  unpublished?: boolean;
  /** Day written as Bagging-Date and as every zip entry's time; default now. */
  baggingDate?: Date;
  /** Name of the bag's top-level folder in the zip; default from the DOI suffix and version number. */
  bagName?: string;
};

/** One file the bag holds: its path in the bag and, for payload, where its bytes come from. */
export type TagEntry = { path: string; content: Buffer };
export type PayloadEntry = { path: string; file: PackageFile };

/** Everything about a bag except the payload bytes: built in memory, then streamed with the payload. */
export type BagPlan = {
  bagName: string;
  /** In zip order: bagit.txt first, tagmanifest-sha256.txt last. */
  tagFiles: TagEntry[];
  payload: PayloadEntry[];
  payloadBytes: number;
  baggingDate: Date;
};
