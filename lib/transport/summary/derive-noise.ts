import { compareToJohnsonFloor, enbwBoxcar, enbwRcCascade, pointToPointScatter } from '@/lib/transport/physics';
import type { ParsedColumn } from '@/lib/transport/parse';
import { middleBlock } from './curves';
import { firstColumn, round, type Derivation } from './derivation';
import { siOf } from './geometry';

// 20 000 neighbouring points estimate σ to about 0.5 % (relative standard error 1/√(2N)); more only costs time.
const NOISE_BLOCK = 20_000;

function bandwidthHz(d: Derivation): { hz: number; how: string } | null {
  const det = d.metadata?.measurement?.detection;
  const tau = siOf(det?.timeConstant);
  const order = det?.filterOrder ?? (det?.filterSlope ? det.filterSlope / 6 : undefined); // 6 dB/oct per RC stage
  if (tau && order && Number.isInteger(order)) return { hz: enbwRcCascade(order, tau), how: `ENBW of ${order} RC stages, τ = ${tau} s` };
  const window = siOf(det?.averagingWindow);
  if (window) return { hz: enbwBoxcar(window), how: `ENBW of a ${window} s boxcar average` };
  return null;
}

/** Point-to-point scatter of the main y curve, and its ratio to the Johnson–Nyquist floor when R, T, I and Δf are known. */
export function deriveNoise(d: Derivation, y: ParsedColumn): void {
  if (!d.x || !y.converted) return;
  const block = middleBlock(d.x.values, y.values, NOISE_BLOCK);
  if (block.x.length < 8) return;
  // The estimator needs neighbours at distinct x and finite values: an x column that barely changes (a fixed current,
  // a held temperature) leaves too few, and the scatter is then reported as not computed rather than guessed.
  const scatter = pointToPointScatter(block.y, block.x);
  if (!scatter) {
    d.notComputed.push({
      key: `noise.scatter.${y.name}`,
      reason: `Too few neighbouring points with distinct ${d.x.name} values and finite ${y.name} values to estimate the point-to-point scatter.`,
    });
    return;
  }
  let sum = 0;
  for (let i = 0; i < block.y.length; i++) sum += Math.abs(block.y[i]);
  const mean = sum / block.y.length;
  d.derived.push({
    key: `noise.scatter.${y.name}`,
    label: `Point-to-point scatter of ${y.name}`,
    value: round(scatter.sigma, 4),
    ucum: y.siUcum ?? '1',
    method: 'σ of residuals from the line through each point’s neighbours (second-difference estimator)',
    detail: { pointsUsed: scatter.pointsUsed, relative: mean > 0 ? round(scatter.sigma / mean, 4) : 0 },
  });
  const temperature = firstColumn(d, 'temperature');
  const bw = bandwidthHz(d);
  if (y.siUcum !== 'Ohm' || !d.currentA || !temperature?.range || !bw || !(mean > 0)) return;
  const meanT = (temperature.range.min + temperature.range.max) / 2;
  const cmp = compareToJohnsonFloor(scatter.sigma * d.currentA, mean, meanT, bw.hz); // noise in V = σ_R·I
  d.derived.push({
    key: `noise.johnson-ratio.${y.name}`,
    label: 'Measured noise / Johnson–Nyquist floor √(4k_B·T·R·Δf)',
    value: round(cmp.ratio, 4),
    ucum: '1',
    method: `Johnson (1928), Nyquist (1928); ${bw.how}; T and R at the middle of their ranges`,
    detail: { noiseV: round(cmp.noiseV, 4), johnsonFloorV: round(cmp.johnsonFloorV, 4), bandwidthHz: round(bw.hz, 4) },
  });
}
