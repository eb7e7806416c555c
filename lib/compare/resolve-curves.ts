import 'server-only';
import { AccessDeniedError } from '@/lib/access';
import { asFileSummary } from '@/lib/datasets/landing-curves';
import { listFileSummaries, listLandingFiles } from '@/lib/datasets/repo-landing';
import { requireVersionAction } from '@/lib/datasets/version-access';
import { AppError, type ErrorCode } from '@/lib/errors';
import { findFileRow } from '@/lib/uploads/repo';
import { defaultCurveIndex } from './default-curve';
import { curveOption } from './quantities';
import type { CompareEntry, CurveOption, CurveRefInput, ResolvedBasket } from './types';

type UserLike = { id: string; siteRole: 'admin' | 'user' } | null;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const NOT_FOUND = 'We could not find this curve, or you do not have access to it.';

/** Why a reference cannot be shown, as an AppError (status and a message safe to show). */
export class CurveUnavailable extends AppError {
  constructor(code: ErrorCode, message: string, details?: Record<string, unknown>) {
    super(code, message, details);
    this.name = 'CurveUnavailable';
  }
}

function refusal(error: unknown): CurveUnavailable {
  if (error instanceof AccessDeniedError) {
    const code: ErrorCode = error.status === 401 ? 'not_signed_in' : error.status === 404 ? 'not_found' : 'forbidden';
    return new CurveUnavailable(code, error.message, { denial: error.code });
  }
  if (error instanceof AppError) return new CurveUnavailable(error.code, error.message);
  throw error;
}

type FileCurves = { fileId: string; fileName: string; options: CurveOption[] };

async function curvesOf(files: { id: string; name: string }[]): Promise<FileCurves[]> {
  const stored = await listFileSummaries(files.map((f) => f.id));
  return files.flatMap((f) => {
    const summary = asFileSummary(stored.get(f.id));
    return summary ? [{ fileId: f.id, fileName: f.name, options: summary.previews.map((p) => curveOption(p, summary.columns)) }] : [];
  });
}

/**
 * One basket reference as a plottable entry, checked against lib/access ('view_curves') for this user now. A version
 * alone takes its main curve (see default-curve.ts); a file alone that file's. Throws CurveUnavailable otherwise.
 */
export async function resolveCurve(user: UserLike, ref: CurveRefInput, key?: string): Promise<CompareEntry> {
  if ((ref.fileId && !UUID.test(ref.fileId)) || (ref.versionId && !UUID.test(ref.versionId))) throw new CurveUnavailable('not_found', NOT_FOUND);
  const file = ref.fileId ? await findFileRow(ref.fileId) : undefined;
  if (ref.fileId && (!file || file.upload_state !== 'verified')) throw new CurveUnavailable('not_found', NOT_FOUND);
  if (file && ref.versionId && file.version_id !== ref.versionId) throw new CurveUnavailable('not_found', NOT_FOUND);
  const versionId = file?.version_id ?? ref.versionId;
  if (!versionId) throw new CurveUnavailable('validation_failed', 'Name a dataset version or a file to compare.', { fieldErrors: { versionId: 'This field is required.' } });
  const { version } = await requireVersionAction(versionId, user, 'view_curves').catch((e: unknown) => Promise.reject(refusal(e)));
  const files = await curvesOf(file ? [{ id: file.id, name: file.name }] : await listLandingFiles(versionId));
  let pick: { f: FileCurves; i: number } | undefined;
  if (ref.x !== undefined && ref.y !== undefined) {
    for (const f of files) {
      const i = f.options.findIndex((o) => o.x.column === ref.x && o.y.column === ref.y);
      if (i >= 0) pick ??= { f, i };
    }
    if (!pick) throw new CurveUnavailable('not_found', `The curve ${ref.y} against ${ref.x} is not in this file's analysis (any more).`);
  } else {
    const all = files.flatMap((f) => f.options.map((o, i) => ({ f, i, o })));
    pick = all[defaultCurveIndex(all.map((c) => c.o))];
    if (!pick) throw new CurveUnavailable('validation_failed', 'This dataset version has no analysed curve to compare yet.');
  }
  const chosen = pick.f.options[pick.i];
  return {
    key: key ?? `${pick.f.fileId}|${chosen.x.column}|${chosen.y.column}`,
    ref: { versionId: version.id, fileId: pick.f.fileId, x: chosen.x.column, y: chosen.y.column },
    source: {
      datasetId: version.dataset_id, versionId: version.id, versionNumber: Number(version.version_number), title: version.title, doi: version.doi,
      group: { slug: version.group_slug, name: version.group_name }, fileName: pick.f.fileName,
    },
    chosen: { x: chosen.x.column, y: chosen.y.column },
    options: pick.f.options,
  };
}

/** Many references (a basket): the ones that resolve, and the others with the reason, in the given order. */
export async function resolveCurves(user: UserLike, refs: { key?: string; ref: CurveRefInput }[]): Promise<ResolvedBasket> {
  const out: ResolvedBasket = { entries: [], unavailable: [] };
  for (const { key, ref } of refs) {
    try {
      out.entries.push(await resolveCurve(user, ref, key));
    } catch (error) {
      if (!(error instanceof CurveUnavailable)) throw error;
      out.unavailable.push({ key: key ?? `${ref.fileId ?? ref.versionId ?? '?'}|${ref.x ?? ''}|${ref.y ?? ''}`, ref, message: error.message });
    }
  }
  return out;
}
