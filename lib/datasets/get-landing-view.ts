import 'server-only';
import { allowedActions, can, decide, isEmbargoed, type Actor, type Decision } from '@/lib/access';
import { doiUrl } from '@/lib/datacite/identifiers';
import { env } from '@/lib/env';
import { validateTransportDataset } from '@/lib/schema';
import { buildCitationParts } from './landing-citations';
import { asFileSummary, buildCurves, buildDerived, type AnalysedFile } from './landing-curves';
import { readCreators, readLandingRecord } from './landing-record';
import type { LandingFile, LandingVersionLink, LandingView, SectionLock } from './landing-types';
import { findLandingDataset, listFileSummaries, listLandingFiles, type LandingFileRow } from './repo-landing';
import { resolveLandingVersion, type LandingTarget } from './resolve-landing-version';
import { actorFor } from './version-access';

export type { LandingTarget } from './resolve-landing-version';

/** Where the page's links point; the reviewer view of a private link passes its own. */
export type LandingLinks = {
  version?: (datasetId: string, versionNumber: number) => string;
  file?: (fileId: string) => string;
};

export type GetLandingViewInput = {
  target: LandingTarget;
  /** Who looks, already resolved for the dataset's group (see landingActorFor) or a reviewer-link grant. */
  actor: Actor;
  /** Hide authors, group, affiliations, related work, citations and JSON-LD; default: the reviewer link's own setting. */
  anonymousMode?: boolean;
  now?: Date;
  links?: LandingLinks;
};

const defaultVersionHref = (datasetId: string, n: number) => `/datasets/${encodeURIComponent(datasetId)}/versions/${n}`;
const defaultFileHref = (fileId: string) => `/api/v1/files/${encodeURIComponent(fileId)}/download`;
const absolute = (path: string) => `${env().NEXTAUTH_URL.replace(/\/+$/, '')}${path}`;
const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

const lockOf = (d: Decision): SectionLock | null => (d.allowed ? null : { code: d.code, reason: d.reason });

/** The signed-in user's standing in the dataset's group, or an anonymous visitor. */
export async function landingActorFor(user: { id: string; siteRole: 'admin' | 'user' } | null, datasetId: string): Promise<Actor> {
  if (!user) return { kind: 'anonymous' };
  const dataset = await findLandingDataset(datasetId);
  return dataset ? actorFor(user, dataset.group_id) : { kind: 'user', userId: user.id, siteRole: user.siteRole };
}

function fileViews(files: LandingFileRow[], downloads: Decision, href: (id: string) => string): LandingFile[] {
  return files.map((f) => ({
    id: f.id, name: f.name, role: f.role, mediaType: f.media_type, sizeBytes: f.size_bytes, sha256: f.sha256,
    downloadUrl: downloads.allowed ? href(f.id) : null,
  }));
}

async function analysedFiles(files: LandingFileRow[]): Promise<AnalysedFile[]> {
  const stored = await listFileSummaries(files.filter((f) => f.analysis_state === 'done').map((f) => f.id));
  return files.flatMap((f) => {
    const summary = asFileSummary(stored.get(f.id));
    return summary ? [{ fileId: f.id, fileName: f.name, summary }] : [];
  });
}

/**
 * Everything a dataset landing page shows, each section as lib/access allows it for `actor` at `now`: the page
 * itself (view_metadata; otherwise a not_found or link refusal is thrown), curves and derived tables (view_curves),
 * file links (download_files). Withdrawn versions keep their metadata and DOI; their files leave the page.
 */
export async function getLandingView(input: GetLandingViewInput): Promise<LandingView> {
  const { target, actor } = input;
  const now = input.now ?? new Date();
  const anonymousMode = input.anonymousMode ?? (actor.kind === 'reviewer' && actor.link.anonymous);
  const versionHref = input.links?.version ?? defaultVersionHref;
  const fileHref = input.links?.file ?? defaultFileHref;

  const { dataset, versions, visible, version, resources, latestNumber: latest } = await resolveLandingVersion(target, actor, now);
  const resource = resources.get(version.id)!;

  const curvesDecision = decide(actor, 'view_curves', resource, now);
  const downloads = decide(actor, 'download_files', resource, now);
  const withdrawn = version.state === 'withdrawn';
  const files = await listLandingFiles(version.id);
  const filesShown = !withdrawn || downloads.allowed;
  const analysed = filesShown ? await analysedFiles(files) : [];
  const embargoed = isEmbargoed(resource, now);
  const anonymousVisitor: Actor = { kind: 'anonymous' };

  const citationParts = buildCitationParts({
    dataset, versions, version, now, anonymousMode,
    files: withdrawn ? [] : files,
    summaries: withdrawn ? [] : analysed.map((a) => a.summary),
    rangesPublic: can(anonymousVisitor, 'view_curves', resource, now),
    landingUrl: absolute(defaultVersionHref(dataset.dataset_id, version.version_number)),
    fileUrl: (id) => absolute(defaultFileHref(id)),
  });

  const versionLinks: LandingVersionLink[] = [...visible].reverse().map((v) => ({
    id: v.id, number: v.version_number, state: v.state, title: v.title, doi: v.doi, publishedAt: iso(v.published_at),
    withdrawnAt: iso(v.withdrawn_at), embargoUntil: v.state === 'published' && isEmbargoed(resources.get(v.id)!, now) ? v.embargo_until : null,
    current: v.id === version.id, href: versionHref(dataset.dataset_id, v.version_number),
  }));

  return {
    dataset: {
      id: dataset.dataset_id, conceptDoi: dataset.concept_doi, conceptDoiUrl: dataset.concept_doi ? doiUrl(dataset.concept_doi) : null,
    },
    version: {
      id: version.id, number: version.version_number, state: version.state, title: version.title, doi: version.doi,
      doiUrl: version.doi ? doiUrl(version.doi) : null, doiRegistered: version.doi_state === 'registered' || version.doi_state === 'findable',
      publishedAt: iso(version.published_at), updatedAt: new Date(version.updated_at).toISOString(), isLatest: version.version_number === latest,
    },
    embargo: version.state === 'published' && version.embargo_until
      ? { until: version.embargo_until, opensAt: `${version.embargo_until}T00:00:00.000Z`, active: embargoed }
      : null,
    withdrawal: withdrawn ? { at: iso(version.withdrawn_at), reason: version.withdrawal_reason } : null,
    anonymousMode,
    creators: anonymousMode ? null : readCreators(version.metadata),
    group: anonymousMode ? null : { slug: dataset.group_slug, name: dataset.group_name, institution: dataset.group_institution },
    record: readLandingRecord(version.metadata, { hideRelated: anonymousMode }),
    recordComplete: validateTransportDataset(version.metadata).ok,
    ...citationParts,
    curves: curvesDecision.allowed ? buildCurves(analysed) : null,
    derived: curvesDecision.allowed ? buildDerived(analysed) : null,
    curvesLock: lockOf(curvesDecision),
    analysis: {
      pending: curvesDecision.allowed ? files.filter((f) => f.analysis_state === 'queued' || f.analysis_state === 'running').length : 0,
      failed: curvesDecision.allowed ? files.filter((f) => f.analysis_state === 'failed').length : 0,
    },
    files: filesShown ? fileViews(files, downloads, fileHref) : null,
    filesLock: lockOf(downloads),
    versions: versionLinks,
    allowedActions: allowedActions(actor, resource, now),
  };
}
