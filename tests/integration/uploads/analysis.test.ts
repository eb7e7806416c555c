// The analysis worker's unit of work against MariaDB and s3rver: claim a queued file, stream it, store the summary.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { getAnalysis } from '@/lib/analysis/get-analysis';
import { requeueAnalysis } from '@/lib/analysis/requeue-analysis';
import { runAnalysisOnce } from '@/lib/analysis/run-analysis';
import type { TransportDatasetDraft } from '@/lib/schema';
import { bytesFromBuffer } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';
import { beginUpload } from '@/lib/uploads/begin-upload';
import { completeUpload } from '@/lib/uploads/complete-upload';
import { closeDb, createDraft, createTestLab, dropTestLabs, putParts, sha256Hex, type TestLab } from './helpers';

const FIXTURES = path.join(import.meta.dirname, '..', '..', 'fixtures', 'transport');
const fixture = (name: string) => readFileSync(path.join(FIXTURES, name));
const cuMeta = JSON.parse(fixture('cu-wire-rt.meta.json').toString('utf8')) as TransportDatasetDraft & Record<string, unknown>;

let lab: TestLab;

beforeAll(async () => {
  lab = await createTestLab();
});

afterAll(async () => {
  await dropTestLabs();
  await closeDb();
});

async function upload(versionId: string, name: string, bytes: Uint8Array): Promise<string> {
  const begin = await beginUpload({ user: lab.member, versionId, input: { name, sizeBytes: bytes.length, sha256: sha256Hex(bytes) } });
  await putParts(begin, begin.parts, bytes);
  await completeUpload({ user: lab.member, fileId: begin.fileId });
  return begin.fileId;
}

/** Runs the analysis for this one file; the stack's own worker may claim it first, so wait for the end state either way. */
async function analyse(fileId: string): Promise<string> {
  for (let i = 0; i < 100; i += 1) {
    await runAnalysisOnce({ fileIds: [fileId], progressIntervalMs: 0 });
    const { analysis_state: state } = await db()('files').where({ id: fileId }).first('analysis_state');
    if (state === 'done' || state === 'failed') return state;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`analysis of ${fileId} did not finish`);
}

describe('runAnalysisOnce', () => {
  let versionId: string;
  let fileId: string;

  it('summarises cu-wire-rt.csv from storage: done, with the columns and derived values the transport core finds', async () => {
    versionId = await createDraft(lab, cuMeta);
    const bytes = fixture('cu-wire-rt.csv');
    fileId = await upload(versionId, 'cu-wire-rt.csv', bytes);
    // The stack's worker may take the job at once; what matters is that the upload queued it.
    expect(['queued', 'running', 'done']).toContain((await db()('files').where({ id: fileId }).first('analysis_state')).analysis_state);
    expect(await analyse(fileId)).toBe('done');
    const view = await getAnalysis({ user: lab.member, fileId });
    expect(view).toMatchObject({ state: 'done', progress: 1, error: null });
    const summary = view.summary!;
    // Same check values as tests/unit/transport/summary/summarise-file.test.ts for this fixture and record.
    expect(summary.columns.map((c) => [c.name, c.quantity, c.role])).toEqual([['T', 'temperature', 'x'], ['R', 'resistance', 'y'], ['I', 'current', 'aux']]);
    expect(summary.geometry).toMatchObject({ lengthM: 0.02, areaFrom: 'diameter' });
    expect(summary.fileName).toBe('cu-wire-rt.csv');
    expect(summary.bytes).toBe(bytes.length);
    // The worker's stored result is exactly what the transport core computes from the same bytes and record.
    expect(summary).toEqual(JSON.parse(JSON.stringify(await summariseFile(bytesFromBuffer(bytes), { metadata: cuMeta, fileName: 'cu-wire-rt.csv' }))));
  });

  it('requeueAnalysis queues the version’s analysed files again and the next run uses the changed record', async () => {
    const { sample: _sample, ...withoutSample } = cuMeta;
    void _sample;
    await db()('dataset_versions').where({ id: versionId }).update({ metadata: JSON.stringify(withoutSample) });
    expect(await requeueAnalysis(versionId)).toBe(1);
    const queued = await getAnalysis({ user: lab.member, fileId });
    expect(['queued', 'running', 'done']).toContain(queued.state); // the stack's worker may be on it already
    expect(queued.error).toBeNull();
    expect(await analyse(fileId)).toBe('done');
    const { summary } = await getAnalysis({ user: lab.member, fileId });
    // Without the sample geometry there is no resistivity (as in the unit test "without metadata").
    expect(summary?.geometry).toBeNull();
    expect(summary?.notComputed.map((n) => n.key)).toEqual(['resistivity']);
  });

  it('a binary file with a text extension fails with the parser’s plain message', async () => {
    const binary = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]), randomBytes(4000)]);
    const id = await upload(versionId, 'scope-capture.dat', binary);
    expect(await analyse(id)).toBe('failed');
    const view = await getAnalysis({ user: lab.member, fileId: id });
    expect(view.state).toBe('failed');
    expect(view.summary).toBeNull();
    // The stored error is the parser's own plain message for these bytes, not a stack or an error code.
    const parserSays = await summariseFile(bytesFromBuffer(binary)).then(() => 'parsed?!', (e: Error) => e.message);
    expect(parserSays).toMatch(/^This is not a text table: .*binary file\?/);
    expect(view.error).toBe(parserSays);
  });

  it('a binary file without a text extension is not queued at all, and requeue leaves it alone', async () => {
    const id = await upload(versionId, 'photo-of-sample.png', Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 0]), randomBytes(2000)]));
    expect((await getAnalysis({ user: lab.member, fileId: id })).state).toBe('none');
    expect(await runAnalysisOnce({ fileIds: [id] })).toBeNull();
    await requeueAnalysis(versionId);
    expect((await getAnalysis({ user: lab.member, fileId: id })).state).toBe('none');
  });

  it('a text file without a known extension is recognised from its first KiB', async () => {
    const id = await upload(versionId, 'RUN0042', fixture('tidewater-film-rs.csv'));
    // Queued for analysis (the stack's worker may already have taken it): never 'none', as a binary file would be.
    expect(['queued', 'running', 'done']).toContain((await getAnalysis({ user: lab.member, fileId: id })).state);
    expect(await analyse(id)).toBe('done');
  });

  it('a UTF-16 export is text too (the NUL bytes of UTF-16 do not make it binary)', async () => {
    const id = await upload(versionId, 'lockin-export', fixture('utf16-lockin.tsv'));
    expect(['queued', 'running', 'done']).toContain((await getAnalysis({ user: lab.member, fileId: id })).state);
    expect(await analyse(id)).toBe('done');
  });

  it('writes progress while it reads a large file, and an abort puts the file back in the queue', async () => {
    // 600 000 rows of an invented linear R(T) ≈ 13 MB: two parts, and long enough to watch the progress move.
    const rows = ['T (K),R (Ohm)'];
    for (let i = 0; i < 600_000; i += 1) rows.push(`${(2 + i * 0.0005).toFixed(4)},${(0.01 + i * 1e-7).toFixed(7)}`);
    const id = await upload(versionId, 'long-sweep.csv', Buffer.from(rows.join('\n') + '\n'));
    const seen = new Set<number>();
    let watching = true;
    const watch = (async () => {
      while (watching) {
        const row = await db()('files').where({ id }).first('analysis_state', 'analysis_progress');
        if (row.analysis_state === 'running') seen.add(Number(row.analysis_progress));
        await new Promise((r) => setTimeout(r, 5));
      }
    })();
    // The stack's own worker may take the file first, and it records progress only once a second: read it here, again
    // after requeueing if need be, until this run (progress on every chunk) is the one that read it.
    let mine = await runAnalysisOnce({ fileIds: [id], progressIntervalMs: 0 });
    for (let attempt = 0; attempt < 20 && mine?.outcome !== 'done'; attempt += 1) {
      expect(await analyse(id)).toBe('done'); // the other run finishes
      await requeueAnalysis(versionId);
      mine = await runAnalysisOnce({ fileIds: [id], progressIntervalMs: 0 });
    }
    expect(mine).toEqual({ fileId: id, outcome: 'done' });
    watching = false;
    await watch;
    expect([...seen].some((p) => p > 0 && p < 1)).toBe(true);

    await requeueAnalysis(versionId);
    const stop = new AbortController();
    const run = runAnalysisOnce({ fileIds: [id], signal: stop.signal });
    setTimeout(() => stop.abort(), 50);
    const result = await run;
    // null only if another worker claimed it first; otherwise this run was stopped and released the file.
    if (result) expect(result).toEqual({ fileId: id, outcome: 'released' });
    const after = await getAnalysis({ user: lab.member, fileId: id });
    expect(after.state).not.toBe('failed');
    expect(after.error).toBeNull();
  });

  it('only a member may see a draft file’s analysis (others: 404)', async () => {
    const error = await getAnalysis({ user: lab.outsider, fileId }).catch((e: unknown) => e);
    expect((error as { status?: number }).status).toBe(404);
  });
});
