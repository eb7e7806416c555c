import type { ReactNode } from 'react';
import { checkLanding } from './load-landing';

/**
 * Checks that the dataset exists and this viewer may open one of its versions before any loading boundary streams,
 * so an unknown or hidden dataset answers HTTP 404 (with the site's not-found page) rather than a 200 that says so.
 */
export default async function DatasetLayout({ children, params }: { children: ReactNode; params: Promise<{ datasetId: string }> }) {
  await checkLanding((await params).datasetId);
  return children;
}
