'use client';

import { useId, useState, type DragEvent } from 'react';
import { formatBytes } from '@/lib/format/bytes';
import { LOCAL_MAX_BYTES } from './local-file';

export type LocalFileDropProps = {
  onFile: (file: File, onProgress: (fraction: number) => void) => Promise<string | null>;
  disabled?: boolean;
  compact?: boolean;
};

type State = { kind: 'idle' } | { kind: 'reading'; name: string; fraction: number } | { kind: 'error'; text: string };

/** Drop (or pick) a file of your own to overlay it; it is read in this browser and never uploaded. */
export function LocalFileDrop({ onFile, disabled = false, compact = false }: LocalFileDropProps) {
  const inputId = useId();
  const [over, setOver] = useState(false);
  const [state, setState] = useState<State>({ kind: 'idle' });

  async function take(files: File[]) {
    const file = files[0];
    if (!file || disabled) return;
    setState({ kind: 'reading', name: file.name, fraction: 0 });
    const problem = await onFile(file, (fraction) => setState({ kind: 'reading', name: file.name, fraction }));
    setState(problem ? { kind: 'error', text: problem } : { kind: 'idle' });
  }

  const onDrag = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    if (!disabled) setOver(event.type !== 'dragleave');
  };

  return (
    <div
      onDragEnter={onDrag}
      onDragOver={onDrag}
      onDragLeave={onDrag}
      onDrop={(event) => {
        event.preventDefault();
        setOver(false);
        void take(Array.from(event.dataTransfer.files));
      }}
      className={`flex flex-col gap-2 rounded-lg border-2 border-dashed ${compact ? 'px-4 py-3' : 'px-6 py-6'} text-sm transition-colors ${over ? 'border-copper-500 bg-copper-50' : 'border-slate-300 bg-white'}`}
    >
      <div className="flex flex-wrap items-center gap-3">
        <p className="font-medium text-slate-800">Overlay a file of your own: drop it here, or</p>
        <input id={inputId} type="file" disabled={disabled} className="peer sr-only" aria-describedby={`${inputId}-hint`}
          onChange={(e) => {
            void take(Array.from(e.currentTarget.files ?? []));
            e.currentTarget.value = '';
          }} />
        <label htmlFor={inputId}
          className="inline-flex cursor-pointer items-center rounded-md border border-copper-600 px-3 py-1 font-semibold text-copper-700 hover:bg-copper-50 peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-copper-500 peer-disabled:cursor-not-allowed peer-disabled:opacity-60">
          choose a file…
        </label>
      </div>
      <p id={`${inputId}-hint`} className="text-xs text-slate-600">
        CSV, TSV or whitespace tables with units in the header. Read in this browser only — never uploaded or stored. Up to
        {' '}{formatBytes(LOCAL_MAX_BYTES)} is read; of a larger file, the first {formatBytes(LOCAL_MAX_BYTES)}.
      </p>
      {state.kind === 'reading' && (
        <div className="flex items-center gap-3">
          <progress className="h-2 w-48 accent-copper-600" max={1} value={state.fraction} aria-label={`Reading ${state.name}`} />
          <span className="num text-xs text-slate-700">Reading {state.name}: {Math.round(state.fraction * 100)} %</span>
        </div>
      )}
      {state.kind === 'error' && <p role="alert" className="text-red-800">{state.text}</p>}
    </div>
  );
}
