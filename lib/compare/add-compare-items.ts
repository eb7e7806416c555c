import 'server-only';
import { AppError } from '@/lib/errors';
import { validateWith } from '@/lib/validation/validate';
import schema from '@/schemas/api/compare-items.schema.json';
import { basketFullMessage, MAX_COMPARE_CURVES } from './basket-limits';
import { insertCompareItems, listCompareItems, type CompareItemRow } from './repo';
import { CurveUnavailable, resolveCurve } from './resolve-curves';
import type { CurveRef, CurveRefInput } from './types';

type UserLike = { id: string; siteRole: 'admin' | 'user' };
type Body = CurveRefInput & { items?: CurveRefInput[] };

export type AddedItem = { id: string; ref: CurveRef; addedAt: string; outcome: 'added' | 'present' };
export type AddCompareItemsResult = { items: AddedItem[]; rejected: { ref: CurveRefInput; message: string }[]; count: number; max: number };

const view = (item: CompareItemRow, outcome: 'added' | 'present'): AddedItem => ({
  id: item.id, outcome, addedAt: item.addedAt.toISOString(), ref: { versionId: item.versionId, fileId: item.fileId, x: item.x, y: item.y },
});

function parse(input: unknown): { refs: CurveRefInput[]; batch: boolean } {
  const parsed = validateWith<Body>(schema, input);
  if (!parsed.ok) throw new AppError('validation_failed', 'The curve reference has errors.', { fieldErrors: parsed.fieldErrors });
  const { items, ...single } = parsed.value;
  if (items && Object.keys(single).length > 0) {
    throw new AppError('validation_failed', 'Send either one curve or "items", not both.', { fieldErrors: { items: 'Send either one curve or "items", not both.' } });
  }
  return items ? { refs: items, batch: true } : { refs: [single], batch: false };
}

/**
 * Adds curves to the user's basket after checking the user may see them now ('view_curves'). One curve: refused
 * with its reason (404/403/422), or 409 when the basket is full. Several (merging a browser's basket): each is
 * added or rejected with its reason, up to the limit.
 */
export async function addCompareItems(args: { user: UserLike; input: unknown }): Promise<AddCompareItemsResult> {
  const { refs, batch } = parse(args.input);
  const resolved: CurveRef[] = [];
  const rejected: AddCompareItemsResult['rejected'] = [];
  for (const ref of refs) {
    try {
      const entry = await resolveCurve(args.user, ref);
      if (entry.ref) resolved.push(entry.ref);
    } catch (error) {
      if (!batch || !(error instanceof CurveUnavailable)) throw error;
      rejected.push({ ref, message: error.message });
    }
  }
  const outcomes = await insertCompareItems(args.user.id, resolved, MAX_COMPARE_CURVES);
  const items: AddedItem[] = [];
  outcomes.forEach((o, i) => {
    if (o.outcome === 'full') rejected.push({ ref: resolved[i], message: basketFullMessage() });
    else items.push(view(o.item, o.outcome));
  });
  if (!batch && items.length === 0) throw new AppError('conflict', basketFullMessage(), { max: MAX_COMPARE_CURVES });
  return { items, rejected, count: (await listCompareItems(args.user.id)).length, max: MAX_COMPARE_CURVES };
}
