import type { Column } from '@/lib/schema/transport-dataset.types';
import type { ParallelOptions } from './parallel-rows';

/** What a column holds; the same vocabulary as the dataset schema's column quantity. */
export type TransportQuantity = Column['quantity'];
export type ColumnRole = Column['role'];

export type Delimiter = ',' | ';' | '\t' | 'whitespace';
export type DecimalSeparator = '.' | ',';

export type ParseWarningCode =
  | 'duplicate-header'
  | 'empty-header'
  | 'no-header'
  | 'header-count-mismatch'
  | 'unit-unknown'
  | 'unit-missing'
  | 'unit-assumed'
  | 'unit-conflict'
  | 'unit-symbol-font'
  | 'unit-ambiguous'
  | 'short-row'
  | 'long-row'
  | 'non-numeric-cell'
  | 'text-row'
  | 'invalid-characters'
  | 'column-override'
  | 'more-warnings'
  | 'row-limit';

/** `line` is the 1-based line of the decoded text (0 when the warning is about the whole file). */
export type ParseWarning = { line: number; code: ParseWarningCode; message: string; column?: string };

export type ParsedColumn = {
  index: number;
  /** Name without the unit, made unique ('R', 'R_2'). */
  name: string;
  rawHeader: string;
  /** Unit text as written in the header (or units row), null when there was none. */
  unitText: string | null;
  quantity: TransportQuantity;
  /** UCUM code of the file's values; null when the unit is unknown. */
  ucum: string | null;
  /** UCUM code of `values`: the SI unit, or null when the values could not be converted. */
  siUcum: string | null;
  /** True when `values` are in SI (siUcum); false leaves them as in the file. */
  converted: boolean;
  confidence: number;
  reason: string;
  values: Float64Array;
  /** Finite minimum and maximum of `values`; null when every value is NaN. */
  range: { min: number; max: number } | null;
  nanCount: number;
  /** Values that are +Infinity or −Infinity ('inf', or beyond the largest double); not in `range`. */
  infiniteCount: number;
};

export type ParsedTable = {
  columns: ParsedColumn[];
  rowCount: number;
  delimiter: Delimiter;
  decimalSeparator: DecimalSeparator;
  encoding: string;
  headerMetadata: Record<string, string>;
  /** 1-based line of the header row, null when the file has none. */
  headerLine: number | null;
  firstDataLine: number;
  bytesRead: number;
  /** True when parsing stopped at options.maxRows. */
  truncated: boolean;
  warnings: ParseWarning[];
};

/** A metadata-supplied column mapping, matched by name (as in the header, without unit) or by raw header. */
export type ColumnOverride = { name: string; quantity?: TransportQuantity; unit?: string; role?: ColumnRole };

export type ParseOptions = {
  /** Force an encoding (an iconv-lite name); default: detected from BOM, NUL pattern and UTF-8 validity. */
  encoding?: string;
  delimiter?: Delimiter;
  decimalSeparator?: DecimalSeparator;
  /** A longer line stops parsing with 'line-too-long' (default 1 MiB). */
  maxLineBytes?: number;
  /** More bytes stop parsing with 'too-large' (default 1 GiB). */
  maxBytes?: number;
  /** Size of the whole source in bytes when known (file size, object size): the columns are then allocated once. */
  sizeBytes?: number;
  /** Stop after this many data rows (for previews); the table is marked truncated. */
  maxRows?: number;
  columns?: ColumnOverride[];
  /**
   * Data rows of large files are also read on worker threads where Node's worker_threads exist (see ParallelRows):
   * tuning, or false to read on the calling thread only. Values, warnings and line numbers do not depend on it.
   */
  parallel?: false | ParallelOptions;
  signal?: AbortSignal;
  /** Called after each chunk with the bytes read so far. */
  onProgress?: (bytesRead: number) => void;
};

/** Chunks of the file in order. The parser asks for the next chunk while it reads one: never reuse a chunk's memory. */
export type ByteSource = AsyncIterable<Uint8Array>;
