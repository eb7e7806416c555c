import type { Denial, DenialCode } from './types';

export type DenialStatus = 401 | 403 | 404;

/** HTTP status for each refusal; not_found hides existence, the rest say "you may not". */
export const DENIAL_STATUS: Readonly<Record<DenialCode, DenialStatus>> = {
  not_signed_in: 401,
  forbidden: 403,
  not_found: 404,
  embargoed: 403,
  link_expired: 403,
  link_revoked: 403,
  wrong_state: 403,
};

/** Thrown by assertAllowed; the message is the plain-language reason, safe to show. */
export class AccessDeniedError extends Error {
  readonly code: DenialCode;
  readonly status: DenialStatus;

  constructor(denial: Pick<Denial, 'code' | 'reason'>) {
    super(denial.reason);
    this.name = 'AccessDeniedError';
    this.code = denial.code;
    this.status = DENIAL_STATUS[denial.code];
  }
}
