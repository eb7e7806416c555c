import { rcCascadeSettlingTime } from '../../physics/enbw';
import { formatSi, sig3 } from '../format';
import type { MeasurementContext, QualityRule } from '../types';

// An n-pole RC filter settles to 99 % of a step in t₉₉ = 4.61τ (n=1), 6.64τ (2), 8.41τ (3), 10.0τ (4) — the
// Erlang step response 1 − e^(−t/τ)Σ_{k<n}(t/τ)^k/k! — and delays a slow ramp by nτ (its group delay at DC).
// A point recorded sooner than t₉₉ after the previous one is not settled (rule of thumb "wait ~5τ" is the 1-pole case).
export const SETTLE_FRACTION = 0.01;
export const SETTLE_SERIOUS_FACTOR = 10;

function lagText(sweep: NonNullable<MeasurementContext['sweep']>, lagS: number): string {
  if (sweep.ratePerS === undefined) return '';
  const shift = Math.abs(sweep.ratePerS) * lagS;
  const unit = { temperature: 'K', field: 'T', current: 'A', frequency: 'Hz', time: 's', angle: '', other: '' }[sweep.variable];
  const amount = sweep.variable === 'angle' ? `${sig3((shift * 180) / Math.PI)}°` : unit ? formatSi(shift, unit) : sig3(shift);
  return ` At the sweep rate the curve lags by about ${amount} in ${sweep.variable}.`;
}

export const lockInTooSlowForSweep: QualityRule = (c) => {
  const lockIn = c.detection === 'analog-lock-in' || c.detection === 'digital-lock-in';
  if (!lockIn || !(c.timeConstantS && c.timeConstantS > 0) || !c.sweep) return [];
  const known = c.filterOrder !== undefined && Number.isInteger(c.filterOrder) && c.filterOrder >= 1;
  const order = known ? (c.filterOrder as number) : 1;
  const settleS = rcCascadeSettlingTime(order, c.timeConstantS, SETTLE_FRACTION);
  const lag = lagText(c.sweep, order * c.timeConstantS);
  const interval = c.sweep.pointIntervalS;
  const filter = `${known ? '' : 'at least '}${order}-pole filter with τ = ${formatSi(c.timeConstantS, 's')}`;
  const rule = `t₉₉(n, τ) > point interval (warning), > ${SETTLE_SERIOUS_FACTOR}× interval (serious); lag = n·τ·rate`;
  const source = 'common practice; settling from the n-pole RC step response (Erlang distribution)';
  if (interval === undefined) {
    if (c.sweep.ratePerS === undefined) return [];
    return [{ code: 'lock-in-sweep-lag', severity: 'info', message: `The ${filter} settles to 99 % in ${formatSi(settleS, 's')}.${lag}`, rule, source }];
  }
  if (settleS <= interval) return [];
  const serious = settleS > SETTLE_SERIOUS_FACTOR * interval;
  return [{
    code: 'lock-in-time-constant-too-long',
    severity: serious ? 'serious' : 'warning',
    message: `The ${filter} needs ${formatSi(settleS, 's')} to settle to 99 %, but points are ${formatSi(interval, 's')} apart: each point still carries the previous ones.${lag} Sweep slower or shorten τ.`,
    rule,
    source,
  }];
};
