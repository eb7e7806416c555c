// Public entry point of the access rules; pure TypeScript, safe for server and client code.
export * from './types';
export { ACTION_DESCRIPTIONS, ACTION_LABELS } from './actions';
export { PERMISSIONS, PHASES, PRINCIPALS, ACTION_REQUIREMENTS, type Phase, type Principal } from './permissions';
export { embargoEndsAt, formatEmbargoDate, isEmbargoed } from './embargo';
export { AccessDeniedError, DENIAL_STATUS, type DenialStatus } from './errors';
export { allowedActions, assertAllowed, can, decide, NOT_FOUND_REASON, phaseOf, principalsOf } from './decide';
export { ACCESS_MATRIX_DOC, renderAccessMatrix } from './matrix-doc';
