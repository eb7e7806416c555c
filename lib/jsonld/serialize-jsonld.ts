// JSON for an inline <script type="application/ld+json">: no character sequence in it can end the script element.
const UNSAFE: Record<string, string> = { '<': '\\u003c', '>': '\\u003e', '&': '\\u0026', '\u2028': '\\u2028', '\u2029': '\\u2029' };

/** JSON.stringify with <, >, & and the JS line separators as \u escapes (still the same JSON value when parsed). */
export function serializeJsonLd(data: unknown): string {
  return JSON.stringify(data).replace(/[<>&\u2028\u2029]/g, (c) => UNSAFE[c]);
}
