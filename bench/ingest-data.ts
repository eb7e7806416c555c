// Writes the benchmark's invented transport file: a long field sweep logged by a fictional Cobalt Ridge
// Magnetotransport Lab rig (time, temperature, field, current, four-wire resistance), with deterministic noise.
import { closeSync, openSync, writeSync } from 'node:fs';
import { seededNormal } from '../db/seeds/demo-data/random';

export const BENCH_COLUMNS = ['t (s)', 'T (K)', 'B (T)', 'I (uA)', 'R (Ohm)'] as const;

const SWEEP_MAX_T = 9;
const SWEEPS = 4; // four full loops 0 → 9 → −9 → 0 T, as a lab repeats a field loop
const R0_OHM = 125.0;
const MR_PER_T2 = 0.004; // R(B) = R0·(1 + β·B²), a metal's classical magnetoresistance

/** Triangle sweep of B over [−9, 9] T, `SWEEPS` full loops across the run. */
function fieldAt(fraction: number): number {
  const phase = (fraction * SWEEPS) % 1;
  const tri = phase < 0.25 ? phase * 4 : phase < 0.75 ? 2 - phase * 4 : phase * 4 - 4;
  return SWEEP_MAX_T * tri;
}

/** Writes `rows` data rows under a short comment block and the header; returns the file size in bytes. */
export function writeBenchFile(path: string, rows: number, seed = 20261202): number {
  const noise = seededNormal(seed);
  const fd = openSync(path, 'w');
  let bytes = 0;
  const put = (s: string) => {
    bytes += writeSync(fd, s);
  };
  try {
    put('# Cobalt Ridge Magnetotransport Lab - field loop at 2 K (invented benchmark data)\n');
    put('# Sample: CRM-BENCH-01; four-wire, 10 uA DC with reversal\n');
    put(`${BENCH_COLUMNS.join(',')}\n`);
    let chunk = '';
    for (let i = 0; i < rows; i++) {
      const b = fieldAt(i / rows);
      const t = i * 0.05;
      const temperature = 2 + 0.0015 * noise();
      const current = 10 + 0.0004 * noise();
      const r = R0_OHM * (1 + MR_PER_T2 * b * b) + 0.002 * noise();
      chunk += `${t.toFixed(2)},${temperature.toFixed(5)},${b.toFixed(6)},${current.toFixed(5)},${r.toFixed(6)}\n`;
      if (chunk.length > 1 << 20) {
        put(chunk);
        chunk = '';
      }
    }
    put(chunk);
  } finally {
    closeSync(fd);
  }
  return bytes;
}

export const BENCH_MODEL = { r0Ohm: R0_OHM, mrPerT2: MR_PER_T2, maxFieldT: SWEEP_MAX_T };
