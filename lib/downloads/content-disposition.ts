// Content-Disposition for downloads (RFC 6266) with the UTF-8 name in filename* (RFC 8187, which replaced RFC 5987).
import { sanitiseEntryName } from '@/lib/packages/sanitise-entry-names';

/** RFC 8187 §3.2.1 attr-char: what may stand unencoded in an ext-value. */
const ATTR_CHAR = /[A-Za-z0-9!#$&+\-.^_`|~]/;

/** The deposited name made safe to save: one segment (folders joined with "_"), no control or reserved characters. */
export function downloadFileName(name: string): string {
  return sanitiseEntryName(name).replace(/\//g, '_');
}

/** RFC 8187 ext-value without the charset prefix: UTF-8 bytes, each outside attr-char as %XX. */
export function encodeExtValue(text: string): string {
  let out = '';
  for (const ch of text) {
    if (ATTR_CHAR.test(ch)) out += ch;
    else for (const byte of Buffer.from(ch, 'utf8')) out += `%${byte.toString(16).toUpperCase().padStart(2, '0')}`;
  }
  return out;
}

/**
 * An ASCII stand-in for clients that ignore filename*: printable ASCII only, with '"', '\' and '%' (which some
 * clients decode, RFC 6266 appendix D) replaced by "_".
 */
export function asciiFallback(text: string): string {
  const ascii = [...text].map((ch) => (/^[\x20-\x7e]$/.test(ch) && !/["\\%]/.test(ch) ? ch : '_')).join('');
  return ascii.trim() === '' ? 'download' : ascii;
}

/** `attachment; filename="…"; filename*=UTF-8''…` for a deposited file name. */
export function contentDisposition(name: string, disposition: 'attachment' | 'inline' = 'attachment'): string {
  const safe = downloadFileName(name);
  return `${disposition}; filename="${asciiFallback(safe)}"; filename*=UTF-8''${encodeExtValue(safe)}`;
}
