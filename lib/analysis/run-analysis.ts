import 'server-only';
import { log } from '@/lib/log';
import type { TransportDatasetDraft } from '@/lib/schema';
import { defaultStore, isStorageUnavailable, readObject, type ObjectStore } from '@/lib/storage/objects';
import { summariseFile } from '@/lib/transport/summarise-file';
import { TransportParseError } from '@/lib/transport/parse';
import { claimNextAnalysis, failAnalysis, finishAnalysis, releaseAnalysis, setAnalysisProgress } from './repo';

export type RunAnalysisOptions = {
  /** Only these files (tests share the database with other processes). */
  fileIds?: string[];
  store?: ObjectStore;
  /** Aborting stops the read and puts the file back in the queue. */
  signal?: AbortSignal;
  /** A running analysis silent this long belongs to a dead worker and is claimed again (default 5 min). */
  staleAfterMs?: number;
  /** Least time between two progress writes (default 1 s). */
  progressIntervalMs?: number;
};

export type RunAnalysisResult = { fileId: string; outcome: 'done' | 'failed' | 'released' | 'superseded' };

function plainMessage(error: unknown): string {
  if (error instanceof TransportParseError) {
    return error.line !== undefined && !/\bline \d/.test(error.message) ? `${error.message} (line ${error.line})` : error.message;
  }
  return `The analysis stopped unexpectedly: ${error instanceof Error ? error.message : String(error)}`;
}

const asDraft = (metadata: unknown): TransportDatasetDraft | undefined =>
  metadata && typeof metadata === 'object' && !Array.isArray(metadata) ? (metadata as TransportDatasetDraft) : undefined;

/**
 * Claims one queued file and summarises it with the transport core, streaming the object from storage (memory
 * stays bounded whatever the file size). Returns null when nothing was waiting.
 */
export async function runAnalysisOnce(options: RunAnalysisOptions = {}): Promise<RunAnalysisResult | null> {
  const file = await claimNextAnalysis({ fileIds: options.fileIds, staleBefore: new Date(Date.now() - (options.staleAfterMs ?? 300_000)) });
  if (!file) return null;
  const interval = options.progressIntervalMs ?? 1000;
  let lastWrite = Date.now();
  let writes = Promise.resolve();
  const onProgress = (bytesRead: number) => {
    const now = Date.now();
    if (now - lastWrite < interval || file.sizeBytes === 0) return;
    lastWrite = now;
    // Never 1 before the summary is stored: "done" is the state, not the progress.
    const progress = Math.min(0.99, bytesRead / file.sizeBytes);
    writes = writes.then(() => setAnalysisProgress(file.id, progress)).catch((error: unknown) => log('warn', 'could not record analysis progress', { fileId: file.id, error: String(error) }));
  };
  try {
    const read = await readObject(options.store ?? defaultStore(), file.storageKey);
    const summary = await summariseFile(read.body, { metadata: asDraft(file.metadata), fileName: file.name, sizeBytes: file.sizeBytes, signal: options.signal, onProgress });
    await writes;
    return { fileId: file.id, outcome: (await finishAnalysis(file.id, summary)) ? 'done' : 'superseded' };
  } catch (error) {
    await writes;
    if (options.signal?.aborted || isStorageUnavailable(error)) {
      await releaseAnalysis(file.id);
      return { fileId: file.id, outcome: 'released' };
    }
    if (!(error instanceof TransportParseError)) log('error', 'analysis failed', { fileId: file.id, error: error instanceof Error ? error.stack : String(error) });
    return { fileId: file.id, outcome: (await failAnalysis(file.id, plainMessage(error))) ? 'failed' : 'superseded' };
  }
}
