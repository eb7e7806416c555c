// A file of the visitor's own, dropped onto the compare page: parsed and summarised in this browser by the same
// transport core the server runs (lib/transport). It is never uploaded or stored.
import { defaultCurveIndex } from '@/lib/compare/default-curve';
import { curveOption } from '@/lib/compare/quantities';
import type { CompareEntry } from '@/lib/compare/types';
import { formatBytes } from '@/lib/format/bytes';
import type { ParsedTable } from '@/lib/transport/parse';

/** Files up to this size are read whole; of a larger one, the first 50 MB (cut at a line end). */
export const LOCAL_MAX_BYTES = 50 * 1024 * 1024;

export type LocalCurves = { entry: CompareEntry; table: ParsedTable };
export type LocalResult = { ok: true; local: LocalCurves } | { ok: false; message: string };

/** The bytes up to the last line break, so the parser never sees half a row (LF, or CR for old Mac files). */
function cutAtLineEnd(bytes: Uint8Array): Uint8Array {
  let cut = bytes.lastIndexOf(0x0a);
  if (cut < 0) cut = bytes.lastIndexOf(0x0d);
  return cut < 0 ? bytes : bytes.subarray(0, cut + 1 + (bytes[cut + 1] === 0 ? 1 : 0)); // UTF-16 LE: LF is 0A 00
}

export async function analyseLocalFile(file: File, key: string, onProgress: (fraction: number) => void, signal?: AbortSignal): Promise<LocalResult> {
  const whole = file.size <= LOCAL_MAX_BYTES;
  const total = Math.min(file.size, LOCAL_MAX_BYTES);
  // Loaded on demand: the parser and the UCUM engine stay out of the page until a file is dropped.
  const [{ parseTransportTable, bytesFromBuffer, bytesFromWebStream, TransportParseError }, { summariseTable }] = await Promise.all([
    import('@/lib/transport/parse'),
    import('@/lib/transport/summary/summarise-table'),
  ]);
  try {
    const source = whole
      ? bytesFromWebStream(file.stream())
      : bytesFromBuffer(cutAtLineEnd(new Uint8Array(await file.slice(0, LOCAL_MAX_BYTES).arrayBuffer())));
    const table = await parseTransportTable(source, { signal, onProgress: (read) => onProgress(total ? Math.min(1, read / total) : 1) });
    const summary = summariseTable(table, undefined, { fileName: file.name, previewPoints: 500 });
    const options = summary.previews.map((p) => curveOption(p, summary.columns));
    const best = defaultCurveIndex(options);
    if (best < 0) return { ok: false, message: `${file.name}: no curve found (a plot needs one x column and at least one y column with numbers).` };
    const note = whole ? null : `Only the first ${formatBytes(LOCAL_MAX_BYTES)} of ${formatBytes(file.size)} were read; the curve stops where that part ends.`;
    return {
      ok: true,
      local: {
        entry: { key, ref: null, source: null, local: { fileName: file.name, note }, chosen: { x: options[best].x.column, y: options[best].y.column }, options },
        table,
      },
    };
  } catch (error) {
    if (signal?.aborted) return { ok: false, message: `${file.name}: reading was cancelled.` };
    if (error instanceof TransportParseError) return { ok: false, message: `${file.name}: ${error.message}` };
    return { ok: false, message: `${file.name} could not be read here (${error instanceof Error ? error.message : String(error)}).` };
  }
}
