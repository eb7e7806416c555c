// Set-up for the compare tests: invented labs (tests/integration/uploads/helpers), files uploaded through lib/uploads
// to s3rver and analysed by the real worker step, then marked published straight in the database (publishing itself
// is tested in tests/integration/publishing).
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { runAnalysisOnce } from '@/lib/analysis/run-analysis';
import { db } from '@/lib/db';
import { beginUpload } from '@/lib/uploads/begin-upload';
import { completeUpload } from '@/lib/uploads/complete-upload';
import { createDraft, putParts, sha256Hex, type TestLab } from '../uploads/helpers';

const FIXTURES = path.resolve(import.meta.dirname, '../../fixtures/transport');
export const fixtureBytes = (name: string) => readFileSync(path.join(FIXTURES, name));
export const fixtureMeta = (name: string) => JSON.parse(readFileSync(path.join(FIXTURES, name), 'utf8')) as Record<string, unknown>;

export async function uploadFile(lab: TestLab, versionId: string, name: string, bytes: Uint8Array): Promise<string> {
  const begin = await beginUpload({ user: lab.member, versionId, input: { name, sizeBytes: bytes.length, sha256: sha256Hex(bytes) } });
  await putParts(begin, begin.parts, bytes);
  await completeUpload({ user: lab.member, fileId: begin.fileId });
  return begin.fileId;
}

/** Runs the analysis of this file; the stack's own worker may claim it first, so wait for the end state either way. */
export async function analyse(fileId: string): Promise<void> {
  for (let i = 0; i < 150; i += 1) {
    await runAnalysisOnce({ fileIds: [fileId], progressIntervalMs: 0 });
    const { analysis_state: state } = await db()('files').where({ id: fileId }).first('analysis_state');
    if (state === 'done') return;
    if (state === 'failed') throw new Error(`analysis of ${fileId} failed`);
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`analysis of ${fileId} did not finish`);
}

export type Deposit = { versionId: string; fileId: string; doi: string };

/** A draft with one analysed file, then published (with a test DOI) unless `state` says otherwise. */
export async function deposit(lab: TestLab, file: string, meta: Record<string, unknown>, opts: { state?: 'draft' | 'published'; embargoUntil?: string; bytes?: Uint8Array } = {}): Promise<Deposit> {
  const versionId = await createDraft(lab, meta);
  const fileId = await uploadFile(lab, versionId, file, opts.bytes ?? fixtureBytes(file));
  await analyse(fileId);
  const doi = `10.80123/ohm.t${randomBytes(4).toString('hex')}`;
  if ((opts.state ?? 'published') === 'published') {
    await db()('dataset_versions').where({ id: versionId }).update({
      state: 'published', doi, doi_state: 'findable', published_at: new Date(), embargo_until: opts.embargoUntil ?? null,
    });
  }
  return { versionId, fileId, doi };
}

/** Back to draft, so dropTestLabs can remove the files through removeFile (blobs and objects go too). */
export async function reopenForCleanup(lab: TestLab): Promise<void> {
  if (lab.versionIds.length) await db()('dataset_versions').whereIn('id', lab.versionIds).update({ state: 'draft', embargo_until: null });
}

/** A temperature sweep of `rows` points: T from 2 K to 300 K, R = 0.5 mΩ + 0.14 µΩ/K·T (invented). */
export function longSweepCsv(rows: number): Uint8Array {
  const lines = ['# Invented long sweep for the compare tests', 'T (K),R (Ohm)'];
  for (let i = 0; i < rows; i++) {
    const t = 2 + (298 * i) / (rows - 1);
    lines.push(`${t.toFixed(6)},${(5e-4 + 1.4e-7 * t).toExponential(9)}`);
  }
  return new TextEncoder().encode(lines.join('\n') + '\n');
}
