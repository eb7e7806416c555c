import { interpolateLinear, sortedCurve, type Curve } from './interpolate';

// Onsager reciprocity: R_xx(B) is even and R_xy(B) odd in B, so the parts
// [f(+B) ± f(−B)]/2 on a common |B| grid remove contact misalignment and offsets.

export type FieldSymmetryOptions = {
  /** |B| grid in T; by default the union of the |B| values of both branches where they overlap. */
  gridT?: readonly number[];
};

export type FieldSymmetryResult = {
  /** Common |B| grid (T), ascending. */
  absFieldT: number[];
  /** The requested part: symmetric for symmetriseOverField, antisymmetric for antisymmetriseOverField. */
  values: number[];
  /** The complementary part (for R_xy the even offset, for R_xx the odd admixture). */
  otherPart: number[];
  grid: {
    source: 'given' | 'union-of-branches';
    minAbsFieldT: number;
    maxAbsFieldT: number;
    positiveBranchPoints: number;
    negativeBranchPoints: number;
    /** Given grid points outside the |B| range both branches cover (never extrapolated). */
    droppedGridPoints: number;
  };
};

function branches(fieldT: readonly number[], values: readonly number[]): { pos: Curve; neg: Curve } {
  if (fieldT.length !== values.length) throw new RangeError(`field and values differ in length (${fieldT.length} vs ${values.length}).`);
  const pos: Curve = { x: [], y: [] };
  const neg: Curve = { x: [], y: [] };
  for (let i = 0; i < fieldT.length; i++) {
    const b = fieldT[i];
    // B = 0 belongs to both branches.
    if (b >= 0) {
      pos.x.push(b);
      pos.y.push(values[i]);
    }
    if (b <= 0) {
      neg.x.push(-b);
      neg.y.push(values[i]);
    }
  }
  return { pos: sortedCurve(pos.x, pos.y), neg: sortedCurve(neg.x, neg.y) };
}

function commonGrid(pos: Curve, neg: Curve, lo: number, hi: number): number[] {
  const tol = 1e-9 * Math.max(hi, 1e-300); // merge |B| values equal to within rounding of the field readout
  const all = [...pos.x, ...neg.x].filter((b) => b >= lo && b <= hi).sort((a, b) => a - b);
  return all.filter((b, i) => i === 0 || b - all[i - 1] > tol);
}

function splitOverField(fieldT: readonly number[], values: readonly number[], options: FieldSymmetryOptions) {
  const { pos, neg } = branches(fieldT, values);
  if (pos.x.length === 0 || neg.x.length === 0) {
    throw new RangeError('Symmetrisation needs data at both positive and negative field (or at B = 0).');
  }
  const lo = Math.max(pos.x[0], neg.x[0]);
  const hi = Math.min(pos.x[pos.x.length - 1], neg.x[neg.x.length - 1]);
  if (lo > hi) throw new RangeError(`The ±B branches do not overlap in |B| (positive ${pos.x[0]}…, negative ${neg.x[0]}… T).`);
  const given = options.gridT ? [...options.gridT].map(Math.abs).sort((a, b) => a - b) : undefined;
  const absFieldT = given ? given.filter((b) => b >= lo && b <= hi) : commonGrid(pos, neg, lo, hi);
  const plus = absFieldT.map((b) => interpolateLinear(pos, b));
  const minus = absFieldT.map((b) => interpolateLinear(neg, b));
  const grid = {
    source: given ? ('given' as const) : ('union-of-branches' as const),
    minAbsFieldT: lo,
    maxAbsFieldT: hi,
    positiveBranchPoints: pos.x.length,
    negativeBranchPoints: neg.x.length,
    droppedGridPoints: given ? given.length - absFieldT.length : 0,
  };
  return { absFieldT, plus, minus, grid };
}

/** Symmetric part [f(+B) + f(−B)]/2 on a common |B| grid (for R_xx); input may be unsorted. */
export function symmetriseOverField(fieldT: readonly number[], values: readonly number[], options: FieldSymmetryOptions = {}): FieldSymmetryResult {
  const s = splitOverField(fieldT, values, options);
  return {
    absFieldT: s.absFieldT,
    values: s.plus.map((p, i) => (p + s.minus[i]) / 2), // Onsager: R_xx(B) = R_xx(−B)
    otherPart: s.plus.map((p, i) => (p - s.minus[i]) / 2),
    grid: s.grid,
  };
}

/** Antisymmetric part [f(+B) − f(−B)]/2 on a common |B| grid (for R_xy); input may be unsorted. */
export function antisymmetriseOverField(fieldT: readonly number[], values: readonly number[], options: FieldSymmetryOptions = {}): FieldSymmetryResult {
  const s = splitOverField(fieldT, values, options);
  return {
    absFieldT: s.absFieldT,
    values: s.plus.map((p, i) => (p - s.minus[i]) / 2), // Onsager: R_xy(B) = −R_xy(−B)
    otherPart: s.plus.map((p, i) => (p + s.minus[i]) / 2),
    grid: s.grid,
  };
}
