import 'server-only';
import { env } from '@/lib/env';

// Client for the registration agency's JSON:API (the DOI fake in development and tests).

export type DoiState = 'draft' | 'registered' | 'findable';
export type RemoteDoi = { doi: string; state: DoiState; created: string | null; updated: string | null; attributes: Record<string, unknown> };

export type DoiClientOptions = {
  /** Base URL of the API; defaults to DOI_API_URL. */
  apiUrl?: string;
  repositoryId?: string;
  password?: string;
  timeoutMs?: number;
};

export type DoiClient = {
  /** Creates `doi` as a draft. A DOI that already exists at the agency counts as done (replays are safe). */
  createDraft(doi: string, attributes?: Record<string, unknown>): Promise<RemoteDoi & { createdNow: boolean }>;
  get(doi: string): Promise<RemoteDoi | null>;
};

/** The agency could not be reached or refused the request; `status` is null when no HTTP answer came back. */
export class DoiServiceError extends Error {
  constructor(message: string, readonly status: number | null) {
    super(message);
    this.name = 'DoiServiceError';
  }
}

const JSON_API = 'application/vnd.api+json';
type Doc = { data?: { id: string; attributes: Record<string, unknown> }; errors?: { title?: string }[] };

function toRemote(doc: Doc): RemoteDoi {
  const a = doc.data?.attributes ?? {};
  return {
    doi: String(doc.data?.id ?? ''),
    state: a.state as DoiState,
    created: typeof a.created === 'string' ? a.created : null,
    updated: typeof a.updated === 'string' ? a.updated : null,
    attributes: a,
  };
}

export function doiClient(options: DoiClientOptions = {}): DoiClient {
  const settings = () => {
    const e = options.apiUrl && options.repositoryId && options.password ? undefined : env();
    return {
      apiUrl: options.apiUrl ?? e!.DOI_API_URL,
      auth: `Basic ${Buffer.from(`${options.repositoryId ?? e!.DOI_REPOSITORY_ID}:${options.password ?? e!.DOI_PASSWORD}`).toString('base64')}`,
    };
  };

  async function call(method: string, path: string, attributes?: Record<string, unknown>): Promise<{ status: number; doc: Doc }> {
    const { apiUrl, auth } = settings();
    let response: Response;
    try {
      response = await fetch(new URL(path, apiUrl), {
        method,
        headers: { Accept: JSON_API, 'Content-Type': JSON_API, Authorization: auth },
        body: attributes ? JSON.stringify({ data: { type: 'dois', attributes } }) : undefined,
        signal: AbortSignal.timeout(options.timeoutMs ?? 10_000),
        cache: 'no-store',
      });
    } catch (error) {
      const cause = (error as { cause?: { code?: string } }).cause?.code ?? (error as Error).name;
      throw new DoiServiceError(`The DOI registration service at ${new URL(apiUrl).origin} is unreachable (${cause}).`, null);
    }
    const text = await response.text();
    let doc: Doc = {};
    try {
      doc = text ? (JSON.parse(text) as Doc) : {};
    } catch {
      doc = {};
    }
    return { status: response.status, doc };
  }

  const refusal = (what: string, status: number, doc: Doc) =>
    new DoiServiceError(`The DOI registration service refused to ${what} (HTTP ${status}: ${(doc.errors ?? []).map((e) => e.title).join('; ') || 'no reason given'}).`, status);

  async function get(doi: string): Promise<RemoteDoi | null> {
    const { status, doc } = await call('GET', `/dois/${encodeURIComponent(doi)}`);
    if (status === 404) return null;
    if (status !== 200) throw refusal(`read ${doi}`, status, doc);
    return toRemote(doc);
  }

  return {
    get,
    async createDraft(doi, attributes = {}) {
      const { status, doc } = await call('POST', '/dois', { ...attributes, doi });
      if (status === 201) return { ...toRemote(doc), createdNow: true };
      // 422 "already taken" after a lost reply or a replayed job: the DOI exists, which is what we wanted.
      if (status === 422) {
        const existing = await get(doi);
        if (existing) return { ...existing, createdNow: false };
      }
      throw refusal(`create the draft DOI ${doi}`, status, doc);
    },
  };
}
