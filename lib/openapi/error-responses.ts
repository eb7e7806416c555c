// The refusals every route shares, once as components/responses, and which of them an operation can give.
import type { JsonObject } from './embed-schemas';
import type { AuthMode, ErrorStatus } from './types';

const ERROR_SCHEMA = { $ref: '#/components/schemas/Error' };

/** Limits as lib/tokens/api-rate-limit.ts sets them (tests/unit/openapi compares). */
export const DOCUMENTED_LIMITS = { perTokenPerMinute: 600, perAddressPerMinute: 120 };

const COMPONENT_BY_STATUS: Record<ErrorStatus | 500, { name: string; code: string; description: string }> = {
  400: { name: 'BadRequest', code: 'validation_failed', description: 'The query parameters are malformed (details.fieldErrors).' },
  401: { name: 'NotSignedIn', code: 'not_signed_in', description: 'No session and no valid token, or the Bearer token is unknown, revoked or expired.' },
  403: { name: 'Forbidden', code: 'forbidden', description: 'Signed in, but not allowed; for a token without the needed scope details.requiredScope names it.' },
  404: { name: 'NotFound', code: 'not_found', description: 'Not found, or hidden from you (the two answer alike).' },
  409: { name: 'Conflict', code: 'conflict', description: 'The thing is not in a state that allows this now.' },
  413: { name: 'PayloadTooLarge', code: 'payload_too_large', description: 'The body or the file is over a limit; nothing was saved.' },
  422: { name: 'ValidationFailed', code: 'validation_failed', description: 'The body does not fit its schema, or a value is out of range (details.fieldErrors).' },
  429: {
    name: 'RateLimited', code: 'rate_limited',
    description: `Too many requests: ${DOCUMENTED_LIMITS.perTokenPerMinute} a minute per token, ${DOCUMENTED_LIMITS.perAddressPerMinute} a minute per address without a valid token. Retry-After says when to come back.`,
  },
  503: { name: 'ServiceUnavailable', code: 'service_unavailable', description: 'Object storage (or another service) is not reachable; nothing was lost, try again.' },
  500: { name: 'InternalError', code: 'internal', description: 'Something failed on the server; quote error.requestId to the site admin.' },
};

export function errorComponentName(status: ErrorStatus | 500): string {
  return COMPONENT_BY_STATUS[status].name;
}

/** components.responses: one entry per refusal, each with the Error body (and Retry-After on 429). */
export function errorResponseComponents(): Record<string, JsonObject> {
  const out: Record<string, JsonObject> = {};
  for (const { name, description } of Object.values(COMPONENT_BY_STATUS)) {
    const response: JsonObject = { description, content: { 'application/json': { schema: ERROR_SCHEMA } } };
    if (name === 'RateLimited') {
      response.headers = { 'Retry-After': { description: 'Seconds until the current one-minute window closes.', schema: { type: 'integer', minimum: 1 } } };
    }
    out[name] = response;
  }
  return out;
}

const AUTO_401: Record<Exclude<AuthMode, 'none'>, string> = {
  required: 'Not signed in, or the token is unknown, revoked or expired.',
  optional: 'The Bearer token is unknown, revoked or expired (callers without one are served as anonymous).',
  session: 'No browser session.',
};

/**
 * The refusals of one operation, each with its reason: the route's own, plus 401 and 429 for every route that reads
 * the caller, a 403 for tokens without the needed scope, and 500 for every route.
 */
export function operationErrors(auth: AuthMode, scope: string | null, own: Partial<Record<ErrorStatus, string>> = {}): Map<ErrorStatus | 500, string | undefined> {
  const errors = new Map<ErrorStatus | 500, string | undefined>();
  const add = (status: ErrorStatus | 500, reason: string | undefined) => errors.set(status, reason);
  if (auth !== 'none') add(401, own[401] ?? AUTO_401[auth]);
  for (const [status, reason] of Object.entries(own)) if (Number(status) !== 401 && Number(status) !== 429) add(Number(status) as ErrorStatus, reason);
  if ((auth === 'required' || auth === 'optional') && scope && scope !== 'read') {
    const scopeReason = `A token without the ${scope} scope.`;
    add(403, own[403] ? `${own[403]} ${scopeReason}` : scopeReason);
  }
  if (own[429]) add(429, `${own[429]} Or over the per-token or per-address limit.`);
  else if (auth !== 'none') add(429, undefined);
  add(500, undefined);
  return new Map([...errors.entries()].sort(([a], [b]) => a - b));
}
