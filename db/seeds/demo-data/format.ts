import iconv from 'iconv-lite';

// Number and line formatting in the styles of lab export programs (our own invented ones).

/** Scientific notation with an explicit sign and a two-digit exponent: +1.234567E-03. */
export function sci(value: number, digits: number): string {
  const [mantissa, exponent] = value.toExponential(digits).split('e');
  const e = Number(exponent);
  const sign = value < 0 || Object.is(value, -0) ? '' : '+';
  return `${sign}${mantissa}E${e < 0 ? '-' : '+'}${String(Math.abs(e)).padStart(2, '0')}`;
}

/** Fixed decimals. */
export const fixed = (value: number, decimals: number) => value.toFixed(decimals);

/** Text lines joined with the line break, ending in one, encoded as the lab's software would write them. */
export function textFile(lines: string[], options: { eol?: '\n' | '\r\n'; encoding?: 'utf-8' | 'latin1' } = {}): Uint8Array {
  const text = lines.join(options.eol ?? '\n') + (options.eol ?? '\n');
  return options.encoding === 'latin1' ? Uint8Array.from(iconv.encode(text, 'latin1')) : new TextEncoder().encode(text);
}
