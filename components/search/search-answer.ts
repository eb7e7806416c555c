// What the search API answered for one search key, and the page's memory of those answers: a search seen once comes
// back at once on Back and Forward. Browser state lives in this module only on the client (the server page never
// writes to it, so no answer can cross between two visitors).
import type { FieldErrors } from '@/lib/errors';
import type { SearchResult } from '@/lib/search/types';

/** A page of results, or the reason the query cannot be run (the API's 400, in plain words) with its field errors. */
export type SearchAnswer =
  | { kind: 'result'; result: SearchResult }
  | { kind: 'problem'; message: string; fieldErrors: FieldErrors };

/** One message out of an error and its field errors, e.g. "A range in the search has its ends swapped. The lowest …". */
export function problemAnswer(message: string, fieldErrors: FieldErrors | undefined): SearchAnswer {
  const details = Object.values(fieldErrors ?? {}).filter((t) => typeof t === 'string' && t !== '' && t !== message);
  return { kind: 'problem', message: [message, ...details].join(' '), fieldErrors: fieldErrors ?? {} };
}

/** Thrown when the API cannot answer (network down, 5xx, 429): the page keeps the results it has and says why. */
export class SearchFetchError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SearchFetchError';
  }
}

type ErrorBody = { error?: { message?: unknown; details?: { fieldErrors?: FieldErrors } } };

/** Plain words for an answer that is neither results nor a query problem. */
export function failureText(status: number, body: unknown): string {
  const message = (body as ErrorBody | null)?.error?.message;
  if (status === 429 && typeof message === 'string') return message;
  if (status >= 500) return `The search service did not answer (HTTP ${status}). Try again in a moment.`;
  return typeof message === 'string' ? message : `The search could not be run (HTTP ${status}).`;
}

/** GET /api/v1/search with the search's canonical query; a 400 is an answer (the query's problem), other errors throw. */
export async function fetchSearchAnswer(key: string, signal: AbortSignal): Promise<SearchAnswer> {
  let response: Response;
  try {
    response = await fetch(key ? `/api/v1/search?${key}` : '/api/v1/search', { signal, headers: { accept: 'application/json' }, cache: 'no-store' });
  } catch (error) {
    if (signal.aborted) throw error;
    throw new SearchFetchError('The server could not be reached. Check the connection and try again.');
  }
  const body: unknown = await response.json().catch(() => null);
  if (response.ok && body && typeof body === 'object' && Array.isArray((body as SearchResult).hits)) return { kind: 'result', result: body as SearchResult };
  if (response.status === 400) {
    const error = (body as ErrorBody | null)?.error;
    return problemAnswer(typeof error?.message === 'string' ? error.message : 'Some search parameters are not valid.', error?.details?.fieldErrors);
  }
  throw new SearchFetchError(response.ok ? 'The search service sent an answer the page cannot read. Try again.' : failureText(response.status, body));
}

// Answers by search key, most recently used last; a few dozen searches are plenty for Back and Forward.
const LIMIT = 40;
const answers = new Map<string, SearchAnswer>();
const listeners = new Set<() => void>();

export function rememberAnswer(key: string, answer: SearchAnswer): void {
  answers.delete(key);
  answers.set(key, answer);
  while (answers.size > LIMIT) answers.delete(answers.keys().next().value as string);
  for (const listener of listeners) listener();
}

export function knownAnswer(key: string): SearchAnswer | undefined {
  return answers.get(key);
}

export function subscribeAnswers(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}
