import { readLines } from './line-reader';
import { bytesFromBuffer } from './sources';
import { TableBuilder } from './table-builder';
import type { ByteSource, ParsedTable, ParseOptions } from './types';

export const DEFAULT_MAX_LINE_BYTES = 1024 * 1024;
export const DEFAULT_MAX_BYTES = 1024 * 1024 * 1024;

/**
 * Reads a transport table (CSV, TSV, whitespace; comment and [Header]/[Data] blocks; units in headers) from a byte
 * stream with bounded memory: one partial line, the header block and the numeric columns are all it keeps.
 * Values are converted to SI where the unit is known (field in T by the lab convention 1 Oe ↔ 1e-4 T).
 * Rows shorter than the header are padded with NaN; longer rows are skipped; both are warnings with line numbers.
 * Throws TransportParseError when the file cannot be read as a table at all.
 */
export async function parseTransportTable(source: ByteSource, options: ParseOptions = {}): Promise<ParsedTable> {
  const builder = new TableBuilder(options);
  try {
    return await parseWith(builder, source, options);
  } finally {
    builder.dispose();
  }
}

async function parseWith(builder: TableBuilder, source: ByteSource, options: ParseOptions): Promise<ParsedTable> {
  const read = await readLines(
    source,
    {
      encoding: options.encoding,
      maxLineBytes: options.maxLineBytes ?? DEFAULT_MAX_LINE_BYTES,
      maxBytes: options.maxBytes ?? DEFAULT_MAX_BYTES,
      signal: options.signal,
      onProgress: options.onProgress,
    },
    { text: builder.line, bytes: builder.bytesLine, fastRows: builder, parallel: builder.parallel },
  );
  builder.end();
  if (read.replacementChars) {
    builder.warnings.add({
      line: 0,
      code: 'invalid-characters',
      message: `Some bytes are not valid ${read.encoding} and were replaced by '\uFFFD'; the file may use another encoding.`,
    });
  }
  if (builder.truncated) {
    builder.warnings.add({ line: 0, code: 'row-limit', message: `Only the first ${builder.rowCount} rows were read (preview limit).` });
  }
  const layout = builder.layout;
  if (!layout) throw new Error('unreachable: TableBuilder.end() either configures the layout or throws');
  const columns = builder.finishColumns().map(({ spec, values, nanCount, infiniteCount, range }) => ({
    index: spec.index,
    name: spec.name,
    rawHeader: spec.rawHeader,
    unitText: spec.unitText,
    quantity: spec.mapping.quantity,
    ucum: spec.mapping.ucum,
    siUcum: spec.mapping.converted ? spec.mapping.siUcum : null,
    converted: spec.mapping.converted,
    confidence: Math.round(spec.mapping.confidence * 100) / 100,
    reason: spec.mapping.reason,
    values,
    range,
    nanCount,
    infiniteCount,
  }));
  return {
    columns,
    rowCount: builder.rowCount,
    delimiter: layout.delimiter,
    decimalSeparator: layout.decimalSeparator,
    encoding: read.encoding,
    headerMetadata: builder.metadata,
    headerLine: builder.headerLine,
    firstDataLine: builder.firstDataLine,
    bytesRead: read.bytesRead,
    truncated: builder.truncated,
    warnings: builder.warnings.result(),
  };
}

/** Same as parseTransportTable for a whole file already in memory (bytes, or text encoded as UTF-8). */
export function parseTransportText(data: Uint8Array | string, options: ParseOptions = {}): Promise<ParsedTable> {
  return parseTransportTable(bytesFromBuffer(data), options);
}
