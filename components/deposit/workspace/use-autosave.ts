'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { putMetadata } from './put-metadata';
import { clearUnsent, decideUnsent, readUnsent, writeUnsent, type UnsentEdit } from './unsent-store';

export type SaveStatus = 'saved' | 'pending' | 'saving' | 'error';
export type SaveState = { status: SaveStatus; savedAt: Date | null; message?: string; serverErrors: Record<string, string> };

const DEBOUNCE_MS = 900;
const RETRY_MS = 8000;
// Keys whose change makes the server analyse the files again (lib/datasets/save-metadata.ts).
const ANALYSIS_KEYS = ['columns', 'sample', 'measurement'] as const;

function analysisInputsChanged(a: unknown, b: unknown): boolean {
  const pick = (r: unknown) => JSON.stringify(ANALYSIS_KEYS.map((k) => (r as Record<string, unknown> | null)?.[k]));
  return pick(a) !== pick(b);
}

export type Autosave = {
  record: unknown;
  setRecord: (next: unknown) => void;
  state: SaveState;
  /** A kept copy from this browser that someone else's later save would overwrite; the author decides. */
  offered: UnsentEdit | null;
  acceptOffered: () => void;
  discardOffered: () => void;
};

/** Draft record state with debounced autosave, a local copy of unsent edits, and a retry when saving fails. */
export function useAutosave(opts: {
  versionId: string;
  initialRecord: unknown;
  serverUpdatedAt: string;
  canEdit: boolean;
  onAnalysisInputsSaved?: () => void;
}): Autosave {
  const { versionId, canEdit, onAnalysisInputsSaved } = opts;
  const [record, setRecordState] = useState<unknown>(opts.initialRecord);
  const [state, setState] = useState<SaveState>({ status: 'saved', savedAt: null, serverErrors: {} });
  const [offered, setOffered] = useState<UnsentEdit | null>(null);
  const latest = useRef<unknown>(opts.initialRecord);
  const lastSaved = useRef<unknown>(opts.initialRecord);
  const inFlight = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const onSaved = useRef(onAnalysisInputsSaved);
  useEffect(() => {
    onSaved.current = onAnalysisInputsSaved;
  });

  // Timers call the latest flush through a ref, so a retry always sends the newest record.
  const flushRef = useRef<() => Promise<void>>(async () => {});
  const schedule = useCallback((ms: number) => {
    clearTimeout(timer.current);
    timer.current = setTimeout(() => void flushRef.current(), ms);
  }, []);

  const flush = useCallback(async () => {
    clearTimeout(timer.current);
    if (inFlight.current || !canEdit) return;
    const sending = latest.current;
    if (sending === lastSaved.current) return;
    inFlight.current = true;
    setState((s) => ({ ...s, status: 'saving' }));
    const outcome = await putMetadata(fetch, versionId, sending);
    inFlight.current = false;
    if (outcome.saved) {
      const before = lastSaved.current;
      lastSaved.current = sending;
      const newer = latest.current !== sending;
      if (!newer) clearUnsent(window.localStorage, versionId);
      setState({ status: newer ? 'pending' : 'saved', savedAt: new Date(), serverErrors: outcome.fieldErrors });
      if (analysisInputsChanged(before, sending)) onSaved.current?.();
      if (newer) schedule(DEBOUNCE_MS);
    } else {
      setState((s) => ({ ...s, status: 'error', message: outcome.message }));
      if (outcome.retry) schedule(RETRY_MS);
    }
  }, [canEdit, schedule, versionId]);
  useEffect(() => {
    flushRef.current = flush;
  }, [flush]);

  const setRecord = useCallback((next: unknown) => {
    latest.current = next;
    setRecordState(next);
    if (!canEdit) return;
    writeUnsent(window.localStorage, versionId, { record: next, editedAt: Date.now() });
    setState((s) => ({ ...s, status: s.status === 'error' ? 'error' : 'pending' }));
    schedule(DEBOUNCE_MS);
  }, [canEdit, schedule, versionId]);

  // On load: send a kept copy that never arrived, or offer one that a later save on the server would overwrite.
  useEffect(() => {
    if (!canEdit) return;
    const unsent = readUnsent(window.localStorage, versionId);
    const decision = decideUnsent(unsent, opts.initialRecord, opts.serverUpdatedAt);
    // localStorage exists only after hydration, so restoring a kept copy has to happen in an effect.
    // eslint-disable-next-line react-hooks/set-state-in-effect
    if (decision === 'restore' && unsent) setRecord(unsent.record);
    else if (decision === 'offer') setOffered(unsent);
    else if (decision === 'none' && unsent) clearUnsent(window.localStorage, versionId);
    // Only on first load; later server renders do not replace what the author is typing.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  // Leaving the page: send what is pending at once (keepalive outlives the page); the local copy covers a failure.
  useEffect(() => {
    const leave = () => {
      if (!canEdit || latest.current === lastSaved.current || inFlight.current) return;
      void putMetadata(fetch, versionId, latest.current, true);
    };
    const online = () => void flush();
    window.addEventListener('pagehide', leave);
    window.addEventListener('online', online);
    return () => {
      window.removeEventListener('pagehide', leave);
      window.removeEventListener('online', online);
      clearTimeout(timer.current);
    };
  }, [canEdit, flush, versionId]);

  return {
    record,
    setRecord,
    state,
    offered,
    acceptOffered: () => {
      if (offered) setRecord(offered.record);
      setOffered(null);
    },
    discardOffered: () => {
      clearUnsent(window.localStorage, versionId);
      setOffered(null);
    },
  };
}
