// The compare basket from the browser: the account's basket through /api/v1/compare, or, for visitors who are not
// signed in, curve references kept in localStorage (resolved by the server each time, so access is checked now).
import { MAX_COMPARE_CURVES, basketFullMessage } from '@/lib/compare/basket-limits';
import type { CurveRef, CurveRefInput, ResolvedBasket } from '@/lib/compare/types';

const STORAGE_KEY = 'ohmstead.compare.v1';
/** Fired on window when the browser basket changes, so open views can follow. */
export const BASKET_EVENT = 'ohmstead:compare-basket';

export class CompareApiError extends Error {
  constructor(readonly status: number, readonly code: string, message: string) {
    super(message);
    this.name = 'CompareApiError';
  }
}

async function call<T>(method: string, path: string, body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: body === undefined ? { accept: 'application/json' } : { accept: 'application/json', 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new CompareApiError(0, 'network', 'Ohmstead could not be reached. Check your connection and try again.');
  }
  if (res.ok) return (await res.json()) as T;
  let error: { code?: string; message?: string } | undefined;
  try {
    error = ((await res.json()) as { error?: { code?: string; message?: string } }).error;
  } catch {
    error = undefined;
  }
  throw new CompareApiError(res.status, error?.code ?? `http_${res.status}`, error?.message ?? `The request failed (HTTP ${res.status}).`);
}

export type AccountBasket = ResolvedBasket & { max: number };
export type AddResult = { items: { id: string; ref: CurveRef; outcome: 'added' | 'present' }[]; rejected: { ref: CurveRefInput; message: string }[]; count: number; max: number };

export const fetchAccountBasket = () => call<AccountBasket>('GET', '/api/v1/compare/items');
export const addToAccount = (input: CurveRefInput | { items: CurveRefInput[] }) => call<AddResult>('POST', '/api/v1/compare/items', input);
export const removeFromAccount = (id: string) => call<{ removed: number }>('DELETE', `/api/v1/compare/items?id=${encodeURIComponent(id)}`);
export const emptyAccountBasket = () => call<{ removed: number }>('DELETE', '/api/v1/compare/items?all=true');

/** Resolves references for whoever is asking (anonymous visitors included): entries, and the unavailable ones with reasons. */
export function resolveRefs(refs: CurveRefInput[]): Promise<ResolvedBasket> {
  if (refs.length === 0) return Promise.resolve({ entries: [], unavailable: [] });
  return call<ResolvedBasket>('GET', `/api/v1/compare/curves?curves=${encodeURIComponent(JSON.stringify(refs))}`);
}

const sameCurve = (a: CurveRef, b: CurveRef) => a.fileId === b.fileId && a.x === b.x && a.y === b.y;

function isRef(v: unknown): v is CurveRef {
  const r = v as CurveRef;
  return Boolean(r) && [r.versionId, r.fileId, r.x, r.y].every((s) => typeof s === 'string' && s !== '');
}

/** The browser basket; an unreadable or foreign value counts as empty. */
export function readLocalBasket(): CurveRef[] {
  try {
    const parsed: unknown = JSON.parse(window.localStorage.getItem(STORAGE_KEY) ?? '[]');
    return Array.isArray(parsed) ? parsed.filter(isRef).slice(0, MAX_COMPARE_CURVES) : [];
  } catch {
    return [];
  }
}

function writeLocalBasket(refs: CurveRef[]): void {
  window.localStorage.setItem(STORAGE_KEY, JSON.stringify(refs));
  window.dispatchEvent(new Event(BASKET_EVENT));
}

/** Adds a resolved reference to the browser basket; throws the basket-full message past the limit. */
export function addToLocalBasket(ref: CurveRef): { outcome: 'added' | 'present'; count: number } {
  const refs = readLocalBasket();
  if (refs.some((r) => sameCurve(r, ref))) return { outcome: 'present', count: refs.length };
  if (refs.length >= MAX_COMPARE_CURVES) throw new CompareApiError(409, 'conflict', basketFullMessage());
  writeLocalBasket([...refs, ref]);
  return { outcome: 'added', count: refs.length + 1 };
}

export function removeFromLocalBasket(ref: CurveRef | CurveRefInput): void {
  writeLocalBasket(readLocalBasket().filter((r) => !(r.fileId === ref.fileId && r.x === ref.x && r.y === ref.y)));
}

export function clearLocalBasket(): void {
  writeLocalBasket([]);
}

/** Key a browser-basket entry the way resolveCurves keys references without an id. */
export const localKey = (ref: CurveRef) => `${ref.fileId}|${ref.x}|${ref.y}`;
