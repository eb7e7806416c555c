import type { Metadata } from 'next';
import { headers } from 'next/headers';
import { notFound } from 'next/navigation';
import { DatasetLanding } from '@/components/dataset/dataset-landing';
import { AccessDeniedError } from '@/lib/access';
import { viewerFromHeaders } from '@/lib/counter/request-source';
import { getLandingView } from '@/lib/datasets/get-landing-view';
import type { LandingView } from '@/lib/datasets/landing-types';
import { log } from '@/lib/log';
import { recordLinkUse } from '@/lib/review/record-link-use';
import type { ResolvedLink } from '@/lib/review/resolve-reviewer-link';
import { LinkProblemPage } from './link-problem';
import { loadReviewLink, reviewPaths } from './load-review';
import { PackageLink } from './package-link';

export const dynamic = 'force-dynamic';

type Params = { params: Promise<{ token: string }> };

export const metadata: Metadata = { title: 'Confidential review copy' };

/** The dataset page as the link allows it; null when the link stopped working between layout and page. */
async function loadView(link: ResolvedLink, token: string): Promise<LandingView | null> {
  const paths = reviewPaths(token);
  try {
    return await getLandingView({
      target: { versionId: link.grant.versionId },
      actor: { kind: 'reviewer', link: link.grant },
      anonymousMode: link.grant.anonymous,
      links: { version: () => paths.page, file: paths.file },
    });
  } catch (error) {
    if (error instanceof AccessDeniedError && (error.code === 'link_expired' || error.code === 'link_revoked')) return null;
    if (error instanceof AccessDeniedError || (error as { code?: string })?.code === 'not_found') notFound();
    throw error;
  }
}

/** A referee's view of one dataset version through a private link: no account, a confidentiality band, each view counted. */
export default async function ReviewPage({ params }: Params) {
  const { token } = await params;
  const link = await loadReviewLink(token);
  if (!link.ok) return link.reason === 'not_found' ? notFound() : <LinkProblemPage reason={link.reason} />;
  const view = await loadView(link, token);
  if (!view) return <LinkProblemPage reason="expired" />;

  try {
    await recordLinkUse({ link, event: 'view', viewer: viewerFromHeaders(await headers()) });
  } catch (error) {
    // Counting must never cost the referee the page.
    log('warn', 'could not record a review-link view', { linkId: link.linkId, error: error instanceof Error ? error.message : String(error) });
  }
  const mayDownload = view.allowedActions.includes('download_files') && (view.files?.length ?? 0) > 0;
  return (
    <DatasetLanding view={view} banner={mayDownload ? <PackageLink href={reviewPaths(token).package} /> : undefined} />
  );
}
