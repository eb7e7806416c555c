'use client';

import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { formatBytes } from '@/lib/format/bytes';
import type { FileRole } from '@/lib/client/uploads/types';
import type { UploadManager } from '@/lib/client/uploads/upload-manager';
import { describePhase, phasePercent, type UploadRow } from '@/lib/client/uploads/upload-state';
import { UploadProgress } from './upload-progress';

export type FileRowProps = { row: UploadRow; manager: UploadManager; canEdit: boolean };

const ROLES: { value: FileRole; label: string }[] = [
  { value: 'raw', label: 'Raw (instrument export)' },
  { value: 'processed', label: 'Processed' },
  { value: 'other', label: 'Other' },
];

/** One file: name and size, its progress bar with the phase in words, and what can be done now. */
export function FileRow({ row, manager, canEdit }: FileRowProps) {
  const id = useId();
  const [busy, setBusy] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const { phase, name } = row;

  async function act(work: () => Promise<string | null>) {
    setBusy(true);
    setMessage(null);
    const error = await work();
    setBusy(false);
    setMessage(error);
  }

  const verified = phase === 'ready' || phase === 'analysing' || phase === 'analysis-failed';
  const canPause = phase === 'queued' || phase === 'hashing' || phase === 'uploading';
  const canCancel = canPause || phase === 'paused' || phase === 'unfinished';
  const needsFile = (phase === 'unfinished' || phase === 'failed') && !manager.hasLocalFile(row.key);

  return (
    <li className="flex flex-col gap-2 rounded-md border border-slate-200 bg-white p-4 shadow-sm">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <p className="min-w-0 font-medium break-all text-slate-900" id={`${id}-name`}>{name}</p>
        <p className="num shrink-0 text-sm text-slate-600">{formatBytes(row.sizeBytes)}</p>
      </div>
      <UploadProgress fileName={name} phase={phase} percent={phasePercent(row)} text={describePhase(row)} />
      {row.note && <p className="text-sm text-amber-900">{row.note}</p>}
      {row.file?.sha256 && verified && (
        <p className="font-mono text-xs break-all text-slate-500" title="SHA-256 checked by the server">SHA-256 {row.file.sha256}</p>
      )}
      {message && <p role="alert" className="text-sm text-red-800">{message}</p>}

      {canEdit && (
        <div className="flex flex-wrap items-center gap-2">
          {canPause && <Button variant="secondary" aria-label={`Pause ${name}`} onClick={() => manager.pause(row.key)}>Pause</Button>}
          {phase === 'paused' && <Button variant="secondary" aria-label={`Resume ${name}`} onClick={() => manager.resume(row.key)}>Resume</Button>}
          {phase === 'failed' && !needsFile && <Button variant="secondary" aria-label={`Retry ${name}`} onClick={() => manager.resume(row.key)}>Retry</Button>}
          {phase === 'analysing' && row.note && <Button variant="secondary" aria-label={`Check again ${name}`} onClick={() => manager.resume(row.key)}>Check again</Button>}
          {needsFile && <PickAgain name={name} onPick={(file) => setMessage(manager.attach(row.key, file))} />}
          {canCancel && (
            <Button variant="quiet" disabled={busy} aria-label={`Cancel upload of ${name}`} onClick={() => act(() => manager.cancel(row.key))}>Cancel upload</Button>
          )}
          {phase === 'failed' && (
            <Button variant="quiet" disabled={busy} aria-label={`Dismiss ${name}`} onClick={() => act(() => manager.dismiss(row.key))}>Dismiss</Button>
          )}
          {verified && row.file && (
            <>
              <label className="flex items-center gap-2 text-sm text-slate-800">
                Role
                <select
                  value={row.file.role}
                  disabled={busy}
                  onChange={(event) => act(() => manager.setRole(row.key, event.currentTarget.value as FileRole))}
                  className="rounded-md border border-slate-400 bg-white px-2 py-1 text-sm text-slate-900"
                  aria-describedby={`${id}-name`}
                >
                  {ROLES.map((r) => <option key={r.value} value={r.value}>{r.label}</option>)}
                </select>
              </label>
              {confirming ? (
                <span className="flex flex-wrap items-center gap-2 text-sm text-slate-800">
                  Remove {name} from this draft?
                  <Button variant="secondary" disabled={busy} onClick={() => act(() => manager.remove(row.key))}>Yes, remove</Button>
                  <Button variant="quiet" onClick={() => setConfirming(false)}>Keep it</Button>
                </span>
              ) : (
                <Button variant="quiet" aria-label={`Remove ${name}`} onClick={() => setConfirming(true)}>Remove</Button>
              )}
            </>
          )}
        </div>
      )}
    </li>
  );
}

/** "Pick the file again" for an upload whose local file the browser no longer holds (after a reload). */
function PickAgain({ name, onPick }: { name: string; onPick: (file: File) => void }) {
  const inputId = useId();
  return (
    <>
      <input
        id={inputId}
        type="file"
        className="peer sr-only"
        onChange={(event) => {
          const file = event.currentTarget.files?.[0];
          event.currentTarget.value = '';
          if (file) onPick(file);
        }}
      />
      <label
        htmlFor={inputId}
        className="inline-flex cursor-pointer items-center justify-center rounded-md border border-slate-300 bg-white px-4 py-2 text-sm font-semibold text-slate-800 hover:bg-slate-100 peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-copper-500"
      >
        Pick {name} again to resume
      </label>
    </>
  );
}
