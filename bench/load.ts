// npm run bench:load — 50 connections for 30 s over a mix of search, landing pages, API reads and package downloads
// against a RUNNING production server. It does not build or start the app: run `npm start` first
// (production build), load the fixture with `npx tsx bench/load-fixture.ts`, then
//   BENCH_BASE_URL=http://localhost:3000 npm run bench:load
// Sample ids come from DATABASE_URL (source .data/env.sh). Target: 0 errors. Figures are per route kind and overall.
//
// Clients: the API limits anonymous callers to 120 requests a minute per address (lib/tokens/api-rate-limit.ts), and
// this one machine is a single address. The bench stands for many visitors behind the reverse proxy the app expects
// (lib/http/client-address.ts: the rightmost X-Forwarded-For entry, the one a proxy appends; `next start` fills the
// header in only when a request has none, so with no proxy in between the bench's own entry is the rightmost one):
// every request carries the next address of 198.18.0.0/15, the
// range set aside for benchmarking (RFC 2544 / RFC 5735), so no simulated visitor nears its limit while every API
// request still pays for the limiter's bookkeeping. Each kind walks its whole list of paths, not one list per connection.
import autocannon from 'autocannon';
import knex from 'knex';
import os from 'node:os';
import { knexConfig } from '../knexfile';

const BASE = (process.env.BENCH_BASE_URL ?? '').replace(/\/$/, '');
const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 30);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
if (!BASE) {
  console.error('Set BENCH_BASE_URL to a running production server (npm start), e.g. BENCH_BASE_URL=http://localhost:3000');
  process.exit(2);
}

type Kind = 'search' | 'landing' | 'api' | 'package';
type Tally = { latenciesMs: number[]; errors: number; statuses: Map<number, number>; bytes: number };
const tallies = new Map<Kind, Tally>();
const tally = (kind: Kind): Tally => {
  let t = tallies.get(kind);
  if (!t) tallies.set(kind, (t = { latenciesMs: [], errors: 0, statuses: new Map(), bytes: 0 }));
  return t;
};
const record = (kind: Kind, status: number | null, ms: number, bytes: number) => {
  const t = tally(kind);
  t.latenciesMs.push(ms);
  t.bytes += bytes;
  if (status !== null) t.statuses.set(status, (t.statuses.get(status) ?? 0) + 1);
  if (status === null || status >= 400) t.errors += 1;
};

/** Published versions to read: bench-fixture ones for pages and API, versions with files for packages. */
async function sampleIds(): Promise<{ pages: { datasetId: string; versionId: string }[]; packages: string[] }> {
  const db = knex(knexConfig());
  try {
    const published = () => db('dataset_versions as v').join('datasets as d', 'd.id', 'v.dataset_id').join('groups as g', 'g.id', 'd.group_id')
      .where('v.state', 'published').whereNull('v.embargo_until');
    const pages = await published().where('g.slug', 'bench-fixture').orderByRaw('RAND()').limit(2000).select('v.dataset_id as datasetId', 'v.id as versionId');
    const packages = (await published().whereExists(db('files').whereRaw('files.version_id = v.id')).limit(20).pluck('v.id')) as string[];
    if (pages.length === 0) throw new Error("no 'bench-fixture' versions: run npx tsx bench/load-fixture.ts first");
    if (packages.length === 0) throw new Error('no published version with files (the demo seed has some): seed the demo first');
    return { pages, packages };
  } finally {
    await db.destroy();
  }
}

const QUERIES = ['resistivity', 'copper wire', 'hall bar', 'thin film anneal', 'superconducting onset', 'NbTi', 'cryostat sweep'];

/** 198.18.0.0/15 holds 131,072 addresses; the n-th request comes from the n-th of them. */
const BENCH_NET = (198 << 24) | (18 << 16);
let clientCounter = 0;
function nextClientAddress(): string {
  const a = (BENCH_NET + (clientCounter++ % 131_072)) >>> 0;
  return `${a >>> 24}.${(a >>> 16) & 255}.${(a >>> 8) & 255}.${a & 255}`;
}

const TIMEOUT_S = 30;

/**
 * One autocannon instance per kind. Its connections share one cursor over `paths`, so together they walk the whole
 * list (autocannon alone starts every connection at the first path). Every response is timed by us.
 */
function cannon(kind: Kind, connections: number, paths: string[]): Promise<void> {
  let cursor = 0;
  return new Promise((resolve, reject) => {
    const instance = autocannon(
      {
        url: BASE, connections, duration: DURATION_S, timeout: TIMEOUT_S,
        requests: [{
          method: 'GET' as const,
          setupRequest: (req) => ({ ...req, path: paths[cursor++ % paths.length]!, headers: { ...req.headers, 'x-forwarded-for': nextClientAddress() } }),
        }],
      },
      (error: unknown) => (error ? reject(error instanceof Error ? error : new Error(String(error))) : resolve()),
    );
    instance.on('response', (_client, status, bytes, ms) => record(kind, status, ms, bytes));
    // A timeout took the whole timeout; other request errors (refused, reset) have no meaningful latency.
    instance.on('reqError', (error: Error) => {
      if (/timed out/.test(error.message)) record(kind, null, TIMEOUT_S * 1000, 0);
      else tally(kind).errors += 1;
    });
  });
}

/** autocannon does not follow redirects: package downloads run in fetch loops that follow the 302 and read the zip. */
async function packageLoop(ids: string[], deadline: number, offset: number): Promise<void> {
  for (let i = offset; Date.now() < deadline; i++) {
    const t = performance.now();
    try {
      const res = await fetch(`${BASE}/api/v1/versions/${ids[i % ids.length]}/package`, {
        redirect: 'follow', headers: { 'x-forwarded-for': nextClientAddress() }, signal: AbortSignal.timeout(TIMEOUT_S * 1000),
      });
      const body = new Uint8Array(await res.arrayBuffer());
      // A zip starts with the local file header signature PK\3\4 (APPNOTE.TXT 4.3.7).
      const zip = body[0] === 0x50 && body[1] === 0x4b && body[2] === 3 && body[3] === 4;
      record('package', res.status === 200 && !zip ? 422 : res.status, performance.now() - t, body.length);
    } catch {
      record('package', null, performance.now() - t, 0);
    }
  }
}

const pct = (sorted: number[], q: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] : NaN);
function row(name: string, t: Tally): string {
  const s = [...t.latenciesMs].sort((a, b) => a - b);
  const statuses = [...t.statuses].sort((a, b) => a[0] - b[0]).map(([k, v]) => `${k}×${v}`).join(' ');
  return [name.padEnd(8), String(s.length).padStart(7), (s.length / DURATION_S).toFixed(1).padStart(8),
    ...[0.5, 0.95, 0.99].map((q) => pct(s, q).toFixed(0).padStart(7)), String(t.errors).padStart(6), `  ${statuses}`].join(' ');
}

const { pages, packages } = await sampleIds();
// GET /api/v1/search (app/api/v1/search/route.ts): should it answer 404, search is left out of the mix (said so
// below) and its connections go to the API reads.
// This first search also builds the instance's index if no search has yet (a minute at 100k versions), so that the
// timed run measures the steady state.
const warm = performance.now();
const searchLive = (await fetch(`${BASE}/api/v1/search?q=copper`, { headers: { 'x-forwarded-for': nextClientAddress() } }).catch(() => null))?.status !== 404;
console.log(`warm-up search answered in ${((performance.now() - warm) / 1000).toFixed(1)} s`);
const packageConnections = Math.max(1, Math.round(CONNECTIONS * 0.1));
const share = Math.floor((CONNECTIONS - packageConnections) / 3);
const mix: [Kind, number, string[]][] = [
  ...(searchLive ? [['search', share, QUERIES.map((q) => `/api/v1/search?q=${encodeURIComponent(q)}`)] as [Kind, number, string[]]] : []),
  ['landing', share, pages.map((p) => `/datasets/${p.datasetId}`)],
  // API reads: version JSON, with the OpenAPI document every tenth request.
  ['api', CONNECTIONS - packageConnections - share * (searchLive ? 2 : 1),
    pages.flatMap((p, i) => [`/api/v1/versions/${p.versionId}`, ...(i % 10 === 0 ? ['/api/v1/openapi.json'] : [])])],
];
if (!searchLive) console.log('NOTE: GET /api/v1/search answers 404 (route not there yet): search is NOT in this run\'s mix.');

console.log(`load bench: ${BASE}, ${CONNECTIONS} connections for ${DURATION_S} s (${mix.map(([k, c]) => `${k} ${c}`).join(', ')}, package ${packageConnections}); ` +
  `node ${process.version}, ${os.cpus().length} CPUs, load average ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}`);
const deadline = Date.now() + DURATION_S * 1000;
await Promise.all([
  ...mix.map(([kind, connections, paths]) => cannon(kind, connections, paths)),
  ...Array.from({ length: packageConnections }, (_, i) => packageLoop(packages, deadline, i)),
]);

console.log(`\n${'kind'.padEnd(8)} ${'requests'.padStart(7)} ${'req/s'.padStart(8)} ${'p50 ms'.padStart(7)} ${'p95 ms'.padStart(7)} ${'p99 ms'.padStart(7)} ${'errors'.padStart(6)}  statuses`);
const all: Tally = { latenciesMs: [], errors: 0, statuses: new Map(), bytes: 0 };
for (const [kind, t] of tallies) {
  console.log(row(kind, t));
  all.latenciesMs.push(...t.latenciesMs);
  all.errors += t.errors;
  for (const [k, v] of t.statuses) all.statuses.set(k, (all.statuses.get(k) ?? 0) + v);
}
console.log(row('overall', all));
console.log(all.errors === 0 ? '\ntarget met: 0 errors' : `\ntarget missed: ${all.errors} errors (4xx/5xx, timeouts or connection errors)`);
process.exitCode = all.errors === 0 ? 0 : 1;
