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
  d.derived.push({
    key: 'rrr',
    label: `RRR = ${rho ? 'ρ' : 'R'}(${result.high.requestedK} K)/${rho ? 'ρ' : 'R'}(${result.low.requestedK} K)`,
    value: round(result.rrr),
    ucum: '1',
    method: 'ratio of the x-binned curve interpolated linearly at both references (Splett et al., J. Res. NIST 116, 489 (2011))',
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
