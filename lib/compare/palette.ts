// Curve styles that stay apart for colour-blind readers and in greyscale print: a colour-blind-safe palette
// (Okabe & Ito 2008, "Color Universal Design") and, on top, a different dash pattern for every curve.

// Okabe–Ito without its yellow (#F0E442 has a 1.3:1 contrast on white, too faint for a line).
const COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'] as const;

// Dash patterns in px (on, off, …); [] is a solid line. Twelve patterns for the basket's twelve curves.
const DASHES: readonly (readonly number[])[] = [
  [], [9, 4], [2, 3], [12, 3, 2, 3], [5, 5], [14, 4, 2, 4, 2, 4], [1, 4], [8, 3, 8, 3, 2, 3], [20, 5], [3, 2, 3, 6], [16, 3, 4, 3], [6, 2],
];

export type CurveStyle = { colour: string; dash: readonly number[]; dashName: string };

const DASH_NAMES = [
  'solid', 'dashed', 'dotted', 'dash-dot', 'even dashes', 'dash-dot-dot', 'sparse dots', 'double dash-dot', 'long dashes',
  'paired short dashes', 'long dash-short dash', 'short dashes',
];

/** Style of the i-th curve (0-based): colours cycle every 7, dash patterns every 12, so no two of 12 curves match. */
export function curveStyle(i: number): CurveStyle {
  const d = i % DASHES.length;
  return { colour: COLOURS[i % COLOURS.length], dash: DASHES[d], dashName: DASH_NAMES[d] };
}

export const PALETTE_SIZE = COLOURS.length;
