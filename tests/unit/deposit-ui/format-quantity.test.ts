import { describe, expect, it } from 'vitest';
import { displayScale, formatNumber, formatPlain, formatQuantity, formatRange, formatScientific, unitLabel } from '@/lib/format/quantity';
import { formatClockTime, formatDateTime } from '@/lib/format/date-time';
import { formatAt } from '@/components/deposit/derived/format-at';

describe('formatQuantity (product design, "Numbers")', () => {
  it('prints the design examples: 12.3 mΩ, 4.11×10⁻⁷ Ω·m, 2.5 µΩ·cm', () => {
    expect(formatQuantity(0.0123, 'Ohm')).toBe('12.3 mΩ');
    expect(formatQuantity(4.11e-7, 'Ohm.m')).toBe('4.11×10⁻⁷ Ω·m (41.1 µΩ·cm)');
    // 2.5 µΩ·cm = 2.5e-8 Ω·m (1 µΩ·cm = 1e-8 Ω·m).
    expect(formatQuantity(2.5e-8, 'Ohm.m')).toBe('2.5×10⁻⁸ Ω·m (2.5 µΩ·cm)');
  });

  it('chooses the prefix from the magnitude and stops where the trade stops', () => {
    expect(formatQuantity(43_959_242.67, 'Ohm')).toBe('44 MΩ');
    expect(formatQuantity(0.000254648, 'Ohm')).toBe('255 µΩ');
    expect(formatQuantity(1e-3, 'A')).toBe('1 mA');
    expect(formatQuantity(0.05, 'K')).toBe('50 mK');
    expect(formatQuantity(300, 'K')).toBe('300 K');
    expect(formatQuantity(1500, 'K')).toBe('1500 K'); // never kK
    expect(formatQuantity(3600, 's')).toBe('3600 s'); // never ks
    expect(formatQuantity(1234, 'Ohm/{sq}')).toBe('1.23 kΩ/sq');
    expect(formatQuantity(999.96, 'Ohm')).toBe('1 kΩ'); // rounds up into the next prefix, not '1000 Ω'
  });

  it('keeps compound units and pure numbers unprefixed', () => {
    expect(formatQuantity(154.8966, '1')).toBe('155');
    expect(formatQuantity(2.5e22, 'm-3')).toBe('2.5×10²² m⁻³');
    expect(formatQuantity(-1.2e-3, 'm3/C')).toBe('−0.0012 m³/C');
    expect(formatQuantity(12.5, '%')).toBe('12.5%');
  });

  it('formats bare numbers with three significant digits and typeset signs', () => {
    expect(formatPlain(-0.012345)).toBe('−0.0123');
    expect(formatPlain(45.3)).toBe('45.3');
    expect(formatPlain(2)).toBe('2');
    expect(formatScientific(1e-9)).toBe('1×10⁻⁹');
    expect(formatScientific(1e-9, 3, true)).toBe('10⁻⁹');
    expect(formatNumber(123_456)).toBe('1.23×10⁵');
    expect(formatNumber(Number.NaN)).toBe('—');
  });

  it('names units the way the trade writes them', () => {
    expect(unitLabel('uOhm.cm')).toBe('µΩ·cm');
    expect(unitLabel('cm2/(V.s)')).toBe('cm²/(V·s)');
    expect(unitLabel('[in_i]')).toBe('in');
    expect(unitLabel('1')).toBe('');
  });

  it('scales axes: metals in µΩ·cm, semiconductors in Ω·cm, field in mT below 1 T', () => {
    expect(displayScale('Ohm.m', 1.7e-8)).toEqual({ factor: 1e8, ucum: 'uOhm.cm', label: 'µΩ·cm' });
    expect(displayScale('Ohm.m', 0.05)).toEqual({ factor: 100, ucum: 'Ohm.cm', label: 'Ω·cm' });
    expect(displayScale('T', 0.2)).toEqual({ factor: 1000, ucum: 'mT', label: 'mT' });
    expect(displayScale('T', 9)).toEqual({ factor: 1, ucum: 'T', label: 'T' });
    expect(displayScale('K', 300).label).toBe('K');
  });

  it('prints ranges with a shared unit when both ends use it', () => {
    expect(formatRange(2, 300, 'K')).toBe('2–300 K');
    expect(formatRange(0, 0, 'T')).toBe('0 T'); // a field held at zero reads as one value
    expect(formatRange(13.7, 13.7, 'Hz')).toBe('13.7 Hz');
    expect(formatRange(0.000254648, 0.04395924, 'Ohm')).toBe('255 µΩ – 44 mΩ');
    // A negative end: 'to' instead of a dash beside the minus sign (common practice).
    expect(formatRange(-1, 1, 'T')).toBe('\u22121 to 1 T');
    expect(formatRange(-9, -2, 'T')).toBe('\u22129 to \u22122 T');
    expect(formatRange(-0.002, 2, 'Ohm')).toBe('\u22122 mΩ to 2 Ω');
  });
});

describe('date-time formatting names the zone', () => {
  it('shows a clock time in the given zone with its name', () => {
    const t = new Date('2026-12-02T13:02:31Z');
    expect(formatClockTime(t, 'UTC')).toBe('13:02:31 (UTC)');
    // Europe/Oslo is UTC+1 in December (CET).
    expect(formatClockTime(t, 'Europe/Oslo')).toBe('14:02:31 (Europe/Oslo)');
    expect(formatDateTime(t, 'Europe/Oslo')).toBe('2 Dec 2026, 14:02 (Europe/Oslo)');
  });
});

describe('where a derived value applies', () => {
  it('reads the summary keys with their units', () => {
    expect(formatAt({ 'temperature[K]': 300 })).toBe('temperature 300 K');
    expect(formatAt({ 'field[T]': 0.05, index: 3 })).toBe('field 50 mT, index 3');
    expect(formatAt(undefined)).toBe('');
  });
});
