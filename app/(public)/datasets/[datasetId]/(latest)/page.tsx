import type { Metadata } from 'next';
import { DatasetLanding } from '@/components/dataset/dataset-landing';
import { landingMetadata, loadLanding, noteLandingVisit } from '../load-landing';

export const dynamic = 'force-dynamic';

type Params = { params: Promise<{ datasetId: string }> };

export async function generateMetadata({ params }: Params): Promise<Metadata> {
  return landingMetadata((await params).datasetId);
}

/** A dataset's page: its latest published version, or the latest one this viewer may open. */
export default async function DatasetPage({ params }: Params) {
  const view = await loadLanding((await params).datasetId);
  return <DatasetLanding view={view} usage={await noteLandingVisit(view)} />;
}
