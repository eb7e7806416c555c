import type { FileView } from '@/lib/client/uploads/types';
import type { FileSummary } from '@/lib/transport/summary/types';
import type { FileAnalysis } from './use-file-analyses';

/** One file's summary as the panels use it: the server's full analysis, or the browser's instant preview. */
export type SummarySource = {
  key: string;
  label: string;
  summary: FileSummary;
  origin: 'server' | 'local';
  /** Shown beside the panels: where the numbers come from and whether they are about to change. */
  note?: string;
  updating: boolean;
};

export type LocalPreviewEntry = { name: string; summary: FileSummary | null; wholeFile: boolean; error?: string };

/** Server analyses first; a local preview stands in until its file has an analysis of its own. */
export function summarySources(files: FileView[], analyses: Record<string, FileAnalysis>, local: LocalPreviewEntry[]): SummarySource[] {
  const server: SummarySource[] = files.flatMap((f) => {
    const a = analyses[f.id];
    if (!a?.summary) return [];
    const updating = a.state === 'queued' || a.state === 'running';
    return [{
      key: f.id,
      label: f.name,
      summary: a.summary,
      origin: 'server' as const,
      updating,
      note: updating ? 'Being analysed again with your latest changes; the numbers below are from the previous analysis.' : undefined,
    }];
  });
  const named = new Set(server.map((s) => s.label));
  const instant: SummarySource[] = local.flatMap((p) => {
    if (!p.summary || named.has(p.name)) return [];
    return [{
      key: `local:${p.name}`,
      label: `${p.name} (instant preview)`,
      summary: p.summary,
      origin: 'local' as const,
      updating: false,
      note: p.wholeFile
        ? 'Instant preview of the whole file, read in your browser; the analysis on the server replaces it once the upload is verified.'
        : 'Instant preview of the first 256 KiB, read in your browser; the full analysis on the server replaces it once the upload is verified.',
    }];
  });
  return [...server, ...instant];
}
