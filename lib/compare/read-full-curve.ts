import 'server-only';
import { findAnalysis } from '@/lib/analysis/repo';
import { asFileSummary } from '@/lib/datasets/landing-curves';
import { AppError } from '@/lib/errors';
import type { TransportDatasetDraft } from '@/lib/schema';
import { defaultStore, ObjectMissingError, readObject, type ObjectStore } from '@/lib/storage/objects';
import { parseTransportTable, TransportParseError } from '@/lib/transport/parse';
import { fileGone, loadFileFor } from '@/lib/uploads/load-file';
import { columnOverrides, extractCurve } from './extract-curve';
import { fileStorageKey } from './repo';

type UserLike = { id: string; siteRole: 'admin' | 'user' } | null;

/** Most points one full-resolution curve may have: 2 million pairs are about 40 MB of JSON. */
export const MAX_FULL_CURVE_POINTS = 2_000_000;

export type FullCurveResult = { fileId: string; x: string; y: string; xUcum: string | null; yUcum: string | null; points: number; xs: Float64Array; ys: Float64Array };

const tooLarge = (points: number) =>
  new AppError(
    'payload_too_large',
    `This curve has ${points.toLocaleString('en')} points; full-resolution curves are served up to ${MAX_FULL_CURVE_POINTS.toLocaleString('en')} points. Download the file from the dataset page instead.`,
    { points, maxPoints: MAX_FULL_CURVE_POINTS },
  );

const asDraft = (metadata: unknown): TransportDatasetDraft | undefined =>
  metadata && typeof metadata === 'object' && !Array.isArray(metadata) ? (metadata as TransportDatasetDraft) : undefined;

/**
 * One curve of a stored file at full resolution, in SI: checks 'view_curves' on the file's version, streams the file
 * from storage through the transport parser with the version's column mapping, and takes the (x, y) curve the file
 * analysis names. Refuses (413) curves above MAX_FULL_CURVE_POINTS, before reading when the analysis already says so.
 */
export async function readFullCurve(args: { user: UserLike; fileId: string; x: string; y: string; store?: ObjectStore }): Promise<FullCurveResult> {
  if (!args.x || !args.y) throw new AppError('validation_failed', 'Name the curve with ?x=…&y=… (column names from the file analysis).', { fieldErrors: { x: 'Required.', y: 'Required.' } });
  const { file, ctx } = await loadFileFor(args.fileId, args.user, 'view_curves');
  const summary = asFileSummary((await findAnalysis(file.id))?.summary);
  const preview = summary?.previews.find((p) => p.x === args.x && p.y === args.y);
  if (!preview) throw new AppError('not_found', `This file's analysis has no curve ${args.y} against ${args.x}.`);
  if (preview.sourcePoints > MAX_FULL_CURVE_POINTS) throw tooLarge(preview.sourcePoints);
  const key = await fileStorageKey(file.id);
  if (!key) throw fileGone();
  const metadata = asDraft(ctx.version.metadata);
  let table;
  try {
    const read = await readObject(args.store ?? defaultStore(), key);
    table = await parseTransportTable(read.body, { columns: columnOverrides(metadata) });
  } catch (error) {
    if (error instanceof ObjectMissingError) throw fileGone();
    if (error instanceof TransportParseError) throw new AppError('conflict', `The file can no longer be read as a table: ${error.message}`);
    throw error;
  }
  const curve = extractCurve(table, metadata, args.x, args.y);
  if (!curve) throw new AppError('conflict', `The file no longer yields the curve ${args.y} against ${args.x}; its analysis may be out of date.`);
  if (curve.x.length > MAX_FULL_CURVE_POINTS) throw tooLarge(curve.x.length);
  return { fileId: file.id, x: args.x, y: args.y, xUcum: curve.xUcum, yUcum: curve.yUcum, points: curve.x.length, xs: curve.x, ys: curve.y };
}
