// npm run bench:package [-- --modes store,http,build,cached,deflate1,deflate6 --runs N --part-mib M --queue Q]: a 1 GiB
// version of 8 text files in s3rver (dev services, .data/env.sh). Each phase runs in a fresh child process that
// reports its own time and peak RSS: raw S3 GET of the same bytes; the package builder per compression mode; and the
// three paths of a package download: `http`, the uncached (first) download, where a node:http server in the child sends
// lib/downloads' streamed package reply (the route's code path minus Next) to curl; `build`, the worker's background
// build of the cached copy into storage (lib/downloads/build-cached-package.ts, the job's code path minus the outbox);
// `cached`, a later download, answered 302 to the presigned URL of that copy, which curl follows. raw, store, http,
// build and cached run N times (default 3), alternating. Targets, judged on http and cached: package/raw throughput
// ≥ 0.7, time to first byte ≤ 300 ms, peak RSS growth of the server ≤ 64 MB; build's figures are reported beside them.
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
/** The three paths of a package download (see the top of this file), in the order each run takes them. */
const PATHS = ['http', 'build', 'cached'] as const;
type PathPhase = (typeof PATHS)[number];
type Mode = keyof typeof MODES | PathPhase;
type Phase = 'raw' | Mode;
const PATH_LABELS: Record<PathPhase, string> = {
  http: 'uncached first download (streamed)', build: 'background build of the cached copy', cached: 'cached download (302 to presigned GET)',
};
/** What a child phase gets: the files, the cache key (build writes it, cached reads it) and the build's upload settings. */
type PhaseArgs = { files: PackageFile[]; cacheKey: string; partMiB?: number; queue?: number };
type PhaseResult = {
  phase: Phase; ms: number; cpuMs: number; ttfbMs?: number; payloadBytes: number; outBytes: number; baseRss: number; maxRss: number; sampledPeak: number;
};
const isPath = (p: string): p is PathPhase => (PATHS as readonly string[]).includes(p);

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

/** One download over loopback HTTP by curl (following a redirect): time to the first body byte and bytes received. */
async function curlDownload(handler: http.RequestListener, follow: boolean): Promise<{ ttfbMs: number; outBytes: number }> {
  const server = http.createServer(handler);
  server.listen(0, '127.0.0.1');
  await once(server, 'listening');
  const { port } = server.address() as AddressInfo;
  // The client is curl in its own process, as a browser would be on its own machine: the server's process (whose
  // RSS is measured) does only the server's work. curl reports the first byte's time (summed over a redirect and the
  // request it leads to) and the bytes it received.
  const curl = spawn('curl', ['-sS', ...(follow ? ['-L'] : []), '-o', '/dev/null', '-w', '%{time_starttransfer} %{size_download} %{http_code} %{num_redirects}', `http://127.0.0.1:${port}/`]);
  let report = '';
  curl.stdout.on('data', (d: Buffer) => void (report += d.toString()));
  const [code] = (await once(curl, 'close')) as [number];
  server.close();
  const [startS, size, status, redirects] = report.trim().split(' ');
  if (code !== 0 || status !== '200') throw new Error(`curl exited ${code} with HTTP ${status ?? '?'} (bench:package needs curl for its HTTP client)`);
  if (follow && redirects !== '1') throw new Error(`the cached download was not answered with one redirect (curl followed ${redirects ?? '?'})`);
  return { ttfbMs: Number(startS) * 1000, outBytes: Number(size) };
}

/** http: the uncached download, streamed as the route streams it. */
async function streamedDownload(files: PackageFile[]): Promise<{ ttfbMs: number; outBytes: number }> {
  const { defaultStore } = await import('../lib/storage/objects');
  const { streamPackageReply } = await import('../lib/downloads/download-package');
  const store = defaultStore();
  return curlDownload((_req, res) => {
    const reply = streamPackageReply({ input: benchInput(files), store, onFailure: (e) => console.error(`bench: package failed: ${e.message}`) });
    res.writeHead(reply.status, reply.headers);
    void pump(reply.body as ReadableStream<Uint8Array>, res);
  }, false);
}

/** cached: a later download, answered as the route answers once the copy exists (302 to a presigned GET of it). */
async function cachedDownload(files: PackageFile[], cacheKey: string): Promise<{ ttfbMs: number; outBytes: number }> {
  const { defaultStore } = await import('../lib/storage/objects');
  const { cachedPackageUrl } = await import('../lib/downloads/package-cache');
  const { defaultBagName } = await import('../lib/packages/bag-layout');
  const store = defaultStore();
  const fileName = `${defaultBagName(benchInput(files).metadata.doi)}.zip`;
  return curlDownload((_req, res) => {
    void cachedPackageUrl(store, cacheKey, fileName).then((url) => {
      if (!url) return void res.writeHead(404).end();
      res.writeHead(302, { location: url, 'cache-control': 'private, no-store' }).end();
    }, (error: unknown) => res.destroy(error instanceof Error ? error : new Error(String(error))));
  }, true);
}

/** build: the worker's build of the cached copy into `cacheKey`; first byte = the zip's first bytes going to the upload. */
async function backgroundBuild(args: PhaseArgs, start: number): Promise<{ ttfbMs: number; outBytes: number }> {
  const { defaultStore } = await import('../lib/storage/objects');
  const { buildPackageIntoCache } = await import('../lib/downloads/build-cached-package');
  let ttfbMs = NaN;
  const built = await buildPackageIntoCache({
    input: benchInput(args.files), store: defaultStore(), key: args.cacheKey, onFirstBytes: () => void (ttfbMs = performance.now() - start),
    ...(args.partMiB ? { partSizeBytes: args.partMiB * MiB } : {}), ...(args.queue ? { queueSize: args.queue } : {}),
  });
  return { ttfbMs, outBytes: built.zipBytes };
}

/** Child: one phase, timed, with its RSS sampled every 10 ms; prints one JSON line. */
async function runPhase(phase: Phase, argsJson: string): Promise<void> {
  const args = JSON.parse(argsJson) as PhaseArgs;
  const { files } = args;
  const { defaultStore, objectExists } = await import('../lib/storage/objects');
  const { openObjectStream } = await import('../lib/storage/stream-object');
  const { buildPackageStream } = await import('../lib/packages/build-package-stream');
  const store = defaultStore();
  await objectExists(store, files[0]!.storageKey); // warm the client and its socket pool before the baseline
  // Their modules load before the baseline too.
  if (isPath(phase)) await Promise.all([import('../lib/downloads/download-package'), import('../lib/downloads/build-cached-package')]);
  (globalThis as { gc?: () => void }).gc?.();
  const baseRss = process.memoryUsage().rss;
  let sampledPeak = baseRss;
  const timer = setInterval(() => (sampledPeak = Math.max(sampledPeak, process.memoryUsage.rss())), 10);
  const cpuStart = process.cpuUsage();
  const start = performance.now();
  let outBytes = 0;
  let ttfbMs: number | undefined;
  if (phase === 'raw') {
    for (const f of files) for await (const chunk of (await openObjectStream(store, f.storageKey)).body) outBytes += (chunk as Buffer).length;
  } else if (isPath(phase)) {
    const got = phase === 'http' ? await streamedDownload(files) : phase === 'cached' ? await cachedDownload(files, args.cacheKey) : await backgroundBuild(args, start);
    ({ ttfbMs, outBytes } = got);
  } else {
    const reader = buildPackageStream(benchInput(files), MODES[phase]).stream.getReader();
    for (let r = await reader.read(); !r.done; r = await reader.read()) {
      ttfbMs ??= performance.now() - start;
      outBytes += r.value.length;
    }
  }
  const ms = performance.now() - start;
  const cpu = process.cpuUsage(cpuStart);
  const cpuMs = (cpu.user + cpu.system) / 1000;
  clearInterval(timer);
  sampledPeak = Math.max(sampledPeak, process.memoryUsage.rss());
  const maxRss = Math.max(process.resourceUsage().maxRSS * 1024, sampledPeak);
  const payloadBytes = files.reduce((s, f) => s + f.sizeBytes, 0);
  process.stdout.write(`${JSON.stringify({ phase, ms, cpuMs, ttfbMs, payloadBytes, outBytes, baseRss, maxRss, sampledPeak } satisfies PhaseResult)}\n`);
}

function child(phase: Phase, args: PhaseArgs): PhaseResult {
  const self = fileURLToPath(import.meta.url);
  const out = execFileSync(process.execPath, ['--expose-gc', ...process.execArgv, self, '--phase', phase, JSON.stringify(args)], {
    encoding: 'utf8', maxBuffer: 16 * MiB, stdio: ['ignore', 'pipe', 'inherit'],
  });
  return JSON.parse(out.trim().split('\n').pop()!) as PhaseResult;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const rate = (r: PhaseResult) => r.payloadBytes / MB / (r.ms / 1000);
const growthMb = (r: PhaseResult) => (r.maxRss - r.baseRss) / MB;
const verdict = (ok: boolean) => (ok ? 'OK' : 'MISSED');

const option = (name: string): string | undefined => (process.argv.includes(name) ? process.argv[process.argv.indexOf(name) + 1] : undefined);

async function main(): Promise<void> {
  const at = process.argv.indexOf('--phase');
  loadDevEnv();
  if (at >= 0) return runPhase(process.argv[at + 1] as Phase, process.argv[at + 2]!);
  const modes = (option('--modes') ?? 'store,http,build,cached,deflate1,deflate6').split(',').filter((m): m is Mode => m in MODES || isPath(m));
  const runs = Math.max(1, Number(option('--runs') ?? 3) || 3);
  const { defaultStore, deleteObjects, objectExists } = await import('../lib/storage/objects');
  const { BUILD_QUEUE, buildPartBytes } = await import('../lib/downloads/build-cached-package');
  const { ensureBenchFiles } = await import('./package-data');
  const store = defaultStore();
  const files = await ensureBenchFiles(store, (l) => console.log(l));
  const gib = files.reduce((s, f) => s + f.sizeBytes, 0) / 1024 ** 3;
  const cacheKey = `bench/package/cache/${randomBytes(6).toString('hex')}.zip`;
  const args: PhaseArgs = { files, cacheKey, partMiB: Number(option('--part-mib')) || undefined, queue: Number(option('--queue')) || undefined };
  console.log(`version: ${files.length} files, ${gib.toFixed(2)} GiB of CSV text in s3rver at ${process.env.S3_ENDPOINT}; ${runs} run(s), each phase in a fresh process`);
  child('raw', args); // warm-up: the store's files into the page cache, so raw and package read alike
  const raw: PhaseResult[] = [];
  const byMode = new Map<Mode, PhaseResult[]>(modes.map((m) => [m, []]));
  try {
    // Raw and package alternate so a busy neighbour on the machine slows both alike; deflate (slow) runs once.
    for (let i = 0; i < runs; i++) {
      raw.push(child('raw', args));
      for (const m of modes) {
        if (m.startsWith('deflate') && i > 0) continue;
        if (m === 'build') await deleteObjects(store, [cacheKey]);
        if (m === 'cached' && !(await objectExists(store, cacheKey))) child('build', args); // a copy to hand out, not timed
        byMode.get(m)!.push(child(m, args));
      }
    }
  } finally {
    await deleteObjects(store, [cacheKey]);
  }
  const rawRate = median(raw.map(rate));
  const cpuPerGiB = (rs: PhaseResult[]) => median(rs.map((r) => r.cpuMs / (r.payloadBytes / 1024 ** 3) / 1000)).toFixed(1);
  console.log(`raw S3 GET (same bytes, one object at a time): ${rawRate.toFixed(0)} MB/s (runs ${raw.map((r) => rate(r).toFixed(0)).join(', ')}), CPU ${cpuPerGiB(raw)} s/GiB`);
  for (const [m, rs] of byMode) {
    const r = rs[0]!;
    console.log(
      `${isPath(m) ? m : `package ${m}`}`.padEnd(16) + `: ${median(rs.map(rate)).toFixed(0)} MB/s of payload, ratio ${(median(rs.map(rate)) / rawRate).toFixed(2)} ` +
        `(runs ${rs.map((x) => rate(x).toFixed(0)).join(', ')}), CPU ${cpuPerGiB(rs)} s/GiB, TTFB ${median(rs.map((x) => x.ttfbMs ?? NaN)).toFixed(0)} ms, ` +
        `zip ${(r.outBytes / MiB).toFixed(0)} MiB (${((100 * r.outBytes) / r.payloadBytes).toFixed(1)} % of payload), ` +
        `peak RSS growth ${Math.max(...rs.map(growthMb)).toFixed(1)} MB (runs ${rs.map((x) => growthMb(x).toFixed(0)).join(', ')}; base ${(r.baseRss / MB).toFixed(0)} MB)`,
    );
  }
  let missed = false;
  for (const p of PATHS) {
    const rs = byMode.get(p);
    if (!rs?.length) continue;
    const ratio = median(rs.map(rate)) / rawRate;
    const ttfb = median(rs.map((x) => x.ttfbMs ?? Infinity));
    const rss = Math.max(...rs.map(growthMb));
    if (p === 'build') {
      const partMiB = args.partMiB ?? buildPartBytes(rs[0]!.payloadBytes) / MiB;
      console.log(`${PATH_LABELS[p]} (in the worker, no client waits on it; parts of ${partMiB} MiB, ${args.queue ?? BUILD_QUEUE} in flight):`);
      console.log(`  throughput ratio ${ratio.toFixed(2)}, first zip bytes to the upload after ${ttfb.toFixed(0)} ms, peak RSS growth ${rss.toFixed(1)} MB`);
      continue;
    }
    console.log(`targets, ${PATH_LABELS[p]}:`);
    console.log(`  throughput ratio ${ratio.toFixed(2)} (target ≥ ${TARGET_RATIO}) ${verdict(ratio >= TARGET_RATIO)}`);
    console.log(`  time to first byte ${ttfb.toFixed(0)} ms (target ≤ ${TARGET_TTFB_MS} ms) ${verdict(ttfb <= TARGET_TTFB_MS)}`);
    console.log(`  peak RSS growth ${rss.toFixed(1)} MB (target ≤ ${TARGET_RSS_MB} MB) ${verdict(rss <= TARGET_RSS_MB)}`);
    missed ||= ratio < TARGET_RATIO || ttfb > TARGET_TTFB_MS || rss > TARGET_RSS_MB;
  }
  if (missed) process.exitCode = 1;
}

main().catch((e: unknown) => {
  console.error(`bench:package: ${e instanceof Error ? e.stack : String(e)}`);
  process.exitCode = 1;
});
