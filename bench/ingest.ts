// npm run bench:ingest [-- --rows N --runs N --keep]: writes a 5-column transport file (1,000,000 rows by default) in a
// temp dir, then times a streamed SHA-256 of it and summariseFile on it, each in a fresh child process that reports its
// own peak RSS (process.resourceUsage().maxRSS). Targets (issue 3): summarise/hash time ratio ≤ 3, RSS growth ≤ 150 MB.
// "cold" is the first file a process reads (JIT compilation included); "warm" follows one 20 000-row file, as in a
// long-running deposit worker. Both are reported; the targets are checked on both. summariseFile reads the rows of a
// large file on a worker thread too when the machine has an idle core; the 'rows read on worker threads' line says how
// the rows were shared.
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { createReadStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ParallelStats } from '../lib/transport/parse/parallel-rows';
import { summariseFile } from '../lib/transport/summarise-file'; // loaded before any baseline: its code is not growth
import { BENCH_MODEL, writeBenchFile } from './ingest-data';

const TARGET_RATIO = 3;
const TARGET_RSS_MB = 150;
const MB = 1024 * 1024;
const WARM_UP_ROWS = 20_000;

type Phase = 'hash' | 'summarise';
type PhaseResult = { phase: Phase; ms: number; cpuMs: number; baseRss: number; maxRss: number; check: Record<string, unknown> };

function option(name: string, fallback: number): number {
  const i = process.argv.indexOf(name);
  const v = i >= 0 ? Number(process.argv[i + 1]) : fallback;
  if (!Number.isInteger(v) || v <= 0) throw new Error(`${name} needs a positive integer`);
  return v;
}

async function phaseOnce(phase: Phase, file: string): Promise<Record<string, unknown>> {
  if (phase === 'hash') {
    const hash = createHash('sha256');
    for await (const chunk of createReadStream(file)) hash.update(chunk as Buffer);
    return { sha256: hash.digest('hex') };
  }
  // report only records how the rows were shared between threads (workers start when a core was idle).
  let workers: ParallelStats | null = null;
  const s = await summariseFile(createReadStream(file), { fileName: path.basename(file), sizeBytes: statSync(file).size, parallel: { report: (r) => (workers = r) } });
  const mr = s.derived.find((d) => d.key === 'magnetoresistance.at-max-field');
  return { rowCount: s.rowCount, columns: s.columns.map((c) => `${c.name}:${c.quantity}:${c.siUcum}`), mrPercent: mr?.value, warnings: s.warnings.length, workers };
}

/** Child: (optionally warm up on a small file, then) run one phase and print its time and memory as one JSON line. */
async function runPhase(phase: Phase, file: string, warmUpFile?: string): Promise<void> {
  if (warmUpFile) await phaseOnce(phase, warmUpFile);
  (globalThis as { gc?: () => void }).gc?.();
  const baseRss = process.memoryUsage.rss();
  let sampled = baseRss;
  const timer = setInterval(() => (sampled = Math.max(sampled, process.memoryUsage.rss())), 10);
  const cpu0 = process.cpuUsage();
  const start = process.hrtime.bigint();
  const check = await phaseOnce(phase, file);
  const ms = Number(process.hrtime.bigint() - start) / 1e6;
  const cpu = process.cpuUsage(cpu0);
  clearInterval(timer);
  // maxRSS is the high-water mark since the process started (KiB): an upper bound on the phase's own peak.
  const maxRss = Math.max(process.resourceUsage().maxRSS * 1024, sampled, process.memoryUsage.rss());
  const result: PhaseResult = { phase, ms, cpuMs: (cpu.user + cpu.system) / 1000, baseRss, maxRss, check };
  process.stdout.write(`${JSON.stringify(result)}\n`);
}

function child(phase: Phase, file: string, warmUpFile?: string): PhaseResult {
  const args = ['--expose-gc', ...process.execArgv, fileURLToPath(import.meta.url), '--phase', phase, file, ...(warmUpFile ? [warmUpFile] : [])];
  const out = execFileSync(process.execPath, args, { encoding: 'utf8', maxBuffer: 16 * MB });
  return JSON.parse(out.trim().split('\n').pop() as string) as PhaseResult;
}

// No report: the rows were read on the main thread alone (no idle core when reading began, or no worker threads).
const threadShare = (w: ParallelStats | null) => (w ? `${w.workerSegments}/${w.mainSegments}` : 'main thread only');
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const mb = (bytes: number) => (bytes / MB).toFixed(1);
const growth = (rs: PhaseResult[]) => Math.max(...rs.map((r) => r.maxRss - r.baseRss));

function report(label: string, hash: PhaseResult[], summarise: PhaseResult[]): boolean {
  const line = (name: string, rs: PhaseResult[]) =>
    `  ${name.padEnd(13)} median ${median(rs.map((r) => r.ms)).toFixed(0).padStart(5)} ms (runs ${rs.map((r) => r.ms.toFixed(0)).join(', ')}; ` +
    `CPU ${median(rs.map((r) => r.cpuMs)).toFixed(0)} ms)  RSS growth ≤ ${mb(growth(rs))} MiB`;
  const ratio = median(summarise.map((r) => r.ms)) / median(hash.map((r) => r.ms));
  const cpuRatio = median(summarise.map((r) => r.cpuMs)) / median(hash.map((r) => r.cpuMs));
  const ok = ratio <= TARGET_RATIO && growth(summarise) <= TARGET_RSS_MB * MB;
  console.log(`${label}:`);
  console.log(line('sha-256', hash));
  console.log(line('summariseFile', summarise));
  console.log(`  ratio ${ratio.toFixed(2)} (target ≤ ${TARGET_RATIO}; CPU-time ratio ${cpuRatio.toFixed(2)}), RSS growth ${mb(growth(summarise))} MiB (target ≤ ${TARGET_RSS_MB} MB): ${ok ? 'OK' : 'MISSED'}`);
  return ok;
}

async function main(): Promise<void> {
  const phaseAt = process.argv.indexOf('--phase');
  if (phaseAt >= 0) return runPhase(process.argv[phaseAt + 1] as Phase, process.argv[phaseAt + 2], process.argv[phaseAt + 3]);
  const rows = option('--rows', 1_000_000);
  const runs = option('--runs', 3);
  const dir = mkdtempSync(path.join(tmpdir(), 'ohmstead-bench-'));
  const file = path.join(dir, 'bench-field-loop.csv');
  const warmUp = path.join(dir, 'warm-up.csv');
  try {
    const t = performance.now();
    const bytes = writeBenchFile(file, rows);
    writeBenchFile(warmUp, WARM_UP_ROWS, 7);
    console.log(`file: ${file}\n  ${rows.toLocaleString('en')} rows × 5 columns, ${mb(bytes)} MiB, written in ${((performance.now() - t) / 1000).toFixed(1)} s`);
    const results = { cold: { hash: [] as PhaseResult[], summarise: [] as PhaseResult[] }, warm: { hash: [] as PhaseResult[], summarise: [] as PhaseResult[] } };
    for (let i = 0; i < runs; i++) {
      // Alternate the phases so a busy neighbour on the machine slows both alike.
      for (const mode of ['cold', 'warm'] as const) {
        for (const phase of ['hash', 'summarise'] as const) results[mode][phase].push(child(phase, file, mode === 'warm' ? warmUp : undefined));
      }
    }
    const ok = [report('cold (first file in a fresh process)', results.cold.hash, results.cold.summarise), report(`warm (after one ${WARM_UP_ROWS.toLocaleString('en')}-row file)`, results.warm.hash, results.warm.summarise)];
    // The thread shares get a line of their own.
    const check = Object.fromEntries(Object.entries(results.cold.summarise[0].check).filter(([key]) => key !== 'workers'));
    console.log(`check: sha-256 ${String(results.cold.hash[0].check.sha256).slice(0, 16)}…; summary ${JSON.stringify(check)}`);
    const shares = (['cold', 'warm'] as const).map((mode) => `${mode} ${results[mode].summarise.map((r) => threadShare(r.check.workers as ParallelStats | null)).join(', ')}`);
    console.log(`  rows read on worker threads (segments worker/main thread): ${shares.join('; ')}`);
    console.log(`  expected MR at 9 T: ${(BENCH_MODEL.mrPerT2 * BENCH_MODEL.maxFieldT ** 2 * 100).toFixed(2)} % (R = R0·(1 + β·B²), bin-averaged at the top)`);
    console.log(`machine: load average ${loadavg()[0].toFixed(2)} on ${availableParallelism()} cores (other processes slow the CPU-bound phase more than the I/O-bound hash)`);
    if (!ok.every(Boolean)) process.exitCode = 1;
  } finally {
    if (!process.argv.includes('--keep')) rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((e: unknown) => {
  console.error(`bench:ingest: ${e instanceof Error ? e.stack : String(e)}`);
  process.exitCode = 1;
});
