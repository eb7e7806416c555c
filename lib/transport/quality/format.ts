// Numbers in practitioner units for flag messages: 3 significant digits with an SI prefix.

const PREFIXES: readonly [number, string][] = [
  [1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p'], [1e-15, 'f'],
];

/** 3-significant-digit number, dropping trailing zeros: 0.000123 → '0.000123', 45.30 → '45.3'. */
export function sig3(x: number): string {
  if (x === 0 || !Number.isFinite(x)) return String(x);
  const a = Math.abs(x);
  if (a >= 1e5 || a < 1e-3) return x.toExponential(2).replace(/\.?0+e/, 'e');
  return String(Number(x.toPrecision(3)));
}

/** Value with an SI prefix on `unit`: formatSi(2.5e-6, 'W') → '2.5 µW'. */
export function formatSi(value: number, unit: string): string {
  if (value === 0 || !Number.isFinite(value)) return `${value} ${unit}`;
  const a = Math.abs(value);
  const [scale, prefix] = PREFIXES.find(([s]) => a >= s * 0.9995) ?? PREFIXES[PREFIXES.length - 1];
  return `${sig3(value / scale)} ${prefix}${unit}`;
}

/** Resistivity as Ω·m with the µΩ·cm equivalent (1 µΩ·cm = 1e-8 Ω·m). */
export function formatResistivity(ohmM: number): string {
  return `${sig3(ohmM)} Ω·m (${sig3(ohmM * 1e8)} µΩ·cm)`;
}
