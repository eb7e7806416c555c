// A typed number field keeps what the author wrote: a value that is not a number is stored as text, so the
// validator names it ("must be a number") instead of the form dropping it silently.

/** '' → undefined; '1,5' or '1.5' or '2e-3' → a number; anything else → the text as written (trimmed). */
export function parseNumberText(text: string): number | string | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  const normalised = t.includes('.') ? t : t.replace(',', '.');
  if (/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(normalised)) return Number(normalised);
  return t;
}

/** The text an input shows for a stored value. */
export function numberToText(value: unknown): string {
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  return typeof value === 'string' ? value : '';
}

/** True when `text` already stands for `value` (so a re-render keeps the author's own spelling, e.g. '0.10'). */
export function textMatches(text: string, value: unknown): boolean {
  const parsed = parseNumberText(text);
  return parsed === value || (parsed === undefined && value === undefined);
}
