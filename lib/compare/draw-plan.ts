// How to draw a curve so that a line never joins points the measurement did not visit in that order: a sweep that
// turns back (warming then cooling, +B to −B and back) is cut into monotonic runs that share the turning point.

/** More turns than this read as noise in x (a jittery thermometer): the curve is drawn as points instead. */
export const MAX_RUNS = 4;

export type Run = { x: number[]; y: number[] };
export type DrawPlan = { kind: 'lines'; runs: Run[] } | { kind: 'points' };

export function drawPlan(x: readonly number[], y: readonly number[]): DrawPlan {
  if (x.length < 2) return { kind: 'points' };
  const runs: Run[] = [{ x: [x[0]], y: [y[0]] }];
  let direction = 0;
  for (let i = 1; i < x.length; i++) {
    const step = Math.sign(x[i] - x[i - 1]);
    if (step !== 0 && direction !== 0 && step !== direction) {
      if (runs.length === MAX_RUNS) return { kind: 'points' };
      runs.push({ x: [x[i - 1]], y: [y[i - 1]] });
    }
    if (step !== 0) direction = step;
    const run = runs[runs.length - 1];
    run.x.push(x[i]);
    run.y.push(y[i]);
  }
  return { kind: 'lines', runs };
}
