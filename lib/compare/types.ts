// The compare view's data model: plain JSON, shared by the server (resolving a basket) and the browser (plotting).
import type { CurvePreview } from '@/lib/transport/summary/types';

/** One curve as the basket stores it: an (x, y) pair of column names in one analysed file of one version. */
export type CurveRef = { versionId: string; fileId: string; x: string; y: string };

/** What a caller may send to add a curve: a version alone picks its main curve; a file alone picks that file's. */
export type CurveRefInput = { versionId?: string; fileId?: string; x?: string; y?: string };

/** Where a curve comes from, as the legend and the CSV header cite it. */
export type CurveSource = {
  datasetId: string;
  versionId: string;
  versionNumber: number;
  title: string;
  /** Version DOI; null when none is registered (then the landing page is the citation). */
  doi: string | null;
  group: { slug: string; name: string };
  fileName: string;
};

/** One axis of a curve: the column name in the file, what it measures, and the unit of its values (SI). */
export type CurveAxis = { column: string; quantity: string; ucum: string | null };

/** One curve a file offers, with its display preview (LTTB-downsampled, SI). */
export type CurveOption = {
  x: CurveAxis;
  y: CurveAxis;
  derived: boolean;
  sourcePoints: number;
  points: [number, number][];
};

/** A basket entry ready to plot: where it is from, which curve was chosen, and every curve its file offers. */
export type CompareEntry = {
  /** Stable key: the basket item id, or `local:<n>` for a dropped file. */
  key: string;
  /** Null for a local file (never stored on the server). */
  ref: CurveRef | null;
  /** Null for a local file. */
  source: CurveSource | null;
  /** Set for a local file: its name and what was read of it. */
  local?: { fileName: string; note: string | null };
  chosen: { x: string; y: string };
  options: CurveOption[];
};

/** A basket item that cannot be shown any more (withdrawn, embargoed, access lost, curve gone), with the reason. */
export type UnavailableEntry = { key: string; ref: CurveRef | CurveRefInput; message: string };

export type ResolvedBasket = { entries: CompareEntry[]; unavailable: UnavailableEntry[] };

/** Converts a stored preview to a CurveOption (the quantities come from quantityOfAxis). */
export type PreviewLike = Pick<CurvePreview, 'x' | 'y' | 'xUcum' | 'yUcum' | 'sourcePoints' | 'points' | 'derived'>;
