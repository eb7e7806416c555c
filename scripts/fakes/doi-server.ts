// HTTP side of the DOI fake: the registration agency's JSON:API routes, Basic auth, errors as {"errors":[…]}.
import type { IncomingMessage, ServerResponse } from 'node:http';
import {
  type ApiError, type Attributes, type DoiRecord, isApiError, isDoi, mandatoryErrors, metadataOf, newSuffix, nextState,
  normalizeDoi, parseEvent, toResource,
} from './doi-model';
import type { DoiStore } from './doi-store';

export type DoiFakeConfig = { store: DoiStore; repositoryId: string; password: string; prefix: string };

const JSON_API = 'application/vnd.api+json';
const MAX_BODY = 10 * 1024 * 1024;

class HttpError extends Error {
  constructor(readonly status: number, readonly errors: ApiError[]) {
    super(errors.map((e) => e.title).join('; '));
  }
}
const fail = (status: number, title: string, source?: string) => new HttpError(status, [{ status: String(status), ...(source ? { source } : {}), title }]);

function send(res: ServerResponse, status: number, body?: unknown): void {
  if (body === undefined) {
    res.writeHead(status).end();
    return;
  }
  res.writeHead(status, { 'Content-Type': JSON_API }).end(JSON.stringify(body));
}

function authorised(req: IncomingMessage, cfg: DoiFakeConfig): boolean {
  const m = /^Basic\s+(.+)$/i.exec(req.headers.authorization ?? '');
  if (!m) return false;
  const decoded = Buffer.from(m[1], 'base64').toString('utf8');
  const colon = decoded.indexOf(':');
  // Repository ids are case-insensitive at the agency (from memory); passwords are not.
  return colon > 0 && decoded.slice(0, colon).toLowerCase() === cfg.repositoryId.toLowerCase() && decoded.slice(colon + 1) === cfg.password;
}

async function readAttributes(req: IncomingMessage): Promise<Attributes> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const c of req as AsyncIterable<Buffer>) {
    size += c.length;
    if (size > MAX_BODY) throw fail(413, 'request body larger than 10 MB');
    chunks.push(c);
  }
  let body: unknown;
  try {
    body = JSON.parse(Buffer.concat(chunks).toString('utf8'));
  } catch {
    throw fail(400, 'request body is not valid JSON');
  }
  const data = (body as { data?: { type?: unknown; attributes?: unknown } } | null)?.data;
  if (!data || data.type !== 'dois') throw fail(422, 'body must be {"data":{"type":"dois","attributes":{…}}}', 'data');
  const attrs = data.attributes ?? {};
  if (typeof attrs !== 'object' || Array.isArray(attrs)) throw fail(422, 'data.attributes must be an object', 'attributes');
  return attrs as Attributes;
}

function check(result: ApiError[]): void {
  if (result.length) throw new HttpError(422, result);
}

/** Applies an optional event and metadata to a record (new or existing), enforcing mandatory fields when leaving draft. */
function applyChange(cfg: DoiFakeConfig, doi: string, existing: DoiRecord | undefined, attrs: Attributes): DoiRecord {
  const event = parseEvent(attrs.event);
  if (isApiError(event)) throw new HttpError(422, [event]);
  const state = nextState(existing?.state ?? 'draft', event);
  if (isApiError(state)) throw new HttpError(422, [state]);
  const metadata = { ...(existing?.attributes ?? {}), ...metadataOf(attrs) };
  if (state !== 'draft') check(mandatoryErrors(doi, metadata));
  const now = new Date().toISOString();
  const record: DoiRecord = {
    doi, state, attributes: metadata, created: existing?.created ?? now, updated: now,
    registered: existing?.registered ?? (state === 'draft' ? null : now),
  };
  cfg.store.put(record);
  return record;
}

function newDoi(cfg: DoiFakeConfig, attrs: Attributes): string {
  let doi: string;
  if (typeof attrs.doi === 'string' && attrs.doi) doi = normalizeDoi(attrs.doi);
  else if (typeof attrs.prefix === 'string' && attrs.prefix) {
    do doi = `${attrs.prefix.toLowerCase()}/${newSuffix()}`;
    while (cfg.store.get(doi));
  } else throw fail(422, 'give attributes.doi, or attributes.prefix to have a suffix generated', 'doi');
  if (!isDoi(doi)) throw fail(422, `doi ${JSON.stringify(doi)} is not of the form 10.NNNN/suffix`, 'doi');
  if (doi.split('/')[0] !== cfg.prefix.toLowerCase()) throw fail(422, `prefix ${doi.split('/')[0]} is not assigned to repository ${cfg.repositoryId}`, 'doi');
  if (cfg.store.get(doi)) throw fail(422, 'This DOI has already been taken', 'doi');
  return doi;
}

async function route(req: IncomingMessage, res: ServerResponse, cfg: DoiFakeConfig): Promise<void> {
  const url = new URL(req.url ?? '/', 'http://doi-fake.local');
  const method = req.method ?? 'GET';
  if (url.pathname === '/heartbeat' && (method === 'GET' || method === 'HEAD')) {
    res.writeHead(200, { 'Content-Type': 'text/plain' }).end('OK');
    return;
  }
  if (url.pathname !== '/dois' && !url.pathname.startsWith('/dois/')) throw fail(404, 'The resource you are looking for does not exist.');
  if (!authorised(req, cfg)) {
    res.setHeader('WWW-Authenticate', 'Basic realm="Ohmstead DOI fake"');
    throw fail(401, 'Bad credentials: use HTTP Basic with DOI_REPOSITORY_ID and DOI_PASSWORD');
  }
  if (url.pathname === '/dois' || url.pathname === '/dois/') {
    if (method === 'POST') {
      const attrs = await readAttributes(req);
      send(res, 201, { data: toResource(applyChange(cfg, newDoi(cfg, attrs), undefined, attrs)) });
    } else if (method === 'GET') {
      const prefix = url.searchParams.get('prefix')?.toLowerCase();
      const state = url.searchParams.get('state');
      const list = cfg.store.all().filter((r) => (!prefix || r.doi.startsWith(`${prefix}/`)) && (!state || r.state === state));
      send(res, 200, { data: list.map(toResource), meta: { total: list.length } });
    } else throw fail(405, `${method} is not allowed on /dois`);
    return;
  }
  const doi = normalizeDoi(decodeURIComponent(url.pathname.slice('/dois/'.length)));
  const record = cfg.store.get(doi);
  if (method === 'GET') {
    if (!record) throw fail(404, `DOI ${doi} not found`);
    send(res, 200, { data: toResource(record) });
  } else if (method === 'PUT') {
    const attrs = await readAttributes(req);
    if (typeof attrs.doi === 'string' && normalizeDoi(attrs.doi) !== doi) throw fail(422, 'attributes.doi differs from the DOI in the path', 'doi');
    // PUT on an unknown DOI creates it, as the agency's API does (from memory).
    const target = record ? doi : newDoi(cfg, { ...attrs, doi });
    send(res, record ? 200 : 201, { data: toResource(applyChange(cfg, target, record, attrs)) });
  } else if (method === 'DELETE') {
    if (!record) throw fail(404, `DOI ${doi} not found`);
    if (record.state !== 'draft') throw fail(405, `only draft DOIs can be deleted; ${doi} is ${record.state}`, 'state');
    cfg.store.delete(doi);
    send(res, 204);
  } else throw fail(405, `${method} is not allowed on /dois/{doi}`);
}

export function createDoiHandler(cfg: DoiFakeConfig) {
  return (req: IncomingMessage, res: ServerResponse): void => {
    route(req, res, cfg).catch((error: unknown) => {
      if (error instanceof HttpError) send(res, error.status, { errors: error.errors });
      else {
        console.error('doi fake error:', error);
        send(res, 500, { errors: [{ status: '500', title: 'internal error in the DOI fake' }] });
      }
      console.log(`${new Date().toISOString()} ${req.method} ${req.url} -> ${res.statusCode}`);
    });
    res.once('finish', () => {
      if (res.statusCode < 400) console.log(`${new Date().toISOString()} ${req.method} ${req.url} -> ${res.statusCode}`);
    });
  };
}
