import type { Metadata } from 'next';
import { DatasetLanding } from '@/components/dataset/dataset-landing';
import { landingMetadata, loadLanding, noteLandingVisit } from '../../load-landing';

export const dynamic = 'force-dynamic';

type Params = { params: Promise<{ datasetId: string; versionNumber: string }> };

export async function generateMetadata({ params }: Params): Promise<Metadata> {
  const { datasetId, versionNumber } = await params;
  return landingMetadata(datasetId, versionNumber);
}

/** One version of a dataset (what its version DOI resolves to). */
export default async function DatasetVersionPage({ params }: Params) {
  const { datasetId, versionNumber } = await params;
  const view = await loadLanding(datasetId, versionNumber);
  return <DatasetLanding view={view} usage={await noteLandingVisit(view)} />;
}
