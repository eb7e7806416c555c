// The `curves` query parameter of GET /api/v1/compare/curves: a JSON array of curve references (a browser's basket).
import { AppError } from '@/lib/errors';
import { validateWith } from '@/lib/validation/validate';
import schema from '@/schemas/api/compare-items.schema.json';
import { MAX_COMPARE_CURVES } from './basket-limits';
import type { CurveRefInput } from './types';

const fail = (message: string) => new AppError('validation_failed', message, { fieldErrors: { curves: message } });

export function parseCurveRefs(param: string | null): CurveRefInput[] {
  if (param === null || param === '') return [];
  if (param.length > 8192) throw fail('The curves parameter is too long.');
  let list: unknown;
  try {
    list = JSON.parse(param);
  } catch {
    throw fail('The curves parameter must be a JSON array of {versionId, fileId, x, y}.');
  }
  if (!Array.isArray(list) || list.length === 0) throw fail('The curves parameter must be a non-empty JSON array.');
  if (list.length > MAX_COMPARE_CURVES) throw fail(`At most ${MAX_COMPARE_CURVES} curves can be compared at once.`);
  const checked = validateWith<{ items: CurveRefInput[] }>(schema, { items: list });
  if (!checked.ok) throw new AppError('validation_failed', 'A curve reference has errors.', { fieldErrors: checked.fieldErrors });
  return checked.value.items;
}
