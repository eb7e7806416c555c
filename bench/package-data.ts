// The package bench's version: 8 text files of transport data (128 MiB each, 1 GiB together) stored once in s3rver
// under bench/package/v1/ and reused while a marker object says they are complete.
import { createHash } from 'node:crypto';
import { Readable } from 'node:stream';
import type { PackageFile } from '../lib/packages/types';
import { listObjects, readObject, type ObjectStore } from '../lib/storage/objects';
import { putObject } from '../lib/storage/put-object';

export const BENCH_PREFIX = 'bench/package/v1/';
const MARKER_KEY = `${BENCH_PREFIX}marker.json`;
const GENERATOR = 'transport-text-v1';
export const FILE_BYTES = 128 * 1024 * 1024;
const NAMES = ['larkspur-cd01-rt-cooldown.csv', 'larkspur-cd02-rt-warmup.csv', 'tidewater-f07-rs-vs-t.csv', 'tidewater-f07-hall-9T.csv',
  'cobalt-crm12-mr-1p8K.csv', 'cobalt-crm12-mr-10K.csv', 'cobalt-crm12-mr-50K.csv', 'cobalt-crm12-angle-sweep.csv'];

type Marker = { generator: string; files: PackageFile[] };

// mulberry32: a small deterministic PRNG (public-domain construction), so every run stores the same bytes.
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Exactly `total` bytes of CSV rows (time, T, B, I, V, R, lock-in phase) as a temperature sweep with noise. */
async function* transportRows(seed: number, total: number): AsyncGenerator<Buffer> {
  const random = prng(seed);
  let sent = 0;
  let row = 0;
  let carry = Buffer.from('# Ohmstead package bench: invented R(T) sweep, Meridian Transport Consortium\ntime (s),T (K),B (T),I (A),V (V),R (Ohm),phase (deg)\n');
  while (sent < total) {
    const lines: string[] = [];
    for (let i = 0; i < 8192; i++, row++) {
      const tK = 1.8 + ((row * 0.01) % 298.2);
      const rOhm = 12.5 + 0.0021 * tK * tK + (random() - 0.5) * 0.02;
      const iA = 1e-5;
      lines.push(`${(row * 0.25).toFixed(2)},${tK.toFixed(4)},${(random() * 1e-4).toFixed(6)},${iA.toExponential(3)},${(rOhm * iA).toExponential(6)},${rOhm.toFixed(5)},${((random() - 0.5) * 0.4).toFixed(3)}\n`);
    }
    const chunk = Buffer.concat([carry, Buffer.from(lines.join(''))]);
    const take = Math.min(chunk.length, total - sent);
    carry = chunk.subarray(take);
    sent += take;
    yield chunk.subarray(0, take);
  }
}

async function readMarker(store: ObjectStore): Promise<Marker | undefined> {
  try {
    const read = await readObject(store, MARKER_KEY);
    const chunks: Uint8Array[] = [];
    for await (const c of read.body) chunks.push(c);
    const marker = JSON.parse(Buffer.concat(chunks).toString('utf8')) as Marker;
    if (marker.generator !== GENERATOR || marker.files.length !== NAMES.length) return undefined;
    const sizes = new Map((await listObjects(store, BENCH_PREFIX)).map((o) => [o.key, o.sizeBytes]));
    return marker.files.every((f) => sizes.get(f.storageKey) === f.sizeBytes) ? marker : undefined;
  } catch {
    return undefined;
  }
}

/** The 8 stored files; generates and uploads them (about 1 GiB) only when the marker is missing or stale. */
export async function ensureBenchFiles(store: ObjectStore, say: (line: string) => void): Promise<PackageFile[]> {
  const marker = await readMarker(store);
  if (marker) return marker.files;
  say(`storing the bench version in s3rver (${NAMES.length} × ${FILE_BYTES / 1024 / 1024} MiB, once; reused while ${MARKER_KEY} exists)…`);
  const files: PackageFile[] = [];
  for (const [i, name] of NAMES.entries()) {
    const hash = createHash('sha256');
    const started = performance.now();
    const body = Readable.from((async function* () {
      for await (const chunk of transportRows(1000 + i, FILE_BYTES)) {
        hash.update(chunk);
        yield chunk;
      }
    })());
    const storageKey = `${BENCH_PREFIX}${name}`;
    await putObject(store, storageKey, body, { sizeBytes: FILE_BYTES, contentType: 'text/csv' });
    files.push({ name, sizeBytes: FILE_BYTES, sha256: hash.digest('hex'), storageKey, mediaType: 'text/csv' });
    say(`  ${name}: ${((performance.now() - started) / 1000).toFixed(1)} s`);
  }
  await putObject(store, MARKER_KEY, JSON.stringify({ generator: GENERATOR, files } satisfies Marker, null, 2), { contentType: 'application/json' });
  return files;
}
