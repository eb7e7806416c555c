'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import type { TransportDatasetDraft } from '@/lib/schema';
import { isPreviewable, previewLocalFile } from '@/components/deposit/preview/local-preview';
import type { LocalPreviewEntry } from './summary-sources';

const MAX_FILES = 6;
const RECOMPUTE_MS = 400;

/**
 * Instant previews of files the author just picked or dropped, computed in the browser from their first 256 KiB and
 * recomputed when the mapping or the geometry changes, until the server's analysis takes over.
 */
export function useLocalPreviews(record: unknown): { previews: LocalPreviewEntry[]; addFiles: (files: File[]) => void } {
  const files = useRef(new Map<string, File>());
  const [previews, setPreviews] = useState<LocalPreviewEntry[]>([]);
  const [picked, setPicked] = useState(0);
  // Only what the analysis reads: typing a title does not re-parse files.
  const inputs = JSON.stringify([(record as Record<string, unknown> | null)?.columns, (record as Record<string, unknown> | null)?.sample, (record as Record<string, unknown> | null)?.measurement]);

  const addFiles = useCallback((list: File[]) => {
    for (const f of list.filter(isPreviewable)) {
      files.current.delete(f.name);
      files.current.set(f.name, f);
    }
    while (files.current.size > MAX_FILES) files.current.delete(files.current.keys().next().value as string);
    setPicked((n) => n + 1);
  }, []);

  useEffect(() => {
    if (files.current.size === 0) return;
    let cancelled = false;
    const metadata = JSON.parse(inputs) as [unknown, unknown, unknown];
    const draft = { columns: metadata[0], sample: metadata[1], measurement: metadata[2] } as TransportDatasetDraft;
    const timer = setTimeout(async () => {
      const results = await Promise.all([...files.current.values()].map(async (file): Promise<LocalPreviewEntry> => {
        const r = await previewLocalFile(file, draft);
        return r.ok ? { name: file.name, summary: r.summary, wholeFile: r.wholeFile } : { name: file.name, summary: null, wholeFile: false, error: r.message };
      }));
      if (!cancelled) setPreviews(results);
    }, RECOMPUTE_MS);
    return () => {
      cancelled = true;
      clearTimeout(timer);
    };
  }, [inputs, picked]);

  return { previews, addFiles };
}
