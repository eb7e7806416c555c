import type { ReactNode } from 'react';
import { checkLanding } from '../../load-landing';

/** The version must exist and be visible to this viewer before the page streams (404 otherwise, see the dataset layout). */
export default async function DatasetVersionLayout({ children, params }: {
  children: ReactNode;
  params: Promise<{ datasetId: string; versionNumber: string }>;
}) {
  const { datasetId, versionNumber } = await params;
  await checkLanding(datasetId, versionNumber);
  return children;
}
