// The one error type that crosses layers; lib/http maps its code to an HTTP status.
export type ErrorCode =
  | 'validation_failed'
  | 'not_signed_in'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'rate_limited'
  | 'payload_too_large'
  | 'service_unavailable'
  | 'internal';

export const STATUS_BY_CODE: Record<ErrorCode, number> = {
  validation_failed: 422,
  not_signed_in: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  rate_limited: 429,
  service_unavailable: 503,
  internal: 500,
};

export type FieldErrors = Record<string, string>;

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: { fieldErrors?: FieldErrors; [key: string]: unknown },
  ) {
    super(message);
    this.name = 'AppError';
  }

  get status(): number {
    return STATUS_BY_CODE[this.code];
  }
}
