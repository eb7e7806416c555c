import 'server-only';
import { assertAllowed, can, NOT_FOUND_REASON, type Actor, type Resource } from '@/lib/access';
import { AppError } from '@/lib/errors';
import { findDatasetIdOfVersion, findLandingDataset, listLandingVersions, type LandingDatasetRow, type LandingVersionRow } from './repo-landing';

/** Which version: a dataset's (latest visible when no number is given), or one version by id (reviewer links). */
export type LandingTarget = { datasetId: string; versionNumber?: number } | { versionId: string };

export type ResolvedLandingVersion = {
  dataset: LandingDatasetRow;
  /** Every version of the dataset, oldest first. */
  versions: LandingVersionRow[];
  /** The versions this actor may open, oldest first. */
  visible: LandingVersionRow[];
  version: LandingVersionRow;
  resources: Map<string, Resource>;
  latestNumber: number;
};

function resourceOf(v: LandingVersionRow, isLatest: boolean): Resource {
  return { versionId: v.id, state: v.state, embargoUntil: v.embargo_until ? new Date(`${v.embargo_until}T00:00:00Z`) : null, isLatest };
}

function choose(target: LandingTarget, versions: LandingVersionRow[], visible: LandingVersionRow[]): LandingVersionRow | undefined {
  if ('versionId' in target) return versions.find((v) => v.id === target.versionId);
  if (target.versionNumber !== undefined) return versions.find((v) => v.version_number === target.versionNumber);
  // The latest published version; else the latest this viewer may open (a tombstone, or the group's own draft).
  return [...visible].reverse().find((v) => v.state === 'published') ?? visible.at(-1);
}

/**
 * Finds the version a landing page shows and checks view_metadata: unknown and hidden versions throw the same
 * not_found AppError; a reviewer link that expired or was revoked throws lib/access's AccessDeniedError.
 */
export async function resolveLandingVersion(target: LandingTarget, actor: Actor, now: Date = new Date()): Promise<ResolvedLandingVersion> {
  const notFound = () => new AppError('not_found', NOT_FOUND_REASON);
  const datasetId = 'versionId' in target ? await findDatasetIdOfVersion(target.versionId) : target.datasetId;
  const dataset = datasetId ? await findLandingDataset(datasetId) : undefined;
  if (!dataset) throw notFound();
  const versions = await listLandingVersions(dataset.dataset_id);
  const latestNumber = Math.max(0, ...versions.map((v) => v.version_number));
  const resources = new Map(versions.map((v) => [v.id, resourceOf(v, v.version_number === latestNumber)]));
  const visible = versions.filter((v) => can(actor, 'view_metadata', resources.get(v.id)!, now));
  const version = choose(target, versions, visible);
  if (!version) throw notFound();
  assertAllowed(actor, 'view_metadata', resources.get(version.id)!, now);
  return { dataset, versions, visible, version, resources, latestNumber };
}
