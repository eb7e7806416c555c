// npm run bench:package [-- --modes store,http,http-tee,deflate1,deflate6 --runs N]: a 1 GiB version of 8 text files in
// s3rver (dev services, .data/env.sh); raw, store and http run N times (default 3). Each phase runs in a fresh child
// process that reports its own time and peak RSS: raw S3 GET of the same bytes, the package builder per compression
// mode, and over HTTP: a node:http server in the child sends lib/downloads' streamed package reply (the route's code
// path minus Next) to curl; http-tee also stores the package in the cache as the first download of a published
// version does. Targets (issue 6), judged on http: package/raw throughput ≥ 0.7, time to first byte ≤ 300 ms, peak
// RSS growth ≤ 64 MB.
import { execFileSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { once } from 'node:events';
import { existsSync, readFileSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { PackageFile, PackageInput } from '../lib/packages/types';

const TARGET_RATIO = 0.7;
const TARGET_TTFB_MS = 300;
const TARGET_RSS_MB = 64;
const MB = 1e6;
const MiB = 1024 * 1024;
const MODES = { store: { compression: 'store' }, deflate1: { compression: 'deflate', deflateLevel: 1 }, deflate6: { compression: 'deflate', deflateLevel: 6 } } as const;
const HTTP_PHASES = ['http', 'http-tee'] as const;
type HttpPhase = (typeof HTTP_PHASES)[number];
type Mode = keyof typeof MODES | HttpPhase;
type Phase = 'raw' | Mode;
type PhaseResult = {
  phase: Phase; ms: number; cpuMs: number; ttfbMs?: number; payloadBytes: number; outBytes: number; baseRss: number; maxRss: number; sampledPeak: number;
  /** http-tee: from the last byte at the client until the cached copy was stored, and whether it was. */
  cacheMs?: number; cached?: boolean;
};
const isHttp = (p: Phase): p is HttpPhase => (HTTP_PHASES as readonly string[]).includes(p);

/** The dev services' settings, unless the caller exported them already. */
function loadDevEnv(): void {
  if (process.env.S3_ENDPOINT) return;
  const file = path.resolve(import.meta.dirname, '../.data/env.sh');
  if (!existsSync(file)) throw new Error('No S3_ENDPOINT and no .data/env.sh: start the dev services with `npm run services` first.');
  for (const line of readFileSync(file, 'utf8').split('\n')) {
    const m = /^(?:export\s+)?([A-Z0-9_]+)=(?:'([^']*)'|"([^"]*)"|(\S*))\s*$/.exec(line);
    if (m) process.env[m[1]!] ??= m[2] ?? m[3] ?? m[4] ?? '';
  }
}

function benchInput(files: PackageFile[]): PackageInput {
  return {
    metadata: {
      doi: '10.99999/ohm.bench-v1', conceptDoi: '10.99999/ohm.bench', versionNumber: 1,
      record: { title: 'Package bench: R(T) sweeps of invented samples', creators: [{ name: 'Bench Operator' }], sample: { name: 'BENCH-01' }, measurement: { quantity: 'resistance' } },
      publisher: { name: 'Ohmstead' }, group: { name: 'Larkspur Cryogenic Lab' }, publicationYear: 2026, publishedAt: '2026-12-02T00:00:00Z',
      landingUrl: 'https://ohmstead.example/versions/bench',
    },
    files,
  };
}

/** As Next's pipeToNodeResponse does: write each chunk, wait for 'drain' when the socket is full, cancel on close. */
async function pump(body: ReadableStream<Uint8Array>, res: http.ServerResponse): Promise<void> {
  const reader = body.getReader();
  res.on('close', () => void (res.writableFinished || reader.cancel().catch(() => undefined)));
  try {
    for (let r = await reader.read(); !r.done; r = await reader.read()) if (!res.write(r.value)) await once(res, 'drain');
    res.end();
  } catch (error) {
    res.destroy(error instanceof Error ? error : new Error(String(error)));
  }
}

/** One package download over loopback HTTP: time to the first body byte, bytes received, and the cache upload. */
async function httpDownload(phase: HttpPhase, files: PackageFile[]): Promise<{ ttfbMs: number; outBytes: number; endedAt: number; cacheMs?: number; cached?: boolean }> {
  const { defaultStore, deleteObjects } = await import('../lib/storage/objects');
  const { streamPackageReply } = await import('../lib/downloads/download-package');
  const store = defaultStore();
  const cacheKey = phase === 'http-tee' ? `bench/package/cache/${randomBytes(6).toString('hex')}.zip` : null;
  let cached: Promise<{ stored: boolean }> | undefined;
  const server = http.createServer((_req, res) => {
    const reply = streamPackageReply({ input: benchInput(files), store, cacheKey, onFailure: (e) => console.error(`bench: package failed: ${e.message}`) });
    cached = reply.cached;
    res.writeHead(reply.status, reply.headers);
    void pump(reply.body as ReadableStream<Uint8Array>, res);
  });
  server.listen(0, '127.0.0.1');
  await once(server, 'listening');
  const { port } = server.address() as AddressInfo;
  // The client is curl in its own process, as a browser would be on its own machine: the server's process (whose
  // RSS is measured) does only the server's work. curl reports the first byte's time and the bytes it received.
  const curl = spawn('curl', ['-sS', '-o', '/dev/null', '-w', '%{time_starttransfer} %{size_download} %{http_code}', `http://127.0.0.1:${port}/`]);
  let report = '';
  curl.stdout.on('data', (d: Buffer) => void (report += d.toString()));
  const [code] = (await once(curl, 'close')) as [number];
  const [startS, size, status] = report.trim().split(' ');
  if (code !== 0 || status !== '200') throw new Error(`curl exited ${code} with HTTP ${status ?? '?'} (bench:package needs curl for its HTTP client)`);
  const ttfbMs = Number(startS) * 1000;
  const outBytes = Number(size);
  const ended = performance.now();
  const stored = cached ? (await cached).stored : undefined;
  const cacheMs = cached ? performance.now() - ended : undefined;
  server.close();
  if (cacheKey) await deleteObjects(store, [cacheKey]);
  return { ttfbMs, outBytes, endedAt: ended, cacheMs, cached: stored };
}

/** Child: one phase, timed, with its RSS sampled every 10 ms; prints one JSON line. */
async function runPhase(phase: Phase, filesJson: string): Promise<void> {
  const files = JSON.parse(filesJson) as PackageFile[];
  const { defaultStore, objectExists } = await import('../lib/storage/objects');
  const { openObjectStream } = await import('../lib/storage/stream-object');
  const { buildPackageStream } = await import('../lib/packages/build-package-stream');
  const store = defaultStore();
  await objectExists(store, files[0]!.storageKey); // warm the client and its socket pool before the baseline
  if (isHttp(phase)) await import('../lib/downloads/download-package'); // its modules load before the baseline too
  (globalThis as { gc?: () => void }).gc?.();
  const baseRss = process.memoryUsage().rss;
  let sampledPeak = baseRss;
  const timer = setInterval(() => (sampledPeak = Math.max(sampledPeak, process.memoryUsage.rss())), 10);
  const cpuStart = process.cpuUsage();
  const start = performance.now();
  let outBytes = 0;
  let ttfbMs: number | undefined;
  let cache: { cacheMs?: number; cached?: boolean } = {};
  let endedAt: number | undefined;
  if (phase === 'raw') {
    for (const f of files) for await (const chunk of (await openObjectStream(store, f.storageKey)).body) outBytes += (chunk as Buffer).length;
  } else if (isHttp(phase)) {
    const got = await httpDownload(phase, files);
    ({ ttfbMs, outBytes, endedAt } = got);
    cache = { cacheMs: got.cacheMs, cached: got.cached };
  } else {
    const reader = buildPackageStream(benchInput(files), MODES[phase]).stream.getReader();
    for (let r = await reader.read(); !r.done; r = await reader.read()) {
      ttfbMs ??= performance.now() - start;
      outBytes += r.value.length;
    }
  }
  // http-tee: the client's time; storing the cached copy after the last byte is reported apart (cacheMs).
  const ms = (endedAt ?? performance.now()) - start;
  const cpu = process.cpuUsage(cpuStart);
  const cpuMs = (cpu.user + cpu.system) / 1000;
  clearInterval(timer);
  sampledPeak = Math.max(sampledPeak, process.memoryUsage.rss());
  const maxRss = Math.max(process.resourceUsage().maxRSS * 1024, sampledPeak);
  const payloadBytes = files.reduce((s, f) => s + f.sizeBytes, 0);
  process.stdout.write(`${JSON.stringify({ phase, ms, cpuMs, ttfbMs, payloadBytes, outBytes, baseRss, maxRss, sampledPeak, ...cache } satisfies PhaseResult)}\n`);
}

function child(phase: Phase, files: PackageFile[]): PhaseResult {
  const self = fileURLToPath(import.meta.url);
  const out = execFileSync(process.execPath, ['--expose-gc', ...process.execArgv, self, '--phase', phase, JSON.stringify(files)], {
    encoding: 'utf8', maxBuffer: 16 * MiB, stdio: ['ignore', 'pipe', 'inherit'],
  });
  return JSON.parse(out.trim().split('\n').pop()!) as PhaseResult;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const rate = (r: PhaseResult) => r.payloadBytes / MB / (r.ms / 1000);
const growthMb = (r: PhaseResult) => (r.maxRss - r.baseRss) / MB;
const verdict = (ok: boolean) => (ok ? 'OK' : 'MISSED');

async function main(): Promise<void> {
  const at = process.argv.indexOf('--phase');
  loadDevEnv();
  if (at >= 0) return runPhase(process.argv[at + 1] as Phase, process.argv[at + 2]!);
  const modesArg = process.argv.includes('--modes') ? process.argv[process.argv.indexOf('--modes') + 1]! : 'store,http,http-tee,deflate1,deflate6';
  const modes = modesArg.split(',').filter((m): m is Mode => m in MODES || isHttp(m as Phase));
  const runs = Math.max(1, Number(process.argv.includes('--runs') ? process.argv[process.argv.indexOf('--runs') + 1] : 3) || 3);
  const { defaultStore } = await import('../lib/storage/objects');
  const { ensureBenchFiles } = await import('./package-data');
  const files = await ensureBenchFiles(defaultStore(), (l) => console.log(l));
  const gib = files.reduce((s, f) => s + f.sizeBytes, 0) / 1024 ** 3;
  console.log(`version: ${files.length} files, ${gib.toFixed(2)} GiB of CSV text in s3rver at ${process.env.S3_ENDPOINT}; ${runs} run(s), each phase in a fresh process`);
  child('raw', files); // warm-up: the store's files into the page cache, so raw and package read alike
  const raw: PhaseResult[] = [];
  const byMode = new Map<Mode, PhaseResult[]>(modes.map((m) => [m, []]));
  // Raw and package alternate so a busy neighbour on the machine slows both alike; deflate and tee (slow) run once.
  for (let i = 0; i < runs; i++) {
    raw.push(child('raw', files));
    for (const m of modes) if (i === 0 || m === 'store' || m === 'http') byMode.get(m)!.push(child(m, files));
  }
  const rawRate = median(raw.map(rate));
  const cpuPerGiB = (rs: PhaseResult[]) => median(rs.map((r) => r.cpuMs / (r.payloadBytes / 1024 ** 3) / 1000)).toFixed(1);
  console.log(`raw S3 GET (same bytes, one object at a time): ${rawRate.toFixed(0)} MB/s (runs ${raw.map((r) => rate(r).toFixed(0)).join(', ')}), CPU ${cpuPerGiB(raw)} s/GiB`);
  for (const [m, rs] of byMode) {
    const r = rs[0]!;
    console.log(
      `package ${m.padEnd(8)}: ${median(rs.map(rate)).toFixed(0)} MB/s of payload, ratio ${(median(rs.map(rate)) / rawRate).toFixed(2)}, ` +
        `(runs ${rs.map((x) => rate(x).toFixed(0)).join(', ')}), CPU ${cpuPerGiB(rs)} s/GiB, TTFB ${median(rs.map((x) => x.ttfbMs ?? NaN)).toFixed(0)} ms, zip ${(r.outBytes / MiB).toFixed(0)} MiB (${((100 * r.outBytes) / r.payloadBytes).toFixed(1)} % of payload), ` +
        `peak RSS growth ${Math.max(...rs.map(growthMb)).toFixed(1)} MB (base ${(r.baseRss / MB).toFixed(0)} MB)` +
        (r.cacheMs !== undefined ? `; cached copy ${r.cached ? 'stored' : 'NOT stored'} ${(r.cacheMs / 1000).toFixed(1)} s after the last byte` : ''),
    );
  }
  const chosen = byMode.get('http') ?? byMode.get('store') ?? [...byMode.values()][0];
  if (!chosen) return;
  const ratio = median(chosen.map(rate)) / rawRate;
  const ttfb = median(chosen.map((x) => x.ttfbMs ?? Infinity));
  const rss = Math.max(...chosen.map(growthMb));
  const label = chosen[0]!.phase === 'http' ? 'http: the route\'s streamed reply over loopback HTTP, store mode' : `${chosen[0]!.phase}, the builder's default`;
  console.log(`targets (${label}):`);
  console.log(`  throughput ratio ${ratio.toFixed(2)} (target ≥ ${TARGET_RATIO}) ${verdict(ratio >= TARGET_RATIO)}`);
  console.log(`  time to first byte ${ttfb.toFixed(0)} ms (target ≤ ${TARGET_TTFB_MS} ms) ${verdict(ttfb <= TARGET_TTFB_MS)}`);
  console.log(`  peak RSS growth ${rss.toFixed(1)} MB (target ≤ ${TARGET_RSS_MB} MB) ${verdict(rss <= TARGET_RSS_MB)}`);
  if (ratio < TARGET_RATIO || ttfb > TARGET_TTFB_MS || rss > TARGET_RSS_MB) process.exitCode = 1;
}

main().catch((e: unknown) => {
  console.error(`bench:package: ${e instanceof Error ? e.stack : String(e)}`);
  process.exitCode = 1;
});
