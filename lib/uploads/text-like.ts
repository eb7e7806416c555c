import { detectEncoding, TransportParseError } from '@/lib/transport/parse';

/** Extensions of the text exports transport instruments and scripts write. */
const TEXT_EXTENSIONS = new Set(['csv', 'tsv', 'txt', 'dat', 'tab', 'asc', 'prn', 'log', 'out', 'text', 'data', 'xy', 'xyz']);

export function hasTextExtension(name: string): boolean {
  const dot = name.lastIndexOf('.');
  return dot >= 0 && TEXT_EXTENSIONS.has(name.slice(dot + 1).toLowerCase());
}

/** How many leading bytes decide "text" for a file without a known extension. */
export const TEXT_SNIFF_BYTES = 1024;

/** True when the first bytes read as text in some encoding (the transport core's own test: BOM, UTF-16, no NUL/control bytes). */
export function looksLikeText(head: Uint8Array, complete: boolean): boolean {
  if (head.length === 0) return false;
  try {
    detectEncoding(head, complete);
    return true;
  } catch (error) {
    // Text in an encoding the parser refuses (UTF-32) is still queued, so the author reads why it was not analysed.
    return !(error instanceof TransportParseError && error.code === 'binary');
  }
}

/** Files the worker should analyse: a text extension, or text in the first KiB. */
export function isAnalysable(name: string, head: Uint8Array, complete: boolean): boolean {
  return hasTextExtension(name) || looksLikeText(head.subarray(0, TEXT_SNIFF_BYTES), complete);
}
