// Full-resolution curves from a parsed table, named as the file analysis names its previews (measured and derived).
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { columnOverrides, extractCurve } from '@/lib/compare/extract-curve';
import type { TransportDatasetDraft } from '@/lib/schema';
import { bytesFromBuffer, parseTransportTable } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';

const DIR = path.resolve(import.meta.dirname, '../../fixtures/transport');
const FIXTURES = [
  ['cu-wire-rt.csv', 'cu-wire-rt.meta.json'],
  ['cobalt-ridge-hallbar.dat', 'cobalt-ridge-hallbar.meta.json'],
  ['tidewater-film-rs.csv', 'tidewater-film-rs.meta.json'],
] as const;

async function load(file: string, meta: string) {
  const bytes = readFileSync(path.join(DIR, file));
  const metadata = JSON.parse(readFileSync(path.join(DIR, meta), 'utf8')) as TransportDatasetDraft;
  const table = await parseTransportTable(bytesFromBuffer(bytes), { columns: columnOverrides(metadata) });
  const summary = await summariseFile(bytesFromBuffer(bytes), { metadata, previewPoints: 10_000 });
  return { table, metadata, summary };
}

describe('extractCurve gives every preview of the analysis at full resolution', () => {
  for (const [file, meta] of FIXTURES) {
    it(`${file}: each (x, y) preview, point for point`, async () => {
      const { table, metadata, summary } = await load(file, meta);
      expect(summary.previews.length).toBeGreaterThanOrEqual(2);
      for (const p of summary.previews) {
        const curve = extractCurve(table, metadata, p.x, p.y);
        expect(curve, `${p.y} against ${p.x}`).not.toBeNull();
        // previewPoints above the row count: the preview is the whole curve, so the two must agree exactly.
        expect(curve!.x.length).toBe(p.sourcePoints);
        expect(Array.from(curve!.x)).toEqual(p.points.map((q) => q[0]));
        expect(Array.from(curve!.y)).toEqual(p.points.map((q) => q[1]));
        expect([curve!.xUcum, curve!.yUcum]).toEqual([p.xUcum, p.yUcum]);
      }
    });
  }

  it('derives ρ = R·A/L for the copper wire: 43.959 mΩ × π(0.1 mm)²/4 / 20 mm = 1.7263e-8 Ω·m at 300 K', async () => {
    const { table, metadata } = await load('cu-wire-rt.csv', 'cu-wire-rt.meta.json');
    const rho = extractCurve(table, metadata, 'T', 'resistivity')!;
    expect(rho.x[0]).toBe(300);
    // Geometry from cu-wire-rt.meta.json: A = π·(1e-4 m)²/4 = 7.853982e-9 m², L = 0.02 m (definition of resistivity).
    expect(rho.y[0]).toBeCloseTo((0.04395924267 * (Math.PI * 1e-8) / 4) / 0.02, 20);
    expect(rho.yUcum).toBe('Ohm.m');
  });

  it('gives MR over |B| for the Hall bar (Oe converted to T by the lab convention)', async () => {
    const { table, metadata } = await load('cobalt-ridge-hallbar.dat', 'cobalt-ridge-hallbar.meta.json');
    const mr = extractCurve(table, metadata, '|Field|', 'magnetoresistance')!;
    expect(mr.x[0]).toBe(0);
    expect(mr.x[mr.x.length - 1]).toBe(9); // 90000 Oe ↔ 9 T
    expect(mr.yUcum).toBe('%');
  });

  it('returns null for a curve the file does not have', async () => {
    const { table, metadata } = await load('cu-wire-rt.csv', 'cu-wire-rt.meta.json');
    expect(extractCurve(table, metadata, 'T', 'Rxy')).toBeNull();
    expect(extractCurve(table, metadata, 'I', 'R')).toBeNull();
    expect(extractCurve(table, metadata, 'T', 'magnetoresistance')).toBeNull();
  });
});
