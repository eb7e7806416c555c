import type { TransportDatasetDraft } from '@/lib/schema';
import type { FileSummary } from '@/lib/transport/summary/types';

/** How much of a picked file the browser reads for the instant preview. */
export const LOCAL_PREVIEW_BYTES = 256 * 1024;

export type LocalPreview =
  | { ok: true; summary: FileSummary; bytesRead: number; wholeFile: boolean }
  | { ok: false; message: string };

/** The first `limit` bytes cut after the last line break, so the preview never parses half a row. */
export function headBytes(bytes: Uint8Array, limit: number, wholeFile: boolean): Uint8Array {
  if (wholeFile && bytes.length <= limit) return bytes;
  const head = bytes.subarray(0, Math.min(limit, bytes.length));
  // LF, or CR for old Mac-style files; a UTF-16 LF is 0x0A 0x00 (LE), so cut one byte later there.
  let cut = head.lastIndexOf(0x0a);
  if (cut < 0) cut = head.lastIndexOf(0x0d);
  if (cut < 0) return head;
  return head.subarray(0, cut + 1 + (head[cut + 1] === 0 ? 1 : 0));
}

/**
 * Instant preview of a local file: the first 256 KiB parsed and summarised in the browser by the same transport
 * core the server worker runs (lib/transport), with the draft's mapping and geometry. Loaded on demand.
 */
export async function previewLocalFile(file: Blob & { name: string }, metadata: TransportDatasetDraft | undefined): Promise<LocalPreview> {
  const wholeFile = file.size <= LOCAL_PREVIEW_BYTES;
  const bytes = headBytes(new Uint8Array(await file.slice(0, LOCAL_PREVIEW_BYTES).arrayBuffer()), LOCAL_PREVIEW_BYTES, wholeFile);
  const [{ summariseFile }, { bytesFromBuffer, TransportParseError }] = await Promise.all([
    import('@/lib/transport/summarise-file'),
    import('@/lib/transport/parse'),
  ]);
  try {
    const summary = await summariseFile(bytesFromBuffer(bytes), { metadata, fileName: file.name, previewPoints: 500 });
    return { ok: true, summary, bytesRead: bytes.length, wholeFile };
  } catch (e) {
    if (e instanceof TransportParseError) return { ok: false, message: e.message };
    return { ok: false, message: `The preview could not read this file (${e instanceof Error ? e.message : String(e)}).` };
  }
}

/** Files worth previewing: text-like names, or small files of any name (the parser refuses binary ones itself). */
export function isPreviewable(file: { name: string; size: number }): boolean {
  return /\.(csv|tsv|txt|dat|asc|prn|tab|xy|out|log)$/i.test(file.name) || file.size <= LOCAL_PREVIEW_BYTES;
}
