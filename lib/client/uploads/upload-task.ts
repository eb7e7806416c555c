import { UploadApiError, type UploadApi } from './api-client';
import { retryDelayMs, type RetryPolicy, type Sleep } from './backoff';
import { hashBlobSha256, startHash, type HashProgress } from './hash-file';
import type { Limiter } from './limiter';
import { pollAnalysis } from './poll-analysis';
import type { ResumeRecord, ResumeStore } from './resume-store';
import { completeUpload, openUpload } from './open-upload';
import type { FileView, LocalFile, UploadStatusResponse } from './types';
import { uploadParts } from './upload-parts';
import { describeUploadError, isRetryable } from './upload-errors';
import { newRow, reduceUpload, rowFromServer, type UploadEvent, type UploadRow } from './upload-state';

export type UploadDeps = {
  api: UploadApi;
  store: ResumeStore;
  /** Shared by all files: parts in flight on the page. */
  partLimiter: Limiter;
  /** Shared by all files: one file hashed at a time, so the first file finishes first. */
  hashLimiter: Limiter;
  retry: RetryPolicy;
  sleep: Sleep;
  pollIntervalMs?: number;
  hashChunkBytes?: number;
  onVerified?: (file: FileView) => void;
  onAnalysed?: (file: FileView) => void;
};

const PAUSED = 'paused';
const CANCELLED = 'cancelled';

/** One file's journey: check (SHA-256) → begin → parts → complete → analysis, with pause, resume and cancel. */
export class UploadTask {
  row: UploadRow;
  private file: LocalFile | null;
  private sha256: string | null = null;
  private hashProgress: HashProgress | null = null;
  private controller: AbortController | null = null;
  private running: Promise<void> | null = null;
  private listeners = new Set<(row: UploadRow, previous: UploadRow) => void>();

  private constructor(private readonly deps: UploadDeps, readonly versionId: string, row: UploadRow, file: LocalFile | null) {
    this.row = row;
    this.file = file;
  }

  static fromFile(deps: UploadDeps, versionId: string, key: string, file: LocalFile): UploadTask {
    return new UploadTask(deps, versionId, newRow(key, file.name, file.size), file);
  }

  static fromServer(deps: UploadDeps, versionId: string, file: FileView): UploadTask {
    return new UploadTask(deps, versionId, rowFromServer(file), null);
  }

  subscribe(listener: (row: UploadRow, previous: UploadRow) => void): () => void {
    this.listeners.add(listener);
    return () => {
      this.listeners.delete(listener);
    };
  }

  dispatch(event: UploadEvent): void {
    const previous = this.row;
    this.row = reduceUpload(previous, event);
    if (this.row !== previous) for (const l of this.listeners) l(this.row, previous);
  }

  /** Takes newer data for the row from outside (a server listing, a role change) and tells subscribers. */
  replaceRow(row: UploadRow): void {
    const previous = this.row;
    this.row = row;
    for (const l of this.listeners) l(this.row, previous);
  }

  get hasLocalFile(): boolean {
    return this.file !== null;
  }

  /** Starts (or, after a failure or pause, continues) the upload; resolves when this run stops for any reason. */
  start(): Promise<void> {
    if (this.row.phase === 'analysing') return this.watchAnalysis();
    if (this.running || !this.file) return this.running ?? Promise.resolve();
    if (this.row.phase === 'paused' || this.row.phase === 'failed' || this.row.phase === 'unfinished') this.dispatch({ type: 'resumed' });
    if (this.row.phase !== 'queued' && this.row.phase !== 'hashing' && this.row.phase !== 'uploading') return Promise.resolve();
    return this.launch((signal) => this.run(signal));
  }

  pause(): void {
    if (this.row.phase !== 'queued' && this.row.phase !== 'hashing' && this.row.phase !== 'uploading') return;
    this.halt(PAUSED);
    this.dispatch({ type: 'paused' });
  }

  private launch(work: (signal: AbortSignal) => Promise<void>): Promise<void> {
    const controller = new AbortController();
    this.controller = controller;
    const running = work(controller.signal).finally(() => {
      if (this.controller !== controller) return; // halted: a newer run may already be going
      this.controller = null;
      this.running = null;
    });
    this.running = running;
    return running;
  }

  /** Aborts the current run and forgets it at once, so a resume right after starts a fresh run. */
  private halt(reason: string): Promise<void> | null {
    const running = this.running;
    this.controller?.abort(reason);
    this.controller = null;
    this.running = null;
    return running;
  }

  /** Stops local work and tells the server to drop the unfinished upload (its staging object and row). */
  async cancel(): Promise<void> {
    if (!['queued', 'hashing', 'uploading', 'paused', 'failed', 'unfinished'].includes(this.row.phase)) return;
    await this.halt(CANCELLED)?.catch(() => undefined);
    const fileId = this.row.fileId;
    this.dispatch({ type: 'cancelled' });
    if (!fileId) return;
    this.deps.store.remove(fileId);
    try {
      await this.deps.api.cancelUpload(fileId);
    } catch (err) {
      // 404: already gone. Otherwise the server's stale-upload cleanup removes it within a day.
      if (!(err instanceof UploadApiError && err.status === 404)) throw err;
    }
  }

  /** Stops any network activity without changing the row (the component unmounts); records stay for a resume. */
  stop(): void {
    if (this.row.phase === 'queued' || this.row.phase === 'hashing' || this.row.phase === 'uploading') this.pause();
    else this.halt(PAUSED);
  }

  /**
   * Gives an unfinished upload its local file back. The same name, size and modification time as the stored
   * record means the same file; otherwise it is checked again and, if its SHA-256 differs, uploaded afresh.
   */
  attachFile(file: LocalFile, record: ResumeRecord | undefined): boolean {
    if (this.row.phase !== 'unfinished' && !(this.row.phase === 'failed' && !this.file)) return false;
    if (file.name !== this.row.name || file.size !== this.row.sizeBytes) return false;
    this.file = file;
    if (record && record.fileId === this.row.fileId && record.lastModified === file.lastModified) this.sha256 = record.sha256;
    void this.start();
    return true;
  }

  /** Follows the server's analysis of a verified file until it is done or failed. */
  watchAnalysis(): Promise<void> {
    if (this.running || this.row.phase !== 'analysing' || !this.row.fileId) return this.running ?? Promise.resolve();
    const fileId = this.row.fileId;
    return this.launch((signal) => this.followAnalysis(fileId, signal));
  }

  private async run(signal: AbortSignal): Promise<void> {
    try {
      if (!this.sha256) this.sha256 = await this.hash(signal);
      for (let pass = 1; ; pass += 1) {
        const opened = await openUpload({
          api: this.deps.api, store: this.deps.store, versionId: this.versionId, file: this.file!, sha256: this.sha256,
          fileId: this.row.fileId, role: this.row.file?.role, signal, retry: (what, step) => this.withRetry(signal, step, what),
        });
        if (opened.replaced) this.forgetServerFile();
        if ('verified' in opened) return await this.finish(opened.verified, signal);
        const parts = await this.sendParts(opened.status, signal);
        this.dispatch({ type: 'verifying' });
        let file: FileView;
        try {
          file = await this.withRetry(signal, () => completeUpload(this.deps.api, opened.status.fileId, parts, signal, this.row.file?.role), 'File storage did not answer');
        } catch (err) {
          // 409: storage lacks a part (or holds another copy of one); ask what is missing and send it once more
          if (pass > 1 || !(err instanceof UploadApiError && err.status === 409)) throw err;
          continue;
        }
        this.deps.store.remove(opened.status.fileId);
        return await this.finish(file, signal);
      }
    } catch (err) {
      if (signal.aborted) return; // paused, cancelled or unmounted: those set the row themselves
      if (err instanceof UploadApiError && err.status === 422 && this.row.phase === 'verifying') {
        // the server refused the received bytes and removed its record: a retry starts from a fresh check
        if (this.row.fileId) this.deps.store.remove(this.row.fileId);
        this.sha256 = null;
        this.hashProgress = null;
        this.forgetServerFile();
        this.dispatch({ type: 'failed', error: describeUploadError(err) });
        return;
      }
      this.dispatch({ type: 'failed', error: describeUploadError(err) });
    }
  }

  /** Sends the parts the server still misses; returns every part with its ETag, or undefined when one is unknown. */
  private async sendParts(status: UploadStatusResponse, signal: AbortSignal): Promise<{ partNumber: number; etag: string }[] | undefined> {
    const known = status.completedParts.reduce((sum, p) => sum + p.sizeBytes, 0);
    this.dispatch({ type: 'upload-started', fileId: status.fileId, uploadedBytes: known });
    const sent = await uploadParts({
      file: this.file!,
      partSizeBytes: status.partSizeBytes,
      parts: status.parts,
      putPart: (url, body, s) => this.deps.api.putPart(url, body, s),
      limiter: this.deps.partLimiter,
      retry: this.deps.retry,
      signal,
      sleep: this.deps.sleep,
      refreshUrls: async () => (await this.deps.api.getUploadStatus(status.fileId, signal)).parts,
      onPartUploaded: (p) => this.dispatch({ type: 'part-uploaded', sizeBytes: p.sizeBytes }),
      onRetry: ({ partNumber, delayMs }) => this.dispatch({ type: 'note', note: `Part ${partNumber} did not arrive; trying again in ${Math.ceil(delayMs / 1000)} s.` }),
    });
    const all = [...status.completedParts, ...sent];
    // Without every ETag (bucket CORS hides the header) the server lists the parts itself.
    if (!all.every((p) => p.etag)) return undefined;
    return all.map((p) => ({ partNumber: p.partNumber, etag: p.etag! })).sort((a, b) => a.partNumber - b.partNumber);
  }

  private forgetServerFile(): void {
    this.row = { ...this.row, fileId: null, file: null };
  }

  private async hash(signal: AbortSignal): Promise<string> {
    const release = await this.deps.hashLimiter.acquire(signal);
    try {
      this.hashProgress ??= await startHash();
      this.dispatch({ type: 'hashing', hashedBytes: this.hashProgress.offsetBytes });
      return await hashBlobSha256(this.file!, {
        progress: this.hashProgress,
        signal,
        chunkBytes: this.deps.hashChunkBytes,
        onProgress: (hashedBytes) => {
          // one update per whole percent: a 20 GiB file is 5000 chunks, the bar needs 100 steps
          const percent = Math.floor((hashedBytes / Math.max(1, this.row.sizeBytes)) * 100);
          if (percent !== Math.floor((this.row.hashedBytes / Math.max(1, this.row.sizeBytes)) * 100)) this.dispatch({ type: 'hash-progress', hashedBytes });
        },
      });
    } finally {
      release();
    }
  }

  private async finish(file: FileView, signal: AbortSignal): Promise<void> {
    this.dispatch({ type: 'verified', file });
    this.deps.onVerified?.(file);
    if (this.row.phase === 'analysing') await this.followAnalysis(file.id, signal);
  }

  /** Polls the analysis; trouble asking is only a note on the row, as the file itself is safely stored. */
  private async followAnalysis(fileId: string, signal: AbortSignal): Promise<void> {
    try {
      const final = await pollAnalysis({
        api: this.deps.api, fileId, signal, sleep: this.deps.sleep, retry: this.deps.retry, intervalMs: this.deps.pollIntervalMs,
        onUpdate: (a) => this.dispatch({ type: 'analysis', state: a.state, progress: a.progress, error: a.error }),
      });
      if (final.state === 'done' || final.state === 'failed') this.deps.onAnalysed?.(this.row.file!);
    } catch (err) {
      if (signal.aborted) return;
      const reason = err instanceof UploadApiError ? (err.status === 0 ? 'no connection' : `HTTP ${err.status}`) : 'unexpected answer';
      this.dispatch({ type: 'note', note: `Could not ask how the analysis is going (${reason}). It goes on on the server; press “Check again”.` });
    }
  }

  /** One API step with backoff on passing failures; the row says what is happening meanwhile. */
  private async withRetry<T>(signal: AbortSignal, step: () => Promise<T>, what: string): Promise<T> {
    for (let attempt = 1; ; attempt += 1) {
      try {
        const result = await step();
        if (attempt > 1) this.dispatch({ type: 'note', note: null });
        return result;
      } catch (err) {
        if (signal.aborted || !isRetryable(err) || attempt >= this.deps.retry.maxAttempts) throw err;
        const delayMs = retryDelayMs(attempt, this.deps.retry);
        this.dispatch({ type: 'note', note: `${what}; trying again in ${Math.ceil(delayMs / 1000)} s.` });
        await this.deps.sleep(delayMs, signal);
      }
    }
  }
}
