// The curve "Add to compare" takes when the caller names only a dataset version or a file: the one a transport
// reader compares first — an intrinsic quantity (ρ, then R_s) over temperature, then field — else the first curve.
import type { CurveOption } from './types';

const Y_RANK: Readonly<Record<string, number>> = {
  resistivity: 0, 'sheet-resistance': 1, resistance: 2, 'hall-resistance': 3, magnetoresistance: 4, 'hall-resistivity': 5, conductivity: 6, conductance: 7,
};
const X_RANK: Readonly<Record<string, number>> = { temperature: 0, field: 1 };

const rank = (o: CurveOption) => (Y_RANK[o.y.quantity] ?? 9) * 10 + (X_RANK[o.x.quantity] ?? 5);

/** Index of the preferred curve among `options` (ties go to the earlier one), or -1 when none has two points. */
export function defaultCurveIndex(options: readonly CurveOption[]): number {
  let best = -1;
  options.forEach((o, i) => {
    if (o.points.length < 2) return;
    if (best < 0 || rank(o) < rank(options[best])) best = i;
  });
  return best;
}
