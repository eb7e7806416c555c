import { formatBytes } from '@/lib/format/bytes';
import { UploadApiError, type UploadApi } from './api-client';
import { DEFAULT_RETRY, sleep as realSleep, type RetryPolicy, type Sleep } from './backoff';
import { createLimiter } from './limiter';
import type { ResumeStore } from './resume-store';
import type { FileRole, FileView, LocalFile } from './types';
import { describeUploadError } from './upload-errors';
import { describePhase, rowFromServer, type UploadRow } from './upload-state';
import { UploadTask, type UploadDeps } from './upload-task';

/** Parts in flight on the page at once (one file's parts, three at a time). */
export const PARALLEL_PARTS = 3;

export type UploadManagerOptions = {
  versionId: string;
  api: UploadApi;
  store: ResumeStore;
  retry?: RetryPolicy;
  sleep?: Sleep;
  pollIntervalMs?: number;
  hashChunkBytes?: number;
  /** A file became verified, was analysed, changed role or was removed: the page may reload its server data. */
  onFilesChanged?: () => void;
  /** A sentence for the live region when a row changes phase. */
  announce?: (message: string) => void;
};

export type UploadManager = ReturnType<typeof createUploadManager>;

const BUSY: UploadRow['phase'][] = ['queued', 'hashing', 'uploading', 'verifying'];

/** Every file row of one draft version: adds, resumes and removes uploads, and tells subscribers when rows change. */
export function createUploadManager(opts: UploadManagerOptions) {
  const deps: UploadDeps = {
    api: opts.api,
    store: opts.store,
    partLimiter: createLimiter(PARALLEL_PARTS),
    hashLimiter: createLimiter(1),
    retry: opts.retry ?? DEFAULT_RETRY,
    sleep: opts.sleep ?? realSleep,
    pollIntervalMs: opts.pollIntervalMs,
    hashChunkBytes: opts.hashChunkBytes,
    onVerified: () => filesChanged(),
    onAnalysed: () => filesChanged(),
  };
  const fileListeners = new Set<(files: FileView[]) => void>();
  function filesChanged(): void {
    opts.onFilesChanged?.();
    const files = tasks.flatMap((t) => (t.row.file ? [t.row.file] : []));
    for (const l of fileListeners) l(files);
  }
  let tasks: UploadTask[] = [];
  let snapshot: readonly UploadRow[] = [];
  const listeners = new Set<() => void>();
  let counter = 0;

  function changed(): void {
    snapshot = tasks.map((t) => t.row);
    for (const l of listeners) l();
  }

  function track(task: UploadTask): UploadTask {
    task.subscribe((row, previous) => {
      if (row.phase === 'cancelled') tasks = tasks.filter((t) => t !== task);
      if (row.phase !== previous.phase) opts.announce?.(`${row.name}: ${describePhase(row)}`);
      changed();
    });
    return task;
  }

  function find(key: string): UploadTask | undefined {
    return tasks.find((t) => t.row.key === key);
  }

  function fromServer(file: FileView): UploadTask {
    return track(UploadTask.fromServer(deps, opts.versionId, file));
  }

  const askedProgress = new Set<string>();
  async function showKnownProgress(task: UploadTask): Promise<void> {
    const fileId = task.row.fileId!;
    if (askedProgress.has(fileId)) return;
    askedProgress.add(fileId);
    try {
      const status = await opts.api.getUploadStatus(fileId);
      task.dispatch({ type: 'known-progress', uploadedBytes: status.completedParts.reduce((s, p) => s + p.sizeBytes, 0) });
    } catch {
      // only a nicety: the row still offers to resume
    }
  }

  /** Adds rows for server files not shown yet and refreshes rows that are only being watched; no network. */
  function merge(files: FileView[]): void {
    for (const file of files) {
      const task = tasks.find((t) => t.row.fileId === file.id);
      if (!task) {
        tasks = [...tasks, fromServer(file)];
        continue;
      }
      const watched = ['ready', 'analysing', 'analysis-failed'].includes(task.row.phase);
      const finishedElsewhere = task.row.phase === 'unfinished' && file.uploadState === 'verified';
      if (watched || finishedElsewhere) task.replaceRow({ ...rowFromServer(file), key: task.row.key });
    }
    changed();
  }

  let pruned = false;
  /** Network side of showing the list: forget stale resume records, show what unfinished uploads sent, follow analyses. */
  function start(): void {
    if (!pruned) {
      pruned = true;
      const pending = tasks.filter((t) => t.row.phase === 'unfinished').map((t) => t.row.fileId!);
      opts.store.prune(opts.versionId, new Set(pending));
    }
    for (const t of tasks) {
      if (t.row.phase === 'analysing') void t.watchAnalysis();
      if (t.row.phase === 'unfinished' && t.row.uploadedBytes === 0) void showKnownProgress(t);
    }
  }

  async function cancel(key: string): Promise<string | null> {
    try {
      await find(key)?.cancel();
      return null;
    } catch (err) {
      return describeUploadError(err);
    }
  }

  return {
    subscribe(listener: () => void): () => void {
      listeners.add(listener);
      return () => {
        listeners.delete(listener);
      };
    },
    getSnapshot: (): readonly UploadRow[] => snapshot,
    /** Like the onFilesChanged option, with the server files now shown; for listeners that come and go (React effects). */
    watchFiles(listener: (files: FileView[]) => void): () => void {
      fileListeners.add(listener);
      return () => {
        fileListeners.delete(listener);
      };
    },
    hasLocalFile: (key: string) => find(key)?.hasLocalFile ?? false,
    /** True while something would be lost by leaving the page. */
    isBusy: () => tasks.some((t) => BUSY.includes(t.row.phase)),

    /** Rows for the server's first list, without any network or storage access (safe while rendering). */
    load: merge,
    /** Merges a fresh server list (after a refresh) and follows what it shows. */
    sync(files: FileView[]): void {
      merge(files);
      start();
    },
    start,

    /** Pauses every upload and polling (the page is going away); resume records stay. */
    stop(): void {
      for (const t of tasks) t.stop();
    },

    /** Picked or dropped files: each resumes the unfinished upload it matches, or starts a new one. Returns refusals. */
    addFiles(files: Iterable<LocalFile>): string[] {
      const refused: string[] = [];
      for (const file of files) {
        const same = tasks.filter((t) => t.row.name === file.name);
        const waiting = same.find((t) => !t.hasLocalFile && (t.row.phase === 'unfinished' || t.row.phase === 'failed'));
        if (waiting && waiting.attachFile(file, opts.store.findFor(opts.versionId, file))) continue;
        if (same.some((t) => t.row.phase !== 'failed')) {
          refused.push(`${file.name} is already in this draft. Remove it first to upload it again.`);
          continue;
        }
        tasks = tasks.filter((t) => !same.includes(t)); // a failed try under this name is replaced
        counter += 1;
        const task = track(UploadTask.fromFile(deps, opts.versionId, `local-${counter}`, file));
        tasks = [...tasks, task];
        void task.start();
      }
      changed();
      return refused;
    },

    /** The "pick the file again" of one unfinished row; refuses a file that is not the one it waits for. */
    attach(key: string, file: LocalFile): string | null {
      const task = find(key);
      if (!task) return null;
      if (task.attachFile(file, opts.store.findFor(opts.versionId, file))) return null;
      return `That is ${file.name} (${formatBytes(file.size)}), not ${task.row.name} (${formatBytes(task.row.sizeBytes)}). Pick the same file to resume.`;
    },

    pause: (key: string) => find(key)?.pause(),
    resume: (key: string) => void find(key)?.start(),
    cancel,

    /** Drops a failed row; an upload the server still holds is cancelled there too. */
    async dismiss(key: string): Promise<string | null> {
      const task = find(key);
      if (!task) return null;
      const error = await cancel(key);
      tasks = tasks.filter((t) => t !== task);
      changed();
      return error;
    },

    async setRole(key: string, role: FileRole): Promise<string | null> {
      const task = find(key);
      if (!task?.row.fileId || !task.row.file) return null;
      try {
        const file = await opts.api.updateFileRole(task.row.fileId, role);
        task.replaceRow({ ...task.row, file: { ...task.row.file, role: file.role } });
        filesChanged();
        return null;
      } catch (err) {
        return describeUploadError(err);
      }
    },

    /** Deletes a verified file from the draft. */
    async remove(key: string): Promise<string | null> {
      const task = find(key);
      if (!task?.row.fileId) return null;
      try {
        await opts.api.removeFile(task.row.fileId);
      } catch (err) {
        if (!(err instanceof UploadApiError && err.status === 404)) return describeUploadError(err);
      }
      task.stop();
      tasks = tasks.filter((t) => t !== task);
      changed();
      opts.announce?.(`${task.row.name}: removed`);
      filesChanged();
      return null;
    },
  };
}
