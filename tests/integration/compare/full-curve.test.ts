// readFullCurve against MariaDB and s3rver: the stored file streamed through the parser, at full resolution, in SI,
// only for callers lib/access lets see the curves ('view_curves').
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AccessDeniedError } from '@/lib/access';
import { getAnalysis } from '@/lib/analysis/get-analysis';
import { MAX_FULL_CURVE_POINTS, readFullCurve } from '@/lib/compare/read-full-curve';
import { db } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { closeDb, createTestLab, dropTestLabs, type TestLab } from '../uploads/helpers';
import { deposit, fixtureMeta, longSweepCsv, reopenForCleanup, type Deposit } from './fixtures';

let lab: TestLab;
let otherLab: TestLab;
let copper: Deposit;
let long: Deposit;
let otherDraft: Deposit;
let embargoed: Deposit;
const ROWS = 5000;

beforeAll(async () => {
  lab = await createTestLab();
  otherLab = await createTestLab();
  copper = await deposit(lab, 'cu-wire-rt.csv', fixtureMeta('cu-wire-rt.meta.json'));
  long = await deposit(lab, 'long-sweep.csv', { title: 'Long invented sweep for compare tests' }, { bytes: longSweepCsv(ROWS) });
  otherDraft = await deposit(otherLab, 'cu-wire-rt.csv', fixtureMeta('cu-wire-rt.meta.json'), { state: 'draft' });
  embargoed = await deposit(otherLab, 'tidewater-film-rs.csv', fixtureMeta('tidewater-film-rs.meta.json'), { embargoUntil: '2099-01-01' });
}, 120_000);

afterAll(async () => {
  await reopenForCleanup(lab);
  await reopenForCleanup(otherLab);
  await dropTestLabs();
  await closeDb();
});

async function refusal(promise: Promise<unknown>): Promise<{ status: number; code: string; message: string }> {
  try {
    await promise;
  } catch (e) {
    if (e instanceof AppError || e instanceof AccessDeniedError) return { status: e.status, code: e.code, message: e.message };
    throw e;
  }
  throw new Error('expected a refusal');
}

describe('readFullCurve', () => {
  it('gives an anonymous reader the measured R(T) of a published file in SI (mΩ in the file → Ω)', async () => {
    const c = await readFullCurve({ user: null, fileId: copper.fileId, x: 'T', y: 'R' });
    expect(c).toMatchObject({ fileId: copper.fileId, xUcum: 'K', yUcum: 'Ohm', points: 161 });
    // First data row of tests/fixtures/transport/cu-wire-rt.csv: 300,43.95924267 (mOhm).
    expect([c.xs[0], c.ys[0]]).toEqual([300, 0.04395924267]);
    expect(c.xs[160]).toBe(2);
  });

  it('gives the derived ρ = R·A/L with the geometry of the version record', async () => {
    const c = await readFullCurve({ user: null, fileId: copper.fileId, x: 'T', y: 'resistivity' });
    expect(c.yUcum).toBe('Ohm.m');
    // cu-wire-rt.meta.json: L = 20 mm, d = 0.1 mm → A = π(1e-4 m)²/4 (definition of resistivity).
    expect(c.ys[0]).toBeCloseTo((0.04395924267 * Math.PI * 1e-8) / 4 / 0.02, 20);
  });

  it(`returns all ${ROWS} points where the stored preview keeps 500 (LTTB), and the preview points are among them`, async () => {
    const analysis = await getAnalysis({ user: null, fileId: long.fileId });
    const preview = analysis.summary!.previews.find((p) => p.x === 'T' && p.y === 'R')!;
    expect([preview.points.length, preview.sourcePoints]).toEqual([500, ROWS]);
    const c = await readFullCurve({ user: null, fileId: long.fileId, x: 'T', y: 'R' });
    expect(c.points).toBe(ROWS);
    expect(c.xs[0]).toBe(2);
    expect(c.xs[ROWS - 1]).toBe(300);
    expect(c.ys[ROWS - 1]).toBeCloseTo(5e-4 + 1.4e-7 * 300, 15);
    const full = new Set(Array.from(c.xs));
    expect(preview.points.every(([x]) => full.has(x))).toBe(true);
  });

  it('refuses a draft of another group as not found (404), and the group itself may read it', async () => {
    expect(await refusal(readFullCurve({ user: lab.member, fileId: otherDraft.fileId, x: 'T', y: 'R' }))).toEqual({
      status: 404, code: 'not_found', message: 'We could not find this file, or you do not have access to it.',
    });
    expect((await refusal(readFullCurve({ user: null, fileId: otherDraft.fileId, x: 'T', y: 'R' }))).status).toBe(404);
    expect((await readFullCurve({ user: otherLab.member, fileId: otherDraft.fileId, x: 'T', y: 'R' })).points).toBe(161);
  });

  it('refuses the curves of an embargoed version to outsiders (403) and names the date', async () => {
    const r = await refusal(readFullCurve({ user: lab.member, fileId: embargoed.fileId, x: 'T', y: 'Rs' }));
    expect(r).toEqual({ status: 403, code: 'embargoed', message: 'The curves and files of this version are under embargo until 2099-01-01 at 00:00 UTC.' });
  });

  it('answers 404 for a curve the analysis does not have, and for an unknown file', async () => {
    expect(await refusal(readFullCurve({ user: null, fileId: copper.fileId, x: 'T', y: 'Rxy' }))).toMatchObject({
      status: 404, message: "This file's analysis has no curve Rxy against T.",
    });
    expect((await refusal(readFullCurve({ user: null, fileId: '00000000-0000-4000-8000-000000000000', x: 'T', y: 'R' }))).status).toBe(404);
  });

  it('refuses (413) a curve above the limit before reading the file, with the counts in the details', async () => {
    const row = await db()('files').where({ id: long.fileId }).first('analysis');
    const summary = typeof row.analysis === 'string' ? JSON.parse(row.analysis) : row.analysis;
    summary.previews.find((p: { x: string; y: string }) => p.x === 'T' && p.y === 'R').sourcePoints = MAX_FULL_CURVE_POINTS + 1;
    await db()('files').where({ id: long.fileId }).update({ analysis: JSON.stringify(summary) });
    const r = await refusal(readFullCurve({ user: null, fileId: long.fileId, x: 'T', y: 'R' }));
    expect(r).toEqual({
      status: 413, code: 'payload_too_large',
      message: 'This curve has 2,000,001 points; full-resolution curves are served up to 2,000,000 points. Download the file from the dataset page instead.',
    });
  });
});
