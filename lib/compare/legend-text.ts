// How a curve cites its source in the legend, the SVG and the CSV header: title, version, DOI, group.
import type { CompareEntry } from './types';

/** The resolvable address of a DOI (DOI Handbook §3.8: https://doi.org/ is the preferred resolver form). */
export function doiUrl(doi: string): string {
  return `https://doi.org/${doi}`;
}

/** Landing page of a version on this hub (relative), for sources without a registered DOI. */
export function versionPath(datasetId: string, versionNumber: number): string {
  return `/datasets/${datasetId}/versions/${versionNumber}`;
}

/** The citation parts of an entry, one string each; local files say that they are not deposited. */
export function citationParts(entry: CompareEntry): string[] {
  if (!entry.source) return [entry.local?.fileName ?? 'local file', 'your local file (not deposited, no DOI)'];
  const s = entry.source;
  return [s.title, `version ${s.versionNumber}`, s.doi ? doiUrl(s.doi) : 'no DOI registered', s.group.name, `file ${s.fileName}`];
}
