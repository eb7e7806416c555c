'use client';

import { useCallback, useEffect, useState } from 'react';
import type { FileView } from '@/lib/client/uploads/types';
import type { FileSummary } from '@/lib/transport/summary/types';

export type FileAnalysis = {
  state: FileView['analysisState'];
  progress: number;
  error: string | null;
  summary: FileSummary | null;
  /** Set when the analysis could not be fetched (not an analysis failure). */
  loadError?: string;
};

const POLL_MS = 1500; // the worker writes progress at most once a second (lib/analysis, lib/uploads)
const MAX_FAILURES = 5;

const sleep = (ms: number, signal: AbortSignal) =>
  new Promise<void>((resolve) => {
    const t = setTimeout(resolve, ms);
    signal.addEventListener('abort', () => {
      clearTimeout(t);
      resolve();
    });
  });

async function follow(fileId: string, signal: AbortSignal, report: (a: FileAnalysis) => void): Promise<void> {
  let failures = 0;
  while (!signal.aborted) {
    try {
      const res = await fetch(`/api/v1/files/${encodeURIComponent(fileId)}/analysis`, { signal, credentials: 'same-origin' });
      if (!res.ok) throw new Error(`the server answered ${res.status}`);
      const body = (await res.json()) as FileAnalysis;
      failures = 0;
      report({ state: body.state, progress: body.progress, error: body.error, summary: body.summary });
      if (body.state !== 'queued' && body.state !== 'running') return;
      await sleep(POLL_MS, signal);
    } catch (e) {
      if (signal.aborted) return;
      failures += 1;
      if (failures >= MAX_FAILURES) {
        report({ state: 'failed', progress: 0, error: null, summary: null, loadError: `Could not load the analysis (${(e as Error).message}). Reload the page to try again.` });
        return;
      }
      await sleep(POLL_MS * 2 ** failures, signal);
    }
  }
}

/** The analysis of each verified, analysable file, followed while it is queued or running. */
export function useFileAnalyses(files: FileView[]): { analyses: Record<string, FileAnalysis>; refresh: () => void } {
  const [analyses, setAnalyses] = useState<Record<string, FileAnalysis>>({});
  const [generation, setGeneration] = useState(0);
  const ids = files.filter((f) => f.uploadState === 'verified' && f.analysisState !== 'none').map((f) => f.id).join(',');

  useEffect(() => {
    if (!ids) return;
    const controller = new AbortController();
    for (const id of ids.split(',')) {
      // While a file is analysed again, the last summary stays on screen (marked as updating) instead of blanking.
      const keep = (a: FileAnalysis, prev?: FileAnalysis) => a.summary ?? (a.state === 'queued' || a.state === 'running' ? (prev?.summary ?? null) : null);
      void follow(id, controller.signal, (a) => setAnalyses((prev) => ({ ...prev, [id]: { ...a, summary: keep(a, prev[id]) } })));
    }
    return () => controller.abort();
  }, [ids, generation]);

  const refresh = useCallback(() => setGeneration((g) => g + 1), []);
  return { analyses, refresh };
}
