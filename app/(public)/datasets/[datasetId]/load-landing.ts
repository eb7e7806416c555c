import 'server-only';
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { AccessDeniedError } from '@/lib/access';
import { currentUser } from '@/lib/auth/session';
import { getLandingView, landingActorFor } from '@/lib/datasets/get-landing-view';
import type { LandingView } from '@/lib/datasets/landing-types';
import { resolveLandingVersion } from '@/lib/datasets/resolve-landing-version';
import { AppError } from '@/lib/errors';
import { recordUsage } from '@/lib/counter/record-usage';
import { viewerFromHeaders } from '@/lib/counter/request-source';
import { getVersionUsage } from '@/lib/counter/usage-report';
import type { UsageTotals } from '@/lib/counter/usage-totals';
import { log } from '@/lib/log';
import { noteEmbargoEndIfDue } from '@/lib/publishing/notify-embargo-end';
import { headers } from 'next/headers';

function versionNumberOf(text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  if (!/^[1-9]\d{0,5}$/.test(text)) notFound();
  return Number(text);
}

function isHidden(error: unknown): boolean {
  return error instanceof AccessDeniedError || (error instanceof AppError && error.code === 'not_found');
}

const actorFor = cache(async (datasetId: string) => landingActorFor(await currentUser(), datasetId));

/** The cheap part (dataset, versions, view_metadata), for the layouts: a hidden or unknown version is the 404 page. */
export const checkLanding = cache(async (datasetId: string, versionNumber?: string): Promise<void> => {
  const target = { datasetId, versionNumber: versionNumberOf(versionNumber) };
  try {
    await resolveLandingVersion(target, await actorFor(datasetId));
  } catch (error) {
    if (isHidden(error)) notFound();
    throw error;
  }
});

/** Everything the page shows; one load per request, shared by generateMetadata and the page. */
export const loadLanding = cache(async (datasetId: string, versionNumber?: string): Promise<LandingView> => {
  const target = { datasetId, versionNumber: versionNumberOf(versionNumber) };
  try {
    return await getLandingView({ target, actor: await actorFor(datasetId) });
  } catch (error) {
    if (isHidden(error)) notFound();
    throw error;
  }
});

/** Markdown to one plain line of at most `max` characters, for the page description. */
function plainLine(markdown: string, max = 200): string {
  const text = markdown
    .replace(/!?\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/^\s{0,3}(#{1,6}|>|[-*+]|\d+\.)\s+/gm, '')
    .replace(/[*_`~|]+/g, '')
    .replace(/\s+/g, ' ')
    .trim();
  return text.length > max ? `${text.slice(0, max - 1).trimEnd()}…` : text;
}

export async function landingMetadata(datasetId: string, versionNumber?: string): Promise<Metadata> {
  const view = await loadLanding(datasetId, versionNumber);
  const title = `${view.version.title.trim() || 'Untitled dataset'} (version ${view.version.number})`;
  const about = view.record.description ? plainLine(view.record.description)
    : [view.record.sampleName, ...view.record.measurement.map((f) => f.value)].filter(Boolean).join(' · ');
  const isPublic = view.version.state === 'published' || view.version.state === 'withdrawn';
  return {
    title,
    description: about || `A dataset${view.group ? ` of ${view.group.name}` : ''} on Ohmstead.`,
    // Drafts and versions in review are seen only by their group; search engines never should.
    robots: isPublic ? undefined : { index: false, follow: false },
  };
}

/**
 * Side effects of opening a landing page: one COUNTER investigation, and the embargo-ended mail on the first
 * access after the date. Neither may break the page, so failures are logged only.
 */
export async function noteLandingVisit(view: LandingView): Promise<UsageTotals | undefined> {
  const versionId = view.version.id;
  try {
    const user = await currentUser();
    await recordUsage({ versionId, kind: 'investigation', viewer: viewerFromHeaders(await headers(), user?.id ?? null) });
    await noteEmbargoEndIfDue(versionId);
    return await getVersionUsage(versionId);
  } catch (error) {
    log('warn', 'landing visit not recorded', { versionId, error: error instanceof Error ? error.message : String(error) });
    return undefined;
  }
}
