import type { FastLineSink } from './byte-lines';
import { cellBounds, looksLikeData } from './cells';
import { mapColumn, type ColumnMapping } from './column-mapping';
import { ColumnSet, FIRST_BLOCK_ROWS } from './column-store';
import { detectLayout, type Layout } from './delimiter';
import { TransportParseError } from './errors';
import { splitHeaderCell } from './header';
import { CELL_NUMBER, CELL_TEXT, NumberReader } from './number';
import { commentBody, readPreamble, sectionName, type BufferedLine } from './preamble';
import type { ParallelPlan } from './line-reader';
import { cpuSample, defaultWorkers, IDLE_WINDOW_MS, idleCores, MIN_IDLE_CORES, PARALLEL_MIN_BYTES, WorkerCrew, workerThreads, type CpuSample, type ParallelOptions } from './parallel-rows';
import { emptyStats, mergeStats, readPlainRows, rowFormat, STATS_PER_COLUMN, type CellFallback, type RowCursor, type RowFormat } from './plain-rows';
import { normaliseName } from './quantity-names';
import type { ColumnOverride, ParseOptions } from './types';
import { WarningLog } from './warnings';

const SAMPLE_LINES = 20;
const MAX_PREAMBLE_LINES = 20_000;
const MAX_PREAMBLE_CHARS = 8 * 1024 * 1024;
// A size estimate never allocates more than this many rows at once (128 MiB per column); more rows grow in blocks.
const MAX_EXPECTED_ROWS = 1 << 24;

export type ColumnSpec = { index: number; name: string; rawHeader: string; unitText: string | null; mapping: ColumnMapping };

/** k when the SI factor is exactly 10^k (mΩ, µΩ·cm, Oe → T), else 0: such columns are scaled in the exponent. */
function decimalShift(m: ColumnMapping): number {
  if (!m.converted || m.offset !== 0 || m.factor === 1 || !(m.factor > 0)) return 0;
  const k = Math.round(Math.log10(m.factor));
  return k !== 0 && Math.abs(k) <= 30 && Number(`1e${k}`) === m.factor ? k : 0;
}

/** Turns lines into columns: buffers the preamble and first data lines, decides the layout, then streams rows. */
export class TableBuilder implements FastLineSink {
  readonly warnings = new WarningLog();
  metadata: Record<string, string> = {};
  layout: Layout | undefined;
  specs: ColumnSpec[] = [];
  headerLine: number | null = null;
  firstDataLine = 0;
  rowCount = 0;
  truncated = false;
  private set = new ColumnSet(0);
  private buffer: BufferedLine[] = [];
  private bufferChars = 0;
  private run = 0;
  private runStart = -1;
  private nonBlankSeen = false;
  private readonly reader = new NumberReader();
  private bounds = new Int32Array(0);
  private row = new Float64Array(0);
  private kinds = new Uint8Array(0);
  private decimalCode = 46;
  private shifts = new Int8Array(0);
  private commentSemicolon = true;
  /** The byte layout of data rows once the layout is known (ASCII-compatible encodings read rows from the bytes). */
  format: RowFormat | undefined;
  /** FastLineSink: where the first line `take` left starts. */
  next = 0;
  private readonly cursor: RowCursor = { next: 0 };
  private readonly cellText = new NumberReader();
  /** min, max, NaN and ±Infinity counts of every column so far (emptyStats), kept by every path that adds rows. */
  private stats: Float64Array = new Float64Array(0);
  private bytesPerRow = 1;
  private parallelRefused = false;
  /** The machine's idle time when reading began, to see whether a worker would have a core to itself. */
  private readonly cpuAtStart: CpuSample | undefined = undefined;
  /** Workers started when a source of known, large size is opened (see WorkerCrew); handed on by `parallel`. */
  private crew: WorkerCrew | undefined;

  constructor(private readonly options: ParseOptions) {
    const threads = this.parallelThreads();
    const parallel = this.parallelOptions;
    if (!threads || (options.sizeBytes ?? Infinity) < (parallel?.minBytes ?? PARALLEL_MIN_BYTES)) return;
    if ((parallel?.minIdleCores ?? MIN_IDLE_CORES) > 0) this.cpuAtStart = cpuSample();
    if (options.sizeBytes !== undefined) this.crew = this.startCrew(threads);
  }

  /** The parallel read's tuning (undefined for defaults, and when `parallel: false` forbids it: see parallelThreads). */
  private get parallelOptions(): ParallelOptions | undefined {
    return this.options.parallel || undefined;
  }

  /** node:worker_threads when the options allow a parallel read at all (no row limit, parallel not false), else undefined. */
  private parallelThreads(): NonNullable<ReturnType<typeof workerThreads>> | undefined {
    return this.options.parallel === false || this.options.maxRows !== undefined ? undefined : workerThreads();
  }

  /** The workers for this table, or undefined when no thread can be had (the rows are then read here). */
  private startCrew(threads: NonNullable<ReturnType<typeof workerThreads>>): WorkerCrew | undefined {
    try {
      return new WorkerCrew(threads, Math.max(1, this.parallelOptions?.workers ?? defaultWorkers()));
    } catch {
      return undefined;
    }
  }

  /** Stops workers that were started for this table and not used (call once reading is over, however it ended). */
  dispose(): void {
    this.crew?.stop();
    this.crew = undefined;
  }

  /** Sink for lines as bytes (ASCII-compatible encodings): plain numeric rows are read undecoded, the rest as text. */
  bytesLine = (b: Uint8Array, start: number, end: number, no: number, decode: (b: Uint8Array, start: number, end: number) => string): boolean => {
    const format = this.format;
    if (format !== undefined) {
      const set = this.set;
      set.reserve();
      // b[end] is the line's break byte: one row that ends exactly there.
      if (readPlainRows(b, start, end, b[end], set.blocks, set.pos, 1, format, this.cellFallback, this.cursor, this.stats) === 1 && this.cursor.next === end + 1) {
        return this.commitRow();
      }
    }
    const text = decode(b, start, end);
    return this.line(text, 0, text.length, no);
  };

  /**
   * FastLineSink: plain numeric rows read straight from the chunk into the columns. The row that reaches
   * options.maxRows is left to bytesLine, which marks the table truncated and stops reading.
   */
  take(b: Uint8Array, start: number, last: number, sep: number): number {
    const format = this.format;
    let p = start;
    let taken = 0;
    if (format !== undefined) {
      const limit = this.options.maxRows;
      for (;;) {
        const set = this.set;
        set.reserve();
        const room = limit === undefined ? set.room() : Math.min(set.room(), limit - 1 - this.rowCount);
        if (room <= 0) break;
        const rows = readPlainRows(b, p, last, sep, set.blocks, set.pos, room, format, this.cellFallback, this.cursor, this.stats);
        set.advance(rows);
        this.rowCount += rows;
        taken += rows;
        p = this.cursor.next;
        if (rows < room || p > last) break; // stopped at a line for the text path, or at the end of the chunk
      }
    }
    this.next = p;
    return taken;
  }

  /**
   * LineSink.parallel: a plan for reading the rest of the source on worker threads, once the row layout is known and
   * the source is large enough (options.parallel.minBytes of its size, or of what has been read when the size is not
   * known). Never with a row limit, without worker threads (browsers) or with options.parallel false.
   */
  parallel = (bytesRead: number): ParallelPlan | undefined => {
    if (this.parallelRefused || this.format === undefined) return undefined;
    const threads = this.parallelThreads();
    const options = this.parallelOptions;
    if (!threads) {
      this.parallelRefused = true;
      return undefined;
    }
    const size = this.options.sizeBytes && this.options.sizeBytes > 0 ? this.options.sizeBytes : bytesRead;
    if (size < (options?.minBytes ?? PARALLEL_MIN_BYTES)) {
      if (this.options.sizeBytes) this.refuseParallel();
      return undefined;
    }
    const minIdle = options?.minIdleCores ?? MIN_IDLE_CORES;
    if (minIdle > 0) {
      const start = this.cpuAtStart;
      if (start && performance.now() - start.atMs < IDLE_WINDOW_MS) return undefined; // ask again after the next chunk
      const now = start && cpuSample();
      // No idle core since reading began (or no way to tell): a worker would only take time from this thread.
      if (!start || !now || idleCores(start, now) < minIdle) {
        this.refuseParallel();
        return undefined;
      }
    }
    this.parallelRefused = true; // one plan per table
    const crew = this.crew ?? this.startCrew(threads);
    this.crew = undefined; // the reader stops it now
    if (!crew) return undefined; // no threads to be had: read here
    return { crew, format: this.format, columns: this.specs.length, appendRows: this.appendRows, bytesPerRow: this.bytesPerRow, options: options ?? {} };
  };

  private refuseParallel(): void {
    this.parallelRefused = true;
    this.dispose();
  }

  /** Appends rows [0, rows) of whole columns read elsewhere (ParallelRows). */
  private readonly appendRows = (columns: Float64Array[], rows: number, stats: Float64Array): void => {
    mergeStats(this.stats, stats);
    let from = 0;
    while (from < rows) {
      const set = this.set;
      set.reserve();
      const n = Math.min(set.room(), rows - from);
      for (let k = 0; k < columns.length; k++) set.blocks[k].set(columns[k].subarray(from, from + n), set.pos);
      set.advance(n);
      from += n;
    }
    this.rowCount += rows;
  };

  /** Cells the byte path cannot read as plain numbers, through NumberReader; undefined for text and non-ASCII bytes. */
  private readonly cellFallback: CellFallback = (b, start, end, k) => {
    let text = '';
    for (let i = start; i < end; i++) {
      if (b[i] >= 0x80) return undefined;
      text += String.fromCharCode(b[i]);
    }
    const value = this.cellText.read(text, 0, text.length, this.decimalCode, this.shifts[k]);
    return this.cellText.kind === CELL_TEXT ? undefined : value;
  };

  /** Sink for readLines; false stops reading (row limit reached). */
  line = (s: string, start: number, end: number, no: number): boolean => {
    if (this.layout) return this.dataLine(s, start, end, no);
    const text = s.slice(start, end);
    this.buffer.push({ no, text });
    this.bufferChars += text.length;
    const trimmed = text.trim();
    if (trimmed !== '') this.nonBlankSeen = true;
    if (trimmed === '' || (commentBody(text) !== undefined && !looksLikeData(text, this.reader))) {
      // Blank and comment lines neither start nor break a run of data lines.
    } else if (sectionName(text) === undefined && looksLikeData(text, this.reader)) {
      if (this.run === 0) this.runStart = this.buffer.length - 1;
      this.run++;
    } else this.run = 0;
    if (this.run >= SAMPLE_LINES) return this.configure();
    if (this.buffer.length > MAX_PREAMBLE_LINES || this.bufferChars > MAX_PREAMBLE_CHARS) {
      if (this.run > 0) return this.configure();
      throw new TransportParseError('too-many-header-lines', `No table of numbers was found in the first ${this.buffer.length} lines.`, no);
    }
    return true;
  };

  /** Called after the last line; decides the layout for short files and reports files without data. */
  end(): void {
    if (this.layout) return;
    if (this.run > 0) {
      this.configure();
      return;
    }
    const lastLine = this.buffer[this.buffer.length - 1]?.no ?? 1;
    if (!this.nonBlankSeen) throw new TransportParseError('empty', `The file contains no text, only blank lines (lines 1–${lastLine}).`, lastLine);
    const plain = this.buffer.filter((l) => l.text.trim() !== '' && commentBody(l.text) === undefined && sectionName(l.text) === undefined);
    const header = plain[plain.length - 1]?.no;
    throw new TransportParseError(
      'no-data',
      header !== undefined
        ? `The file has a header (line ${header}) but no rows of numbers.`
        : `The file has no rows of numbers (only comments or metadata, lines 1–${lastLine}).`,
      header ?? lastLine,
    );
  }

  private configure(): boolean {
    const buffered = this.buffer;
    let dataLines = buffered.slice(this.runStart);
    const sample = dataLines.filter((l) => l.text.trim() !== '' && commentBody(l.text) === undefined).slice(0, SAMPLE_LINES).map((l) => l.text);
    const layout = detectLayout(sample, { delimiter: this.options.delimiter, decimalSeparator: this.options.decimalSeparator });
    this.runStart = this.extendDataStart(layout);
    dataLines = buffered.slice(this.runStart);
    const preamble = readPreamble(buffered.slice(0, this.runStart), layout.delimiter, layout.columnCount);
    this.metadata = preamble.metadata;
    this.headerLine = preamble.headerLine;
    this.firstDataLine = dataLines[0]?.no ?? 0;
    preamble.warnings.forEach((w) => this.warnings.add(w));
    this.specs = this.buildSpecs(preamble.headerCells, preamble.unitCells, layout.columnCount);
    const n = this.specs.length;
    this.set = new ColumnSet(n, this.expectedRows(buffered, dataLines));
    this.bounds = new Int32Array(2 * (n + 8));
    this.row = new Float64Array(n);
    this.stats = emptyStats(n);
    this.kinds = new Uint8Array(n);
    this.shifts = Int8Array.from(this.specs, (spec) => decimalShift(spec.mapping));
    this.decimalCode = layout.decimalSeparator.charCodeAt(0);
    this.commentSemicolon = layout.delimiter !== ';';
    this.format = rowFormat(layout.delimiter, layout.decimalSeparator, this.shifts);
    this.layout = layout;
    this.buffer = [];
    for (const l of dataLines) if (!this.dataLine(l.text, 0, l.text.length, l.no)) return false;
    return true;
  }

  /**
   * Rows to allocate at once: from options.sizeBytes and the length of the first data lines (+10 %), so a large file
   * fills one block per column; without a size, blocks grow as rows arrive.
   */
  private expectedRows(buffered: BufferedLine[], dataLines: BufferedLine[]): number {
    const size = this.options.sizeBytes;
    const limit = Math.min(this.options.maxRows ?? Infinity, MAX_EXPECTED_ROWS);
    // The row length is wanted with or without a size: the parallel reader sizes its segments' columns by it.
    const sample = dataLines.slice(0, 200);
    const perRow = sample.reduce((sum, l) => sum + l.text.length + 1, 0) / Math.max(1, sample.length);
    this.bytesPerRow = Math.max(1, perRow);
    if (!size || !(size > 0)) return Math.min(FIRST_BLOCK_ROWS, limit);
    let before = 0;
    for (const l of buffered) {
      if (l === dataLines[0]) break;
      before += l.text.length + 1;
    }
    return Math.max(1, Math.min(limit, Math.ceil((1.1 * Math.max(0, size - before)) / Math.max(1, perRow)) + 64));
  }

  /** Every cell a number or missing marker, and as many cells as the table has columns. */
  private isFullRow(text: string, layout: Layout): boolean {
    const bounds = new Int32Array(2 * (layout.columnCount + 2));
    const n = cellBounds(text, 0, text.length, layout.delimiter, bounds);
    if (n !== layout.columnCount) return false;
    for (let k = 0; k < n; k++) {
      this.reader.read(text, bounds[2 * k], bounds[2 * k + 1], layout.decimalSeparator.charCodeAt(0));
      if (this.reader.kind === CELL_TEXT) return false;
    }
    return true;
  }

  /**
   * The run that triggered the layout may follow a text line inside the data ("end of run") rather than the header:
   * when the line above the run is preceded by complete numeric rows of the same width, those rows are data too.
   */
  private extendDataStart(layout: Layout): number {
    const lines = this.buffer;
    const skip = (i: number) => {
      while (i >= 0 && (lines[i].text.trim() === '' || commentBody(lines[i].text) !== undefined)) i--;
      return i;
    };
    let start = this.runStart;
    for (;;) {
      const textLine = skip(start - 1);
      if (textLine < 0 || sectionName(lines[textLine].text) !== undefined) return start;
      let i = skip(textLine - 1);
      if (i < 0 || !this.isFullRow(lines[i].text, layout)) return start;
      while (i >= 0 && this.isFullRow(lines[i].text, layout)) {
        start = i;
        i = skip(i - 1);
      }
    }
  }

  private buildSpecs(headerCells: string[] | null, unitCells: string[] | null, count: number): ColumnSpec[] {
    const line = this.headerLine ?? 0;
    const cells = headerCells ?? [];
    if (headerCells && cells.length !== count) {
      const extra = cells.slice(count).filter((c) => c !== '');
      if (cells.length < count || extra.length > 0) {
        this.warnings.add({
          line,
          code: 'header-count-mismatch',
          message: `The header has ${cells.length} names but the data rows have ${count} values${cells.length > count ? `; names after the ${count}th are ignored` : '; the missing names are column_N'}.`,
        });
      }
    }
    const used = new Map<string, number>();
    const raw = Array.from({ length: count }, (_, i) => cells[i] ?? '');
    const split = raw.map((c) => splitHeaderCell(c));
    const names = split.map((h, i) => {
      let name = h.name;
      if (name === '') {
        name = `column_${i + 1}`;
        if (headerCells) this.warnings.add({ line, code: 'empty-header', message: `Column ${i + 1} has no name in the header; it is called ${name}.`, column: name });
      }
      const seen = used.get(name) ?? 0;
      used.set(name, seen + 1);
      if (seen > 0) {
        const renamed = `${name}_${seen + 1}`;
        this.warnings.add({ line, code: 'duplicate-header', message: `The header names '${name}' more than once; column ${i + 1} is renamed ${renamed}.`, column: renamed });
        name = renamed;
      }
      return name;
    });
    const keys = new Set(names.map(normaliseName));
    const ctx = { hasLockInPair: keys.has('x') && keys.has('y') };
    return names.map((name, i) => {
      const unitText = split[i].unitText ?? (unitCells?.[i]?.trim().replace(/^[([{](.*)[)\]}]$/, '$1') || null);
      const override = this.findOverride(name, raw[i], split[i].name);
      const rawHeader = raw[i];
      const mapping = mapColumn(rawHeader || name, name, unitText, ctx, override);
      if (override) this.warnings.add({ line, code: 'column-override', message: `Column '${name}' mapped from the dataset metadata (${mapping.quantity}, ${mapping.ucum ?? 'unit unknown'}).`, column: name });
      for (const note of mapping.notes) this.warnings.add({ line, code: note.code, message: note.message, column: name });
      return { index: i, name, rawHeader, unitText, mapping };
    });
  }

  private findOverride(name: string, rawHeader: string, headerName: string): ColumnOverride | undefined {
    const list = this.options.columns ?? [];
    return (
      list.find((c) => c.name === name || c.name === rawHeader || c.name === headerName) ??
      list.find((c) => c.name.toLowerCase() === name.toLowerCase())
    );
  }

  private dataLine(s: string, start: number, end: number, no: number): boolean {
    let i = start;
    while (i < end && (s.charCodeAt(i) === 32 || s.charCodeAt(i) === 9)) i++;
    if (i === end) return true;
    const c = s.charCodeAt(i);
    // Comments and section markers inside the data: # % ! // [..] (and ; unless it is the delimiter).
    if (c === 35 || c === 37 || c === 33 || c === 91 || (c === 47 && s.charCodeAt(i + 1) === 47) || (c === 59 && this.commentSemicolon)) return true;
    const layout = this.layout as Layout;
    const cols = this.specs.length;
    let n = cellBounds(s, start, end, layout.delimiter, this.bounds);
    const bounds = this.bounds;
    if (n === cols + 1 && bounds[2 * cols] === bounds[2 * cols + 1]) n = cols; // trailing delimiter
    if (n > cols) {
      this.warnings.add({ line: no, code: 'long-row', message: `Line ${no} has ${n} values but the table has ${cols} columns; the row is skipped.` });
      return true;
    }
    const reader = this.reader;
    const decimal = this.decimalCode;
    let text = 0;
    let numbers = 0;
    for (let k = 0; k < n; k++) {
      this.row[k] = reader.read(s, bounds[2 * k], bounds[2 * k + 1], decimal, this.shifts[k]);
      this.kinds[k] = reader.kind;
      if (reader.kind === CELL_TEXT) text++;
      else if (reader.kind === CELL_NUMBER) numbers++;
    }
    if (text > 0 && numbers === 0) {
      this.warnings.add({ line: no, code: 'text-row', message: `Line ${no} has no numbers ('${s.slice(start, Math.min(end, start + 60))}'); the row is skipped.` });
      return true;
    }
    if (text > 0) this.reportText(s, no, n);
    if (n < cols) {
      this.row.fill(NaN, n);
      this.warnings.add({ line: no, code: 'short-row', message: `Line ${no} has ${n} values but the table has ${cols} columns; the missing values are NaN.` });
    }
    return this.pushRow(cols);
  }

  /** Appends `row` to the columns; false once the row limit is reached. */
  private pushRow(cols: number): boolean {
    const set = this.set;
    set.reserve();
    const stats = this.stats;
    for (let k = 0, r = 0; k < cols; k++, r += STATS_PER_COLUMN) {
      const v = this.row[k];
      set.blocks[k][set.pos] = v;
      if (v - v === 0) {
        if (v < stats[r]) stats[r] = v;
        if (v > stats[r + 1]) stats[r + 1] = v;
      } else if (v !== v) stats[r + 2]++;
      else stats[r + 3]++;
    }
    return this.commitRow();
  }

  /** Counts the row just written at set.pos; false once the row limit is reached. */
  private commitRow(): boolean {
    this.set.commit();
    this.rowCount++;
    if (this.options.maxRows !== undefined && this.rowCount >= this.options.maxRows) {
      this.truncated = true;
      return false;
    }
    return true;
  }

  private reportText(s: string, no: number, n: number): void {
    for (let k = 0; k < n; k++) {
      if (this.kinds[k] !== CELL_TEXT) continue;
      const cell = s.slice(this.bounds[2 * k], this.bounds[2 * k + 1]).trim().slice(0, 40);
      const name = this.specs[k].name;
      this.warnings.add({ line: no, code: 'non-numeric-cell', column: name, message: `Line ${no}, column '${name}': '${cell}' is not a number; it is stored as NaN.` });
    }
  }

  /** Column values (converted to SI where the unit is known) and their statistics; empties the stores. */
  finishColumns(): { spec: ColumnSpec; values: Float64Array; nanCount: number; infiniteCount: number; range: { min: number; max: number } | null }[] {
    return this.specs.map((spec, k) => {
      const values = this.set.finish(k);
      const { factor, offset, converted } = spec.mapping;
      // Decimal factors were applied while reading (decimalShift); only other factors and offsets remain.
      const scale = converted && this.shifts[k] === 0 && (factor !== 1 || offset !== 0);
      if (!scale) {
        // The values are final as read: their statistics were kept while reading.
        const [min, max, nanCount, infiniteCount] = this.stats.subarray(STATS_PER_COLUMN * k, STATS_PER_COLUMN * (k + 1));
        return { spec, values, nanCount, infiniteCount, range: min <= max ? { min, max } : null };
      }
      // Dividing by an exact 1000 rounds once (13 mΩ → 0.013 Ω); multiplying by 0.001 can be off by one ulp.
      const inverse = 1 / factor;
      const divisor = factor < 1 && Math.abs(inverse - Math.round(inverse)) < 1e-9 * inverse ? Math.round(inverse) : 0;
      let min = Infinity;
      let max = -Infinity;
      let nanCount = 0;
      let infiniteCount = 0;
      for (let i = 0; i < values.length; i++) {
        let v = values[i];
        if (v !== v) {
          nanCount++;
          continue;
        }
        values[i] = v = divisor ? v / divisor + offset : v * factor + offset;
        if (v === Infinity || v === -Infinity) infiniteCount++;
        if (v < min && v !== -Infinity) min = v;
        if (v > max && v !== Infinity) max = v;
      }
      return { spec, values, nanCount, infiniteCount, range: min <= max ? { min, max } : null };
    });
  }
}
