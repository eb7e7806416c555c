import { formatBytes } from '@/lib/format/bytes';
import type { FileView } from './types';

export type UploadPhase =
  | 'queued' // waiting for its turn to be checked
  | 'hashing' // computing SHA-256 in the browser ("checking file")
  | 'uploading'
  | 'paused'
  | 'verifying' // the server hashes what it received
  | 'analysing'
  | 'ready'
  | 'analysis-failed' // stored and verified, but the file could not be read as a table
  | 'failed'
  | 'unfinished' // known to the server from an earlier visit; needs the local file picked again
  | 'cancelled';

export type UploadRow = {
  key: string;
  name: string;
  sizeBytes: number;
  phase: UploadPhase;
  pausedFrom: 'queued' | 'hashing' | 'uploading' | null;
  hashedBytes: number;
  uploadedBytes: number;
  analysisProgress: number;
  fileId: string | null;
  file: FileView | null;
  error: string | null;
  /** A passing note while a step is retried ("connection lost, trying again in 4 s"). */
  note: string | null;
};

export type UploadEvent =
  | { type: 'hashing'; hashedBytes: number }
  | { type: 'hash-progress'; hashedBytes: number }
  | { type: 'upload-started'; fileId: string; uploadedBytes: number }
  | { type: 'part-uploaded'; sizeBytes: number }
  | { type: 'note'; note: string | null }
  | { type: 'paused' }
  | { type: 'resumed' }
  | { type: 'verifying' }
  | { type: 'verified'; file: FileView }
  | { type: 'analysis'; state: FileView['analysisState']; progress: number; error: string | null }
  | { type: 'failed'; error: string }
  | { type: 'cancelled' }
  | { type: 'known-progress'; uploadedBytes: number };

export function newRow(key: string, name: string, sizeBytes: number): UploadRow {
  return { key, name, sizeBytes, phase: 'queued', pausedFrom: null, hashedBytes: 0, uploadedBytes: 0, analysisProgress: 0, fileId: null, file: null, error: null, note: null };
}

/** A row for a file the server already lists (verified, or an upload left unfinished on an earlier visit). */
export function rowFromServer(file: FileView): UploadRow {
  const row = { ...newRow(file.id, file.name, file.sizeBytes), fileId: file.id, file };
  if (file.uploadState === 'pending') return { ...row, phase: 'unfinished' };
  if (file.uploadState === 'failed') return { ...row, phase: 'failed', error: 'The upload did not finish. Remove it, or add the file again.' };
  return withAnalysis({ ...row, uploadedBytes: file.sizeBytes }, file.analysisState, file.analysisProgress, file.analysisError);
}

function withAnalysis(row: UploadRow, state: FileView['analysisState'], progress: number, error: string | null): UploadRow {
  const file = row.file ? { ...row.file, analysisState: state, analysisProgress: progress, analysisError: error } : null;
  if (state === 'queued' || state === 'running') return { ...row, file, phase: 'analysing', analysisProgress: progress };
  if (state === 'failed') return { ...row, file, phase: 'analysis-failed', analysisProgress: progress, error: error ?? 'The file could not be read as a table.' };
  return { ...row, file, phase: 'ready', analysisProgress: state === 'done' ? 1 : 0, error: null };
}

const ACTIVE: UploadPhase[] = ['queued', 'hashing', 'uploading'];
const FINISHED: UploadPhase[] = ['ready', 'analysis-failed', 'cancelled'];

/** The upload state machine: events that do not fit the current phase leave the row unchanged. */
export function reduceUpload(row: UploadRow, event: UploadEvent): UploadRow {
  switch (event.type) {
    case 'hashing':
      return row.phase === 'queued' ? { ...row, phase: 'hashing', hashedBytes: event.hashedBytes } : row;
    case 'hash-progress':
      return row.phase === 'hashing' ? { ...row, hashedBytes: event.hashedBytes } : row;
    case 'upload-started':
      return row.phase === 'hashing' || row.phase === 'queued' || row.phase === 'uploading' || row.phase === 'verifying'
        ? { ...row, phase: 'uploading', fileId: event.fileId, hashedBytes: row.sizeBytes, uploadedBytes: event.uploadedBytes, note: null }
        : row;
    case 'part-uploaded': // a part may land just after a pause: its bytes still count
      return row.phase === 'uploading' || row.phase === 'paused'
        ? { ...row, uploadedBytes: Math.min(row.sizeBytes, row.uploadedBytes + event.sizeBytes), note: null }
        : row;
    case 'note':
      return ACTIVE.includes(row.phase) || row.phase === 'verifying' || row.phase === 'analysing' ? { ...row, note: event.note } : row;
    case 'paused':
      return ACTIVE.includes(row.phase) ? { ...row, phase: 'paused', pausedFrom: row.phase as UploadRow['pausedFrom'], note: null } : row;
    case 'resumed':
      return row.phase === 'paused' || row.phase === 'failed' || row.phase === 'unfinished'
        ? { ...row, phase: row.pausedFrom ?? 'queued', pausedFrom: null, error: null, note: null }
        : row;
    case 'verifying':
      return row.phase === 'uploading' ? { ...row, phase: 'verifying', uploadedBytes: row.sizeBytes, note: null } : row;
    case 'verified':
      return row.phase === 'verifying' || row.phase === 'uploading' || row.phase === 'queued'
        ? withAnalysis({ ...row, fileId: event.file.id, file: event.file, uploadedBytes: row.sizeBytes, note: null }, event.file.analysisState, event.file.analysisProgress, event.file.analysisError)
        : row;
    case 'analysis':
      return row.phase === 'analysing' || row.phase === 'ready' ? withAnalysis({ ...row, note: null }, event.state, event.progress, event.error) : row;
    case 'failed':
      return FINISHED.includes(row.phase) ? row : { ...row, phase: 'failed', error: event.error, note: null };
    case 'cancelled':
      return FINISHED.includes(row.phase) || row.phase === 'verifying' || row.phase === 'analysing' ? row : { ...row, phase: 'cancelled' };
    case 'known-progress': // what an unfinished upload had sent before, as the server tells
      return row.phase === 'unfinished' ? { ...row, uploadedBytes: Math.min(row.sizeBytes, event.uploadedBytes) } : row;
  }
}

const NBSP = '\u00a0';
const pct = (fraction: number) => `${Math.floor(Math.max(0, Math.min(1, fraction)) * 100)}${NBSP}%`;

/** Percent shown on the row's progress bar for its phase, or null when the step gives no measure (verifying). */
export function phasePercent(row: UploadRow): number | null {
  const size = row.sizeBytes || 1;
  switch (row.phase) {
    case 'queued': return 0;
    case 'hashing': return Math.floor((row.hashedBytes / size) * 100);
    case 'uploading': return Math.floor((row.uploadedBytes / size) * 100);
    case 'unfinished': return Math.floor((row.uploadedBytes / size) * 100);
    case 'paused': return Math.floor(((row.pausedFrom === 'hashing' ? row.hashedBytes : row.uploadedBytes) / size) * 100);
    case 'analysing': return Math.floor(row.analysisProgress * 100);
    case 'ready': case 'analysis-failed': return 100;
    default: return null;
  }
}

/** The phase in words, as the row and the screen reader say it. */
export function describePhase(row: UploadRow): string {
  const size = row.sizeBytes || 1;
  switch (row.phase) {
    case 'queued': return 'waiting to be checked';
    case 'hashing': return `checking file ${pct(row.hashedBytes / size)}`;
    case 'uploading': return `uploading ${pct(row.uploadedBytes / size)} of ${formatBytes(row.sizeBytes)}`;
    case 'paused': return row.pausedFrom === 'hashing'
      ? `paused while checking, ${pct(row.hashedBytes / size)}`
      : `paused at ${pct(row.uploadedBytes / size)} of ${formatBytes(row.sizeBytes)}`;
    case 'verifying': return 'verifying';
    case 'analysing': return `analysing ${pct(row.analysisProgress)}`;
    case 'ready': return 'ready';
    case 'analysis-failed': return `stored; analysis failed: ${row.error}`;
    case 'failed': return `failed: ${row.error}`;
    case 'unfinished': return row.uploadedBytes > 0
      ? `unfinished at ${pct(row.uploadedBytes / size)} of ${formatBytes(row.sizeBytes)}: pick the file again to resume`
      : 'unfinished: pick the file again to resume';
    case 'cancelled': return 'cancelled';
  }
}
