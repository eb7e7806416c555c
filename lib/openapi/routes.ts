// The one list of /api/v1 operations the OpenAPI document and the API page are built from. tests/unit/openapi
// fails when a route.ts exports a method that is not listed here, or this lists one that no route.ts exports.
import { DEPOSIT_OPERATIONS } from './routes-deposit';
import { GROUP_OPERATIONS } from './routes-groups';
import { PUBLISHING_OPERATIONS } from './routes-publishing';
import { REUSE_OPERATIONS } from './routes-reuse';
import type { OperationSpec } from './types';

export const OPERATIONS: readonly OperationSpec[] = [...DEPOSIT_OPERATIONS, ...PUBLISHING_OPERATIONS, ...REUSE_OPERATIONS, ...GROUP_OPERATIONS];
