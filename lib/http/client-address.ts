// The client's address for per-address limits, sign-in throttling and COUNTER sessions. Pure: headers in, address out.
//
// Each reverse proxy in front of the app appends the address it saw to X-Forwarded-For (nginx
// $proxy_add_x_forwarded_for, RFC 7239 §5.2 for the standard Forwarded header), and Next's own server fills the header
// with the socket address only when it is absent. Entries left of the ones our proxies added are whatever the client
// sent, so the leftmost entry must never be trusted: with TRUSTED_PROXY_HOPS = N (default 1) the client is the N-th
// entry from the right. Common practice (the "trust proxy" hop count of most web frameworks).

export const DEFAULT_TRUSTED_PROXY_HOPS = 1;

type HeaderSource = Headers | Record<string, unknown> | undefined;

function header(source: HeaderSource, name: string): string | undefined {
  if (!source) return undefined;
  if (source instanceof Headers) return source.get(name) ?? undefined;
  const value = source[name];
  return typeof value === 'string' ? value : Array.isArray(value) ? value.join(',') : undefined;
}

/** TRUSTED_PROXY_HOPS from the environment (schemas/env.schema.json), else the default of one proxy. */
export function trustedProxyHops(value = process.env.TRUSTED_PROXY_HOPS): number {
  const n = Number(value);
  return value !== undefined && value !== '' && Number.isInteger(n) && n >= 1 ? n : DEFAULT_TRUSTED_PROXY_HOPS;
}

/** The address the outermost trusted proxy saw, else X-Real-IP, else null. */
export function clientAddress(source: HeaderSource, hops = trustedProxyHops()): string | null {
  const entries = (header(source, 'x-forwarded-for') ?? '').split(',').map((s) => s.trim()).filter(Boolean);
  // Fewer entries than proxies: the request did not come through all of them; the leftmost is the closest we have.
  const picked = entries.length ? entries[Math.max(0, entries.length - hops)] : undefined;
  return picked || header(source, 'x-real-ip')?.trim() || null;
}
