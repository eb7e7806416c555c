import { residualResistivityRatio } from '@/lib/transport/physics';
import { binned, curveOf, firstColumn, round, type Derivation } from './derivation';
import { resistanceCurve } from './derive-resistivity';

// RRR is quoted when a curve reaches room temperature and the low-temperature plateau (common practice).
const LOW_ENOUGH_K = 20;
const HIGH_ENOUGH_K = 260;

/** RRR = ρ(273 K or 300 K)/ρ(4.2 K) (Splett et al., J. Res. NIST 116, 489 (2011); IEC 61788-4). */
export function deriveRrr(d: Derivation): void {
  const temperature = firstColumn(d, 'temperature');
  if (!temperature?.range || temperature.siUcum !== 'K') return;
  const { min, max } = temperature.range;
  if (min > LOW_ENOUGH_K || max < HIGH_ENOUGH_K) {
    if (d.sweep.variable === 'temperature') {
      d.notComputed.push({ key: 'rrr', reason: `RRR needs data from ≤ ${LOW_ENOUGH_K} K to ≥ ${HIGH_ENOUGH_K} K; this curve covers ${round(min, 4)}–${round(max, 4)} K.` });
    }
    return;
  }
  const rho = curveOf(d, 'resistivity');
  const y = rho?.y ?? resistanceCurve(d);
  if (!y) return;
  const bins = binned(d, temperature.values, y);
  if (bins.x.length < 2) return;
  const result = residualResistivityRatio(bins.x, bins.y);
  const symbol = rho ? 'ρ' : 'R';
  // The label names the temperatures whose values entered the ratio: a curve that stops above 4.2 K gives a ratio to
  // its lowest temperature, which a reader must not mistake for the liquid-helium one.
  const lowK = result.low.extrapolated ? round(result.low.usedK, 3) : result.low.requestedK;
  const caveats = [
    result.low.extrapolated && `the curve does not reach ${result.low.requestedK} K, so its lowest point (${lowK} K) stands in, assuming the residual plateau`,
    result.high.extrapolated && `${result.high.requestedK} K lies beyond the data; the end segment is extended linearly`,
  ].filter(Boolean);
  d.derived.push({
    key: 'rrr',
    label: `RRR = ${symbol}(${result.high.requestedK} K)/${symbol}(${lowK} K)`,
    value: round(result.rrr),
    ucum: '1',
    method: 'ratio of the x-binned curve interpolated linearly at both references (Splett et al., J. Res. NIST 116, 489 (2011))' +
      (caveats.length ? `; ${caveats.join('; ')}` : ''),
    detail: {
      highK: result.high.requestedK,
      lowK: result.low.requestedK,
      lowUsedK: round(result.low.usedK),
      highExtrapolated: result.high.extrapolated,
      lowHeld: result.low.extrapolated,
      from: rho ? 'resistivity' : 'resistance',
    },
  });
}
