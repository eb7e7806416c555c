import 'server-only';
import { randomUUID } from 'node:crypto';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log';

export type ApiErrorBody = { error: { code: string; message: string; details?: unknown; requestId: string } };

type Handler<C> = (req: Request, ctx: C & { requestId: string }) => Promise<Response>;

/** Wraps a route handler: request id, JSON errors `{ error: { code, message, details } }`, no stack traces to clients. */
export function route<C>(handler: Handler<C>): (req: Request, ctx: C) => Promise<Response> {
  return async (req, ctx) => {
    const requestId = req.headers.get('x-request-id') ?? randomUUID();
    try {
      const response = await handler(req, { ...ctx, requestId });
      response.headers.set('x-request-id', requestId);
      return response;
    } catch (error) {
      return errorResponse(error, requestId, req);
    }
  };
}

export function errorResponse(error: unknown, requestId: string, req?: Request): Response {
  const known = error instanceof AppError ? error : toAppError(error);
  if (known.code === 'internal') {
    log('error', 'unhandled error', { requestId, path: req ? new URL(req.url).pathname : undefined, error: error instanceof Error ? error.stack : String(error) });
  }
  const body: ApiErrorBody = { error: { code: known.code, message: known.message, details: known.details, requestId } };
  const headers: Record<string, string> = { 'x-request-id': requestId };
  // RFC 9110 §10.2.3: a 429 says when to come back.
  const retry = known.details?.retryAfterSeconds;
  if (known.code === 'rate_limited' && typeof retry === 'number') headers['retry-after'] = String(retry);
  return Response.json(body, { status: known.status, headers });
}

function toAppError(error: unknown): AppError {
  const maybe = error as { status?: number; code?: string; message?: string } | null;
  // lib/access denials carry a status and a safe message.
  if (maybe && typeof maybe.status === 'number' && [401, 403, 404].includes(maybe.status) && maybe.message) {
    const code = maybe.status === 401 ? 'not_signed_in' : maybe.status === 403 ? 'forbidden' : 'not_found';
    return new AppError(code, maybe.message);
  }
  return new AppError('internal', 'Something went wrong on our side. Try again; if it persists, tell the site admin the request id.');
}

export async function readJson(req: Request): Promise<unknown> {
  try {
    return await req.json();
  } catch {
    throw new AppError('validation_failed', 'The request body is not valid JSON.');
  }
}
