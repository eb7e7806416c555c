// Full-resolution data for the CSV export: stored files through GET /api/v1/files/:id/curve (streamed from storage
// through the parser on the server), dropped files from the table parsed in this browser.
import { optionFor } from '@/lib/compare/choose-axes';
import { extractCurve } from '@/lib/compare/extract-curve';
import type { FullCurves } from '@/lib/compare/build-csv';
import type { OverlaySettings } from '@/lib/compare/prepare-overlay';
import type { CompareEntry } from '@/lib/compare/types';
import type { ParsedTable } from '@/lib/transport/parse';

type CurveBody = { xs: number[]; ys: number[] };
type ErrorBody = { error?: { message?: string } };

async function fetchCurve(fileId: string, x: string, y: string): Promise<CurveBody> {
  const q = new URLSearchParams({ x, y });
  const res = await fetch(`/api/v1/files/${encodeURIComponent(fileId)}/curve?${q}`, { credentials: 'same-origin', headers: { accept: 'application/json' } });
  if (!res.ok) {
    const body = (await res.json().catch(() => ({}))) as ErrorBody;
    throw new Error(body.error?.message ?? `the server answered HTTP ${res.status}`);
  }
  return (await res.json()) as CurveBody;
}

export type FullCurvesResult = { full: Map<string, { x: ArrayLike<number>; y: ArrayLike<number> }>; problems: string[] };

/** Every entry's curve for the chosen quantities at full resolution; failures become problems, not exceptions. */
export async function loadFullCurves(
  entries: readonly CompareEntry[],
  tables: ReadonlyMap<string, ParsedTable>,
  settings: Pick<OverlaySettings, 'xKey' | 'yKey'>,
  onProgress: (done: number, total: number) => void,
): Promise<FullCurvesResult> {
  const full: FullCurvesResult['full'] = new Map();
  const problems: string[] = [];
  const todo = entries.map((entry, i) => ({ entry, number: i + 1, option: optionFor(entry, settings.xKey, settings.yKey) })).filter((t) => t.option);
  let done = 0;
  onProgress(0, todo.length);
  for (const { entry, number, option } of todo) {
    const { x, y } = { x: option!.x.column, y: option!.y.column };
    try {
      if (entry.ref) {
        const body = await fetchCurve(entry.ref.fileId, x, y);
        full.set(entry.key, { x: body.xs, y: body.ys });
      } else {
        const table = tables.get(entry.key);
        const curve = table ? extractCurve(table, undefined, x, y) : null;
        if (!curve) throw new Error('the file is no longer in this page; drop it again');
        full.set(entry.key, curve);
      }
    } catch (error) {
      problems.push(`Curve ${number}: ${error instanceof Error ? error.message : String(error)}`);
    }
    onProgress(++done, todo.length);
  }
  return { full, problems } satisfies { full: FullCurves; problems: string[] };
}
