import 'server-only';
import { DoiServiceError, type DoiClientOptions, type DoiState } from '@/lib/doi/client';
import { env } from '@/lib/env';

// Registration calls of the agency's JSON:API (PUT /dois/{doi}); lib/doi/client.ts covers draft creation.
// PUT of a DOI that exists updates it, so a replayed job never creates a second DOI.

export type DoiEvent = 'publish' | 'register' | 'hide';

export type DoiRegistrar = {
  /** Creates or updates `doi` with these attributes (and the event, if any); returns the state the agency reports. */
  put(doi: string, attributes: Record<string, unknown>, event?: DoiEvent): Promise<DoiState>;
  /** The agency's state for `doi`, or null when it does not know it. */
  state(doi: string): Promise<DoiState | null>;
};

const JSON_API = 'application/vnd.api+json';

export function doiRegistrar(options: DoiClientOptions = {}): DoiRegistrar {
  const settings = () => {
    const e = options.apiUrl && options.repositoryId && options.password ? undefined : env();
    const id = options.repositoryId ?? e!.DOI_REPOSITORY_ID;
    return { apiUrl: options.apiUrl ?? e!.DOI_API_URL, auth: `Basic ${Buffer.from(`${id}:${options.password ?? e!.DOI_PASSWORD}`).toString('base64')}` };
  };

  async function call(method: 'GET' | 'PUT', doi: string, body?: unknown): Promise<{ status: number; doc: Record<string, unknown> }> {
    const { apiUrl, auth } = settings();
    let response: Response;
    try {
      response = await fetch(new URL(`/dois/${encodeURIComponent(doi)}`, apiUrl), {
        method,
        headers: { Accept: JSON_API, 'Content-Type': JSON_API, Authorization: auth },
        body: body === undefined ? undefined : JSON.stringify(body),
        signal: AbortSignal.timeout(options.timeoutMs ?? 15_000),
        cache: 'no-store',
      });
    } catch (error) {
      const cause = (error as { cause?: { code?: string } }).cause?.code ?? (error as Error).name;
      throw new DoiServiceError(`The DOI registration service at ${new URL(apiUrl).origin} is unreachable (${cause}).`, null);
    }
    const text = await response.text();
    let doc: Record<string, unknown> = {};
    try {
      doc = text ? (JSON.parse(text) as Record<string, unknown>) : {};
    } catch {
      doc = {};
    }
    return { status: response.status, doc };
  }

  const stateOf = (doc: Record<string, unknown>) => ((doc.data as { attributes?: { state?: DoiState } } | undefined)?.attributes?.state ?? 'draft');
  const reasons = (doc: Record<string, unknown>) =>
    ((doc.errors as { source?: string; title?: string }[] | undefined) ?? []).map((e) => (e.source ? `${e.source}: ${e.title}` : e.title)).join('; ');

  return {
    async put(doi, attributes, event) {
      const body = { data: { type: 'dois', id: doi, attributes: { ...attributes, doi, ...(event ? { event } : {}) } } };
      const { status, doc } = await call('PUT', doi, body);
      if (status === 200 || status === 201) return stateOf(doc);
      throw new DoiServiceError(`The DOI registration service refused to update ${doi} (HTTP ${status}: ${reasons(doc) || 'no reason given'}).`, status);
    },
    async state(doi) {
      const { status, doc } = await call('GET', doi);
      if (status === 404) return null;
      if (status !== 200) throw new DoiServiceError(`The DOI registration service refused to read ${doi} (HTTP ${status}: ${reasons(doc) || 'no reason given'}).`, status);
      return stateOf(doc);
    },
  };
}
