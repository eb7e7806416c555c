import { describe, expect, it } from 'vitest';
import type { FileView } from '@/lib/client/uploads/types';
import { describePhase, newRow, phasePercent, reduceUpload, rowFromServer, type UploadEvent, type UploadRow } from '@/lib/client/uploads/upload-state';

const GB = 1_200_000_000; // 1.2 GB = 1.12 GiB (IEC 80000-13 prefixes, as lib/format/bytes shows sizes)
const play = (row: UploadRow, ...events: UploadEvent[]) => events.reduce(reduceUpload, row);
const view = (over: Partial<FileView> = {}): FileView => ({
  id: 'f1', name: 'rho-T.csv', role: 'raw', sizeBytes: GB, sha256: 'a'.repeat(64), uploadState: 'verified',
  analysisState: 'queued', analysisProgress: 0, analysisError: null, createdAt: '2026-12-02T10:00:00.000Z', ...over,
});

describe('upload row state machine', () => {
  it('walks check → upload → verify → analyse → ready, saying each phase in words', () => {
    const said: string[] = [];
    let row = newRow('local-1', 'rho-T.csv', GB);
    const step = (e: UploadEvent) => { row = reduceUpload(row, e); said.push(`${describePhase(row)} [${phasePercent(row)}]`); };
    step({ type: 'hashing', hashedBytes: 0 });
    step({ type: 'hash-progress', hashedBytes: GB * 0.12 });
    step({ type: 'upload-started', fileId: 'f1', uploadedBytes: 0 });
    step({ type: 'part-uploaded', sizeBytes: GB * 0.375 });
    step({ type: 'verifying' });
    step({ type: 'verified', file: view() });
    step({ type: 'analysis', state: 'running', progress: 0.4, error: null });
    step({ type: 'analysis', state: 'done', progress: 1, error: null });
    expect(said).toEqual([
      'checking file 0\u00a0% [0]',
      'checking file 12\u00a0% [12]',
      'uploading 0\u00a0% of 1.12 GiB [0]',
      'uploading 37\u00a0% of 1.12 GiB [37]',
      'verifying [null]',
      'analysing 0\u00a0% [0]',
      'analysing 40\u00a0% [40]',
      'ready [100]',
    ]);
    expect(row.fileId).toBe('f1');
  });

  it('pauses and resumes into the phase it left, and counts a part that lands after the pause', () => {
    const uploading = play(newRow('k', 'hall.dat', 1000), { type: 'upload-started', fileId: 'f2', uploadedBytes: 200 });
    const paused = play(uploading, { type: 'paused' }, { type: 'part-uploaded', sizeBytes: 100 });
    expect(describePhase(paused)).toBe('paused at 30\u00a0% of 1000 B');
    expect(play(paused, { type: 'resumed' }).phase).toBe('uploading');
    const hashingPaused = play(newRow('k', 'hall.dat', 1000), { type: 'hashing', hashedBytes: 0 }, { type: 'hash-progress', hashedBytes: 500 }, { type: 'paused' });
    expect(describePhase(hashingPaused)).toBe('paused while checking, 50\u00a0%');
    expect(play(hashingPaused, { type: 'resumed' }).phase).toBe('hashing');
  });

  it('ignores events that do not fit the phase', () => {
    const ready = rowFromServer(view({ analysisState: 'done', analysisProgress: 1 }));
    expect(ready.phase).toBe('ready');
    for (const e of [{ type: 'paused' }, { type: 'cancelled' }, { type: 'failed', error: 'x' }, { type: 'part-uploaded', sizeBytes: 5 }, { type: 'hashing', hashedBytes: 0 }] as UploadEvent[]) {
      expect(reduceUpload(ready, e)).toBe(ready);
    }
    const verifying = play(newRow('k', 'a.csv', 10), { type: 'upload-started', fileId: 'f', uploadedBytes: 0 }, { type: 'verifying' });
    expect(reduceUpload(verifying, { type: 'paused' })).toBe(verifying);
    expect(reduceUpload(verifying, { type: 'cancelled' })).toBe(verifying);
    expect(play(verifying, { type: 'failed', error: 'File storage is not answering right now.' }).phase).toBe('failed');
  });

  it('turns server rows into ready, analysing, analysis-failed, unfinished and failed rows', () => {
    expect(describePhase(rowFromServer(view({ analysisState: 'running', analysisProgress: 0.25 })))).toBe('analysing 25\u00a0%');
    expect(describePhase(rowFromServer(view({ analysisState: 'none' })))).toBe('ready');
    expect(describePhase(rowFromServer(view({ analysisState: 'failed', analysisError: 'line 12: 7 fields, expected 4' }))))
      .toBe('stored; analysis failed: line 12: 7 fields, expected 4');
    const unfinished = rowFromServer(view({ uploadState: 'pending', sizeBytes: 2048 }));
    expect(describePhase(unfinished)).toBe('unfinished: pick the file again to resume');
    expect(describePhase(reduceUpload(unfinished, { type: 'known-progress', uploadedBytes: 1024 })))
      .toBe('unfinished at 50\u00a0% of 2.00 KiB: pick the file again to resume');
    expect(rowFromServer(view({ uploadState: 'failed' })).phase).toBe('failed');
    expect(play(unfinished, { type: 'resumed' }).phase).toBe('queued');
  });
});
