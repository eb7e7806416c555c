import { labelFromUcum } from '@/lib/transport/units/label';

// Numbers with units for people: 3 significant digits, SI prefixes on simple units, ×10ⁿ on compound ones
// (product design, "Numbers": 12.3 mΩ, 4.11×10⁻⁷ Ω·m, 2.5 µΩ·cm). Browser-safe: no UCUM engine, only labels.

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};
const MINUS = '\u2212';

/** SI prefixes with their UCUM letter and their display symbol. */
export const SI_PREFIXES: readonly { scale: number; ucum: string; symbol: string }[] = [
  { scale: 1e12, ucum: 'T', symbol: 'T' },
  { scale: 1e9, ucum: 'G', symbol: 'G' },
  { scale: 1e6, ucum: 'M', symbol: 'M' },
  { scale: 1e3, ucum: 'k', symbol: 'k' },
  { scale: 1, ucum: '', symbol: '' },
  { scale: 1e-3, ucum: 'm', symbol: 'm' },
  { scale: 1e-6, ucum: 'u', symbol: 'µ' },
  { scale: 1e-9, ucum: 'n', symbol: 'n' },
  { scale: 1e-12, ucum: 'p', symbol: 'p' },
  { scale: 1e-15, ucum: 'f', symbol: 'f' },
];

// Units that take an SI prefix in practice, with the largest and smallest prefix scale used (kelvin and second
// are not written as kK or ks in the trade).
const PREFIXABLE: Readonly<Record<string, [number, number]>> = {
  Ohm: [1e12, 1e-15], 'Ohm/{sq}': [1e12, 1e-3], V: [1e3, 1e-15], A: [1e3, 1e-15], T: [1, 1e-9], Hz: [1e9, 1e-3],
  W: [1e3, 1e-15], S: [1e3, 1e-15], F: [1, 1e-15], H: [1, 1e-12], J: [1e3, 1e-15], C: [1, 1e-15], K: [1, 1e-6],
  s: [1, 1e-12], m: [1e3, 1e-12], g: [1e3, 1e-9],
};

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** `x` with `digits` significant digits, trailing zeros dropped, the minus sign typeset: −0.0123, 45.3, 300. */
export function formatPlain(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return Number.isNaN(x) ? '—' : x > 0 ? '∞' : `${MINUS}∞`;
  if (x === 0) return '0';
  // Number() drops trailing zeros and writes 1.50e+3 as 1500.
  const text = String(Number(Math.abs(x).toPrecision(digits)));
  return (x < 0 ? MINUS : '') + (text.includes('e') ? formatScientific(Math.abs(x), digits) : text);
}

/** Scientific notation with a typeset power of ten: 4.11×10⁻⁷; `bareDecades` writes 1×10⁻⁵ as 10⁻⁵ (log-axis ticks). */
export function formatScientific(x: number, digits = 3, bareDecades = false): string {
  if (!Number.isFinite(x) || x === 0) return formatPlain(x, digits);
  const [mantissa, exponent] = x.toExponential(digits - 1).split('e');
  const power = String(Number(exponent)).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
  const m = trimZeros(mantissa.replace('-', MINUS));
  return bareDecades && m === '1' ? `10${power}` : `${m}×10${power}`;
}

/** A number for a table cell: plain between 0.001 and 100 000, scientific outside. */
export function formatNumber(x: number, digits = 3, bareDecades = false): string {
  const a = Math.abs(x);
  if (x === 0 || !Number.isFinite(x) || (a >= 1e-3 && a < 1e5)) return formatPlain(x, digits);
  return (x < 0 ? MINUS : '') + formatScientific(a, digits, bareDecades);
}

/** Display name of a UCUM unit ('Ohm.m' → 'Ω·m', '[in_i]' → 'in'); '1' (a pure number) → ''. */
export function unitLabel(ucum: string): string {
  if (ucum === '1') return '';
  if (ucum === '[in_i]') return 'in';
  if (ucum === '[mil_i]') return 'mil';
  return labelFromUcum(ucum);
}

export type DisplayScale = { factor: number; ucum: string; label: string };

/** The prefixed unit that shows values of magnitude `maxAbs` (in `siUcum`) with 1–3 digits before the point. */
export function displayScale(siUcum: string, maxAbs: number): DisplayScale {
  if (siUcum === 'Ohm.m') {
    // Practitioners quote resistivity in µΩ·cm (metals) or Ω·cm (semiconductors, insulators); 1 Ω·m = 100 Ω·cm.
    return maxAbs < 1e-4 ? { factor: 1e8, ucum: 'uOhm.cm', label: 'µΩ·cm' } : { factor: 100, ucum: 'Ohm.cm', label: 'Ω·cm' };
  }
  const range = PREFIXABLE[siUcum];
  if (!range || !Number.isFinite(maxAbs) || maxAbs === 0) return { factor: 1, ucum: siUcum, label: unitLabel(siUcum) };
  const [largest, smallest] = range;
  const usable = SI_PREFIXES.filter((p) => p.scale <= largest && p.scale >= smallest);
  // 0.9995 keeps 999.96 from printing as '1000 m…' after rounding to 3 digits.
  const prefix = usable.find((p) => maxAbs >= p.scale * 0.9995) ?? usable[usable.length - 1];
  const base = siUcum === 'Ohm/{sq}' ? 'Ohm' : siUcum;
  const ucum = prefix.ucum + siUcum;
  const label = `${prefix.symbol}${unitLabel(base)}${siUcum === 'Ohm/{sq}' ? '/sq' : ''}`;
  return { factor: 1 / prefix.scale, ucum, label };
}

export type FormattedQuantity = { text: string; alternative?: string };

/** A value in `ucum` for people, with a practitioner alternative for resistivity: 1.73×10⁻⁸ Ω·m (1.73 µΩ·cm). */
export function formatQuantityParts(value: number, ucum: string, digits = 3): FormattedQuantity {
  if (!Number.isFinite(value)) return { text: formatPlain(value) };
  if (ucum === 'Ohm.m') {
    const practical = displayScale('Ohm.m', Math.abs(value));
    return { text: `${formatNumber(value, digits)} Ω·m`, alternative: `${formatPlain(value * practical.factor, digits)} ${practical.label}` };
  }
  if (PREFIXABLE[ucum]) {
    const scale = displayScale(ucum, Math.abs(value));
    return { text: `${formatNumber(value * scale.factor, digits)} ${scale.label}` };
  }
  const label = unitLabel(ucum);
  const number = formatNumber(value, digits);
  return { text: label === '' ? number : label === '%' || label === '°' ? `${number}${label}` : `${number} ${label}` };
}

/** One string: '12.3 mΩ', '4.11×10⁻⁷ Ω·m (41.1 µΩ·cm)', '155'. */
export function formatQuantity(value: number, ucum: string, digits = 3): string {
  const { text, alternative } = formatQuantityParts(value, ucum, digits);
  return alternative ? `${text} (${alternative})` : text;
}

/**
 * A range of one quantity: '2–300 K', '255 µΩ – 44 mΩ' (units shared when both ends print with the same one). With a
 * negative end the ends are joined by 'to' ('−1 to 1 T'), as is common practice: an en dash next to a minus sign reads
 * as arithmetic ('−1–1 T').
 */
export function formatRange(min: number, max: number, ucum: string): string {
  if (min === max) return formatQuantityParts(min, ucum).text; // a fixed value ("0 T"), not a range of one point
  const a = formatQuantityParts(min, ucum).text;
  const b = formatQuantityParts(max, ucum).text;
  const unitA = a.split(' ').slice(1).join(' ');
  const unitB = b.split(' ').slice(1).join(' ');
  const signed = min < 0 || max < 0;
  if (unitA && unitA === unitB) return signed ? `${a.split(' ')[0]} to ${b}` : `${a.split(' ')[0]}–${b}`;
  return signed ? `${a} to ${b}` : `${a} – ${b}`;
}
