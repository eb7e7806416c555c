import type { MessagePort, Worker as NodeWorker } from 'node:worker_threads';
import { TransportParseError } from './errors';
import { emptyStats, readPlainRows, STATS_PER_COLUMN, type RowCursor, type RowFormat } from './plain-rows';

// Reads the data rows of a large ASCII-compatible file on worker threads as well as on the main thread. The main thread
// keeps reading the source and cuts it into segments of whole lines (newline-aligned byte ranges, copied once into
// shared memory); a worker reads the plain rows of a segment with the same readPlainRows the main thread uses, into
// shared columns. Segments are applied strictly in file order: their rows are appended to the table, and any line a
// worker did not take (comments, text, odd cells, wrong cell counts) goes with the rest of its segment through the
// ordinary line path on the main thread, so values, warnings and line numbers are exactly those of a sequential read.
// A segment is claimed atomically by whoever reads it first: when the main thread would otherwise wait for a worker
// that has not started on it (busy, or still starting up), it reads the segment itself. So a slow or busy worker never
// makes the read slower than a sequential one by more than the copying. Workers start only when the machine had a core
// to spare while reading began (minIdleCores), and exist only where Node's worker_threads do (found at run time, so
// browser bundles never see them).

/** Tuning of the parallel read (ParseOptions.parallel). */
export type ParallelOptions = {
  /** Smallest source (bytes; the size when known, else what has been read) read in parallel. Default 8 MiB. */
  minBytes?: number;
  /** Bytes a segment holds before it is cut at its last line break. Default 512 KiB. */
  segmentBytes?: number;
  /** Worker threads; default one fewer than the available cores, at least 1, at most 3. */
  workers?: number;
  /** Called at the end with how many segments the workers and the main thread read (for tests and benchmarks). */
  report?: (stats: ParallelStats) => void;
  /**
   * Whether the main thread reads a segment itself rather than wait for a worker that has not started on it (default
   * true). False makes the workers read every segment sent to them (for tests).
   */
  steal?: boolean;
  /**
   * Cores free for a worker since reading began (idleCores, measured over at least 60 ms) for workers to start; default
   * 0.5. On a machine whose cores are all busy a worker only adds copying. 0 starts them without measuring.
   */
  minIdleCores?: number;
};

export type ParallelStats = { workers: number; workerSegments: number; mainSegments: number };

export const PARALLEL_MIN_BYTES = 8 * 1024 * 1024;
const SEGMENT_BYTES = 512 * 1024;
const QUEUED_PER_WORKER = 4; // segments sent to a worker and not yet answered (the main thread takes the rest)
const MAX_PENDING_SEGMENTS = 8; // segments cut but not yet applied: bounds the memory in slots
const CLAIMED = -1; // a slot's claim word once a thread has taken its segment
// At most MAX_PENDING_SEGMENTS slots are pending at once, plus the one being cut and the one being filled.
const MAX_SLOTS = MAX_PENDING_SEGMENTS + 2;

/** What the parallel reader needs from the table: the row layout, and where rows and leftover lines go. */
export type RowTarget = {
  format: RowFormat;
  columns: number;
  /** Appends rows [0, rows) of `columns` to the table, with their statistics (see emptyStats). */
  appendRows(columns: Float64Array[], rows: number, stats: Float64Array): void;
  /** Feeds whole lines (bytes ending with a line break) through the ordinary line path, at the current line number. */
  writeLines(bytes: Uint8Array): void;
  /** Lines that have been appended as rows: advances the line number. */
  countLines(lines: number): void;
  /** The end of the source: the last line may lack a line break. */
  end(bytes: Uint8Array): void;
};

/** Reusable memory for one segment: its bytes, the columns of its rows and their statistics, shared with the workers. */
type Slot = {
  index: number;
  /** Bumped whenever input or output is replaced by a larger one, so workers are sent the new memory. */
  version: number;
  input: Uint8Array;
  output: Float64Array[];
  stats: Float64Array;
};

type Segment = { id: number; slot: Slot; length: number; done: boolean; worker: number; rows: number; next: number };

/** A worker's answer: rows read from the start of the segment and where the first line it left starts; or skipped. */
type SegmentResult = { id: number; rows: number; next: number; skipped: boolean };

type WorkerThreads = typeof import('node:worker_threads');

/** node:worker_threads when running on Node (looked up at run time: bundlers leave the call alone), else undefined. */
export function workerThreads(): WorkerThreads | undefined {
  if (typeof process === 'undefined' || typeof process.getBuiltinModule !== 'function') return undefined;
  try {
    return process.getBuiltinModule('node:worker_threads') as WorkerThreads | undefined;
  } catch {
    return undefined;
  }
}

function nodeOs(): typeof import('node:os') | undefined {
  if (typeof process === 'undefined' || typeof process.getBuiltinModule !== 'function') return undefined;
  return process.getBuiltinModule('node:os') as typeof import('node:os') | undefined;
}

/** Default worker count: the cores beyond the main thread's, at least one, at most three. */
export function defaultWorkers(): number {
  const os = nodeOs();
  const cores = os ? os.availableParallelism() : 2;
  return Math.max(1, Math.min(3, cores - 1));
}

/** The machine's idle time and this process's CPU time so far (ms, summed over cores and threads) at a moment. */
export type CpuSample = { atMs: number; idleMs: number; ownMs: number };

export function cpuSample(): CpuSample | undefined {
  const cpus = nodeOs()?.cpus() ?? [];
  if (cpus.length === 0) return undefined;
  let idleMs = 0;
  for (const cpu of cpus) idleMs += cpu.times.idle;
  const own = process.cpuUsage();
  return { atMs: performance.now(), idleMs, ownMs: (own.user + own.system) / 1000 };
}

/**
 * Cores free for a worker between two samples: the cores other processes left idle, less the one this process's main
 * thread needs. This process's own threads (file reads, the JIT compiler, the garbage collector) count as free, since
 * they are not the competition a worker would meet. The kernel counts idle time in 10 ms ticks: measure ≥ 60 ms.
 */
export function idleCores(from: CpuSample, to: CpuSample): number {
  const wallMs = Math.max(1, to.atMs - from.atMs);
  return (to.idleMs - from.idleMs + (to.ownMs - from.ownMs)) / wallMs - 1;
}

export const MIN_IDLE_CORES = 0.5;
export const IDLE_WINDOW_MS = 60;

// The worker: plain JavaScript around readPlainRows' own source text. `__name` is defined for transpilers that wrap
// named functions with it (keepNames); readPlainRows has no nested functions, so it is never called. The first message
// gives the row format; a task names its slot (whose shared memory comes with the first task for it) and claims the
// slot's segment before reading it.
const WORKER_SOURCE = (readRows: string) => `'use strict';
var __name = function (f) { return f; };
const { parentPort, workerData } = require('node:worker_threads');
const readPlainRows = (${readRows});
const claims = workerData.claims;
const results = workerData.results;
const cursor = { next: 0 };
const slots = new Map();
let format = null;
let sep = 10;
parentPort.on('message', function (task) {
  if (task.format) {
    format = task.format;
    sep = task.sep;
    return;
  }
  if (task.memory) slots.set(task.slot, task.memory);
  if (Atomics.compareExchange(claims, task.slot, task.id, ${CLAIMED}) !== task.id) {
    results.postMessage({ id: task.id, rows: 0, next: 0, skipped: true });
    return;
  }
  const memory = slots.get(task.slot);
  const out = memory.output;
  const rows = readPlainRows(memory.input.subarray(0, task.length), 0, task.length - 1, sep, out, 0, out[0].length, format, null, cursor, memory.stats);
  results.postMessage({ id: task.id, rows: rows, next: cursor.next, skipped: false });
});
`;

/**
 * Worker threads started as soon as a large source is opened, so that they have booted by the time the table's layout
 * is known and the rows begin; stopped unused when the source is read on the calling thread after all.
 */
export class WorkerCrew {
  readonly workers: (NodeWorker | null)[] = [];
  /** Per worker, the port its results arrive on. */
  readonly results: MessagePort[] = [];
  /** Per slot: the id of the segment waiting in it for a worker, or CLAIMED once a thread has taken it. */
  readonly claims = new Int32Array(new SharedArrayBuffer(4 * MAX_SLOTS));
  /** Called with (worker, message) for results, and with (worker, null) when a worker fails or stops. */
  onResult: (w: number, m: SegmentResult | null) => void = (w, m) => {
    if (!m) this.drop(w); // failed while starting: no tasks will go to it
  };

  constructor(
    readonly threads: WorkerThreads,
    count: number,
  ) {
    const source = WORKER_SOURCE(readPlainRows.toString());
    for (let w = 0; w < count; w++) {
      const { port1, port2 } = new threads.MessageChannel();
      const workerData = { claims: this.claims, results: port2 };
      const worker = new threads.Worker(source, { eval: true, workerData, transferList: [port2], execArgv: [] });
      port1.on('message', (m: SegmentResult) => this.onResult(w, m));
      worker.on('error', () => this.onResult(w, null));
      worker.on('exit', () => this.onResult(w, null));
      this.workers.push(worker);
      this.results.push(port1);
    }
  }

  /** Tells the workers how rows are laid out (before the first task). */
  start(format: RowFormat, sep: number): void {
    for (const worker of this.workers) worker?.postMessage({ format, sep });
  }

  /** Forgets worker w (failed or stopped) without waiting for it. */
  drop(w: number): void {
    const worker = this.workers[w];
    if (!worker) return;
    this.workers[w] = null;
    this.results[w].close();
    worker.removeAllListeners('exit');
    worker.removeAllListeners('error');
    worker.on('error', () => undefined);
    void worker.terminate().catch(() => undefined);
  }

  stop(): void {
    for (let w = 0; w < this.workers.length; w++) this.drop(w);
  }
}

/** Reads the rest of a source in segments, on workers and on the main thread; see the comment at the top. */
export class ParallelRows {
  private readonly workers: (NodeWorker | null)[];
  /** Per worker, the port its results arrive on: read as events, and polled while the main thread is busy. */
  private readonly results: MessagePort[];
  private readonly queued: number[];
  /** Per worker: the version of each slot's memory it has been sent (shared memory is sent once, then named). */
  private readonly known: Map<number, number>[];
  /** Per slot: the id of the segment waiting in it for a worker, or CLAIMED once a thread has taken it. */
  private readonly claims: Int32Array;
  private readonly threads: WorkerThreads;
  private readonly pending: Segment[] = [];
  private readonly pool: Slot[] = [];
  private readonly cursor: RowCursor = { next: 0 };
  private readonly segmentBytes: number;
  private readonly rowsPerSlot: number;
  /** The slot being filled from the source, and how many bytes it holds. */
  private slot: Slot;
  private used = 0;
  private slots = 0;
  private nextId = 0;
  private wake: (() => void) | null = null;
  private readonly stats: ParallelStats;

  constructor(
    private readonly crew: WorkerCrew,
    private readonly target: RowTarget,
    private readonly sep: number,
    private readonly maxLineBytes: number,
    private readonly options: ParallelOptions,
    bytesPerRow: number,
    partialLine: Uint8Array,
  ) {
    this.threads = crew.threads;
    this.workers = crew.workers;
    this.results = crew.results;
    this.claims = crew.claims;
    this.queued = crew.workers.map(() => 0);
    this.known = crew.workers.map(() => new Map());
    this.segmentBytes = Math.max(1024, options.segmentBytes ?? SEGMENT_BYTES);
    // Room for the rows of a full segment at the first rows' length, +25 %; a segment of shorter rows is finished here.
    this.rowsPerSlot = Math.ceil((1.25 * this.segmentBytes) / Math.max(1, bytesPerRow)) + 64;
    this.slot = this.acquire();
    this.fill(partialLine);
    this.stats = { workers: crew.workers.length, workerSegments: 0, mainSegments: 0 };
    crew.onResult = (w, m) => (m ? this.received(w, m) : this.lost(w));
    crew.start(target.format, sep);
  }

  /** Takes the next chunk of the source (copied: the source may reuse its memory). */
  async write(chunk: Uint8Array, final: boolean): Promise<void> {
    let offset = 0;
    while (offset < chunk.length) {
      const input = this.slot.input;
      const n = Math.min(chunk.length - offset, input.length - this.used);
      input.set(chunk.subarray(offset, offset + n), this.used);
      this.used += n;
      offset += n;
      if (this.used === input.length) await this.cut();
    }
    if (this.used > this.maxLineBytes) await this.checkLineLength();
    if (final) {
      await this.cut();
      await this.drain();
      this.close();
      this.target.end(this.slot.input.subarray(0, this.used));
      this.used = 0;
      this.options.report?.({ ...this.stats });
    } else this.apply();
  }

  /** Reads and applies every complete line held so far (the partial line stays). */
  async settle(): Promise<void> {
    await this.cut();
    await this.drain();
  }

  /** Stops the workers (after the end, or when reading failed or was cancelled). */
  close(): void {
    this.crew.stop();
  }

  /** A partial line over the limit: the ordinary path reports it, with its line number, once every earlier line is in. */
  private async checkLineLength(): Promise<void> {
    const input = this.slot.input;
    const lastBreak = input.lastIndexOf(this.sep, this.used - 1);
    if (this.used - lastBreak - 1 <= this.maxLineBytes) return;
    await this.drain();
    this.target.writeLines(input.subarray(0, this.used)); // throws line-too-long
    throw new TransportParseError('line-too-long', `A line is longer than ${this.maxLineBytes} bytes without a line break.`);
  }

  /** Cuts the slot after its last line break into a segment; the partial line after it starts the next slot. */
  private async cut(): Promise<void> {
    const input = this.slot.input;
    const lastBreak = this.used > 0 ? input.lastIndexOf(this.sep, this.used - 1) : -1;
    if (lastBreak < 0) {
      // One partial line fills the slot (checkLineLength stops it at the line limit): make room.
      if (this.used === input.length) this.grow(2 * input.length);
      return;
    }
    const segment: Segment = { id: this.nextId++, slot: this.slot, length: lastBreak + 1, done: false, worker: -1, rows: 0, next: 0 };
    const rest = input.subarray(lastBreak + 1, this.used);
    this.apply();
    while (this.pending.length >= MAX_PENDING_SEGMENTS) await this.headDone();
    this.slot = this.acquire();
    this.used = 0;
    this.fill(rest);
    this.dispatch(segment);
    this.apply();
  }

  /** Copies bytes into the slot being filled, growing it when they do not fit. */
  private fill(bytes: Uint8Array): void {
    if (this.used + bytes.length > this.slot.input.length) this.grow(2 * (this.used + bytes.length));
    this.slot.input.set(bytes, this.used);
    this.used += bytes.length;
  }

  /** Replaces the input of the slot being filled by a larger one holding the same bytes. */
  private grow(size: number): void {
    const bigger = new Uint8Array(new SharedArrayBuffer(size));
    bigger.set(this.slot.input.subarray(0, this.used));
    this.slot.input = bigger;
    this.slot.version++;
  }

  /** A free slot: one used before when there is one (no new memory to fault in), else a new one. */
  private acquire(): Slot {
    const columns = this.target.columns;
    const slot = this.pool.pop() ?? {
      index: this.slots++,
      version: 0,
      input: new Uint8Array(new SharedArrayBuffer(this.segmentBytes)),
      output: this.columns(this.rowsPerSlot),
      stats: new Float64Array(new SharedArrayBuffer(8 * STATS_PER_COLUMN * columns)),
    };
    emptyStats(columns, slot.stats);
    Atomics.store(this.claims, slot.index, CLAIMED);
    return slot;
  }

  private columns(rows: number): Float64Array[] {
    const memory = new SharedArrayBuffer(8 * rows * this.target.columns);
    return Array.from({ length: this.target.columns }, (_, k) => new Float64Array(memory, 8 * rows * k, rows));
  }

  /** Sends a segment to the least busy worker with room, else reads it here (straight into the table when nothing waits). */
  private dispatch(segment: Segment): void {
    this.poll();
    let best = -1;
    for (let w = 0; w < this.workers.length; w++) {
      if (this.workers[w] && this.queued[w] < QUEUED_PER_WORKER && (best < 0 || this.queued[w] < this.queued[best])) best = w;
    }
    const slot = segment.slot;
    if (best >= 0) {
      this.queued[best]++;
      segment.worker = best;
      const known = this.known[best];
      const memory = known.get(slot.index) === slot.version ? undefined : { input: slot.input, output: slot.output, stats: slot.stats };
      known.set(slot.index, slot.version);
      Atomics.store(this.claims, slot.index, segment.id);
      (this.workers[best] as NodeWorker).postMessage({ id: segment.id, slot: slot.index, length: segment.length, memory });
      this.pending.push(segment);
      return;
    }
    this.stats.mainSegments++;
    if (this.pending.length === 0) {
      this.target.writeLines(slot.input.subarray(0, segment.length));
      this.pool.push(slot);
      return;
    }
    this.readHere(segment);
    this.pending.push(segment);
  }

  /** Reads a segment's plain rows on the main thread, as a worker would. */
  private readHere(segment: Segment): void {
    const { input, output, stats } = segment.slot;
    const rows = readPlainRows(input, 0, segment.length - 1, this.sep, output, 0, output[0].length, this.target.format, null, this.cursor, stats);
    Object.assign(segment, { done: true, rows, next: this.cursor.next });
  }

  /** Takes a worker's segment back if no worker has started on it yet; true when the main thread now holds it. */
  private steal(segment: Segment): boolean {
    if (this.options.steal === false) return false;
    if (Atomics.compareExchange(this.claims, segment.slot.index, segment.id, CLAIMED) !== segment.id) return false;
    this.stats.mainSegments++;
    this.readHere(segment);
    return true;
  }

  /** Takes the results that have arrived without waiting for the event loop (a source in memory never yields to it). */
  private poll(): void {
    for (let w = 0; w < this.workers.length; w++) {
      if (!this.workers[w] || this.queued[w] === 0) continue;
      for (let m = this.threads.receiveMessageOnPort(this.results[w]); m; m = this.threads.receiveMessageOnPort(this.results[w])) {
        this.received(w, m.message as SegmentResult);
      }
    }
  }

  private received(w: number, m: SegmentResult): void {
    if (!this.workers[w]) return; // lost meanwhile: its segments were read here
    this.queued[w]--;
    if (m.skipped) return; // the main thread took it
    this.stats.workerSegments++;
    const segment = this.pending.find((s) => s.id === m.id);
    if (segment) Object.assign(segment, { done: true, rows: m.rows, next: m.next });
    this.notify();
  }

  /** A worker failed or stopped: the main thread reads what it held (the bytes are still here). */
  private lost(w: number): void {
    if (!this.workers[w]) return;
    this.crew.drop(w);
    this.queued[w] = 0;
    for (const segment of this.pending) {
      if (segment.done || segment.worker !== w) continue;
      Atomics.store(this.claims, segment.slot.index, CLAIMED);
      this.stats.mainSegments++;
      this.readHere(segment);
    }
    this.notify();
  }

  private notify(): void {
    const wake = this.wake;
    this.wake = null;
    wake?.();
  }

  /** Makes the oldest pending segment done: read here when no worker has started on it, else wait for its worker. */
  private async headDone(): Promise<void> {
    this.apply();
    const head = this.pending[0];
    if (!head || head.done || this.steal(head)) {
      this.apply();
      return;
    }
    await new Promise<void>((resolve) => (this.wake = resolve));
    this.apply();
  }

  /** Applies the finished segments at the head of the queue, in file order, and frees their slots. */
  private apply(): void {
    this.poll();
    while (this.pending.length > 0 && this.pending[0].done) {
      const segment = this.pending.shift() as Segment;
      const { slot, rows, next, length } = segment;
      if (rows > 0) {
        this.target.appendRows(slot.output, rows, slot.stats);
        this.target.countLines(rows);
      }
      if (next < length) this.target.writeLines(slot.input.subarray(next, length));
      // Rows shorter than the estimate filled the columns: give the slot more room for its next segment.
      if (rows === slot.output[0].length) {
        slot.output = this.columns(2 * rows);
        slot.version++;
      }
      this.pool.push(slot);
    }
  }

  /** Waits until every segment is applied. */
  private async drain(): Promise<void> {
    while (this.pending.length > 0) await this.headDone();
  }
}
