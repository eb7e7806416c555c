// A test double of the network for the upload widget's logic: the deposit API (contract part B) and the
// presigned-URL object storage behind it, in memory, with the faults the widget must survive.
import { createHash } from 'node:crypto';
import type { FetchLike, FileView } from '@/lib/client/uploads/types';

export type Fault = {
  match: (method: string, url: string) => boolean;
  /** drop: no answer; drop-after: stored, but the answer is lost; 503: storage down; corrupt: stores altered bytes; lose: answers 200 but keeps nothing. */
  kind: 'drop' | 'drop-after' | '503' | 'corrupt' | 'lose';
  times: number;
};

type Upload = {
  fileId: string; name: string; sizeBytes: number; sha256: string; role: FileView['role'];
  parts: Map<number, { bytes: Buffer; etag: string }>; state: FileView['uploadState']; createdAt: string;
  analysisCalls: number;
};

const STORAGE = 'http://storage.test';
const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
const apiError = (status: number, code: string, message: string) => json(status, { error: { code, message, details: {}, requestId: 'test' } });
const sha256Hex = (b: Buffer) => createHash('sha256').update(b).digest('hex');

export class FakeUploadServer {
  readonly uploads = new Map<string, Upload>();
  readonly log: string[] = [];
  faults: Fault[] = [];
  partSizeBytes = 64 * 1024;
  maxUploadBytes = 10 * 1024 * 1024;
  /** Milliseconds each part PUT takes, so tests can catch parts in flight. */
  putLatencyMs = 0;
  exposeEtag = true;
  inFlightPuts = 0;
  maxInFlightPuts = 0;
  private signature = 1;
  private nextId = 1;

  /** Presigned URLs issued before this call now answer 403, as expired ones do. */
  expireUrls(): void {
    this.signature += 1;
  }

  count(prefix: string): number {
    return this.log.filter((l) => l.startsWith(prefix)).length;
  }

  fetch: FetchLike = async (url, init = {}) => {
    const method = init.method ?? 'GET';
    this.log.push(`${method} ${url}`);
    if (init.signal?.aborted) throw init.signal.reason;
    const fault = this.faults.find((f) => f.times > 0 && f.match(method, url));
    if (fault) fault.times -= 1;
    if (fault?.kind === 'drop') throw new TypeError('fetch failed');
    if (fault?.kind === '503') return apiError(503, 'service_unavailable', 'Object storage is not answering.');
    const res = url.startsWith(STORAGE) ? await this.storage(method, url, init, fault?.kind) : await this.api(method, url, init);
    if (fault?.kind === 'drop-after') throw new TypeError('fetch failed');
    return res;
  };

  private partUrls(u: Upload, missingOnly: boolean) {
    const count = Math.max(1, Math.ceil(u.sizeBytes / this.partSizeBytes));
    return Array.from({ length: count }, (_, i) => i + 1)
      .filter((n) => !missingOnly || !u.parts.has(n))
      .map((partNumber) => ({ partNumber, url: `${STORAGE}/staging/${u.fileId}?partNumber=${partNumber}&sig=${this.signature}` }));
  }

  view(u: Upload): FileView {
    const analysable = /\.(csv|tsv|txt|dat)$/i.test(u.name);
    const a = this.analysis(u, false);
    return {
      id: u.fileId, name: u.name, role: u.role, sizeBytes: u.sizeBytes, sha256: u.state === 'verified' ? u.sha256 : null,
      uploadState: u.state, analysisState: analysable ? a.state : 'none', analysisProgress: a.progress, analysisError: null, createdAt: u.createdAt,
    };
  }

  /** Analysis advances one step per question: queued → running 40 % → done. */
  private analysis(u: Upload, advance: boolean): { state: FileView['analysisState']; progress: number } {
    if (advance) u.analysisCalls += 1;
    if (u.state !== 'verified') return { state: 'none', progress: 0 };
    if (u.analysisCalls === 0) return { state: 'queued', progress: 0 };
    if (u.analysisCalls === 1) return { state: 'running', progress: 0.4 };
    return { state: 'done', progress: 1 };
  }

  private async api(method: string, url: string, init: RequestInit): Promise<Response> {
    const path = new URL(url, 'http://app.test').pathname;
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    let m: RegExpMatchArray | null;
    if (method === 'POST' && (m = path.match(/^\/api\/v1\/versions\/([^/]+)\/uploads$/))) {
      const { name, sizeBytes, sha256 } = body as { name: string; sizeBytes: number; sha256: string };
      if (!/^[0-9a-f]{64}$/.test(sha256)) return apiError(422, 'validation_failed', 'sha256 must be 64 lower-case hex digits.');
      if (sizeBytes > this.maxUploadBytes) return apiError(413, 'payload_too_large', `This file is ${sizeBytes} bytes; the limit per file is ${this.maxUploadBytes} bytes.`);
      const same = [...this.uploads.values()].find((u) => u.name === name);
      if (same?.state === 'verified') return apiError(409, 'conflict', `A file named “${name}” is already in this version; remove it first.`);
      if (same) this.uploads.delete(same.fileId);
      const u: Upload = { fileId: `f${this.nextId++}`, name, sizeBytes, sha256, role: 'raw', parts: new Map(), state: 'pending', createdAt: new Date(0).toISOString(), analysisCalls: 0 };
      this.uploads.set(u.fileId, u);
      const parts = this.partUrls(u, false);
      return json(201, { fileId: u.fileId, uploadId: `up-${u.fileId}`, partSizeBytes: this.partSizeBytes, partCount: parts.length, parts });
    }
    const u = (m = path.match(/^\/api\/v1\/(?:uploads|files)\/([^/]+)/)) ? this.uploads.get(m[1]) : undefined;
    if (m && !u) return apiError(404, 'not_found', 'No such file.');
    if (method === 'GET' && path === `/api/v1/uploads/${u?.fileId}`) {
      const completedParts = [...u!.parts].map(([partNumber, p]) => ({ partNumber, etag: p.etag, sizeBytes: p.bytes.length }));
      return json(200, { fileId: u!.fileId, name: u!.name, sizeBytes: u!.sizeBytes, sha256: u!.sha256, uploadState: u!.state, partSizeBytes: this.partSizeBytes, partCount: this.partUrls(u!, false).length, completedParts, parts: this.partUrls(u!, true) });
    }
    if (method === 'POST' && path === `/api/v1/uploads/${u?.fileId}/complete`) return this.complete(u!, body as { parts?: { partNumber: number; etag: string }[] });
    if (method === 'DELETE' && (path === `/api/v1/uploads/${u?.fileId}` || path === `/api/v1/files/${u?.fileId}`)) {
      this.uploads.delete(u!.fileId);
      return new Response(null, { status: 204 });
    }
    if (method === 'PATCH' && path === `/api/v1/files/${u?.fileId}`) {
      u!.role = (body as { role: FileView['role'] }).role;
      return json(200, { file: this.view(u!) });
    }
    if (method === 'GET' && path === `/api/v1/files/${u?.fileId}/analysis`) {
      const a = this.analysis(u!, true);
      return json(200, { state: a.state, progress: a.progress, error: null, summary: a.state === 'done' ? { rows: 3 } : null });
    }
    return apiError(404, 'not_found', `No route ${method} ${path}`);
  }

  private complete(u: Upload, body: { parts?: { partNumber: number; etag: string }[] }): Response {
    if (u.state === 'verified') return apiError(409, 'conflict', 'This upload is already complete.');
    const expected = this.partUrls(u, false).map((p) => p.partNumber);
    const missing = expected.filter((n) => !u.parts.has(n));
    if (missing.length) return apiError(409, 'conflict', `${missing.length} of ${expected.length} parts have not arrived yet (part ${missing.join(', ')}). Upload them, then complete again.`);
    for (const p of body.parts ?? []) if (u.parts.get(p.partNumber)?.etag !== p.etag) return apiError(422, 'validation_failed', `Part ${p.partNumber}: ETag does not match.`);
    const all = Buffer.concat(expected.map((n) => u.parts.get(n)!.bytes));
    const digest = sha256Hex(all);
    if (digest !== u.sha256 || all.length !== u.sizeBytes) {
      this.uploads.delete(u.fileId);
      return apiError(422, 'validation_failed', `The file arrived altered: its SHA-256 is ${digest}, but ${u.sha256} was declared. Nothing was kept; upload it again.`);
    }
    u.state = 'verified';
    return json(200, { file: this.view(u) });
  }

  private async storage(method: string, url: string, init: RequestInit, fault?: Fault['kind']): Promise<Response> {
    const q = new URL(url).searchParams;
    const fileId = new URL(url).pathname.split('/').pop()!;
    if (method !== 'PUT') return new Response('<Error><Code>MethodNotAllowed</Code></Error>', { status: 405 });
    if (Number(q.get('sig')) !== this.signature) return new Response('<Error><Code>AccessDenied</Code><Message>Request has expired</Message></Error>', { status: 403 });
    this.inFlightPuts += 1;
    this.maxInFlightPuts = Math.max(this.maxInFlightPuts, this.inFlightPuts);
    try {
      const bytes = Buffer.from(await (init.body as Blob).arrayBuffer());
      if (this.putLatencyMs) await abortableDelay(this.putLatencyMs, init.signal ?? undefined);
      if (fault === 'corrupt') bytes[0] ^= 0xff;
      const u = this.uploads.get(fileId);
      if (!u) return new Response('<Error><Code>NoSuchUpload</Code></Error>', { status: 404 });
      const etag = `"${createHash('md5').update(bytes).digest('hex')}"`; // S3 part ETags are the part's MD5
      if (fault !== 'lose') u.parts.set(Number(q.get('partNumber')), { bytes, etag });
      return new Response(null, { status: 200, headers: this.exposeEtag ? { ETag: etag } : {} });
    } finally {
      this.inFlightPuts -= 1;
    }
  }
}

function abortableDelay(ms: number, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    const onAbort = () => {
      clearTimeout(t);
      reject(signal!.reason);
    };
    const t = setTimeout(() => {
      signal?.removeEventListener('abort', onAbort);
      resolve();
    }, ms);
    signal?.addEventListener('abort', onAbort, { once: true });
  });
}

/** Deterministic bytes of a given length (a repeating, non-trivial pattern). */
export function patternBytes(length: number, seed = 7): Uint8Array {
  const out = new Uint8Array(length);
  let x = seed;
  for (let i = 0; i < length; i += 1) {
    x = (x * 1103515245 + 12345) >>> 0; // ANSI C LCG constants (common practice)
    out[i] = x >>> 24;
  }
  return out;
}

/** An in-memory localStorage. */
export class MemoryStorage {
  readonly map = new Map<string, string>();
  getItem = (k: string) => this.map.get(k) ?? null;
  setItem = (k: string, v: string) => void this.map.set(k, v);
  removeItem = (k: string) => void this.map.delete(k);
}
