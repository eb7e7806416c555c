'use client';

import { useId, useState, type DragEvent } from 'react';

export type DropZoneProps = { onFiles: (files: File[], refused: string[]) => void; disabled?: boolean };

/** Files of a drop, without folders (a dropped folder arrives as an unreadable "file"). */
function filesOfDrop(event: DragEvent<HTMLElement>): { files: File[]; refused: string[] } {
  const files: File[] = [];
  const refused: string[] = [];
  const items = Array.from(event.dataTransfer.items ?? []);
  if (items.length === 0) return { files: Array.from(event.dataTransfer.files), refused };
  for (const item of items) {
    if (item.kind !== 'file') continue;
    const file = item.getAsFile();
    if (!file) continue;
    if (item.webkitGetAsEntry?.()?.isDirectory) refused.push(`${file.name} is a folder. Drop the files inside it instead.`);
    else files.push(file);
  }
  return { files, refused };
}

/**
 * Where files come in: drag and drop, or the picker behind a button-styled label (the real input stays
 * focusable, so the keyboard and screen readers get a native file control).
 */
export function DropZone({ onFiles, disabled = false }: DropZoneProps) {
  const inputId = useId();
  const hintId = `${inputId}-hint`;
  const [over, setOver] = useState(false);

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
        if (disabled) return;
        const { files, refused } = filesOfDrop(event);
        onFiles(files, refused);
      }}
      className={`flex flex-col items-center gap-3 rounded-lg border-2 border-dashed px-6 py-8 text-center transition-colors ${over ? 'border-copper-500 bg-copper-50' : 'border-slate-300 bg-white'}`}
    >
      <p className="text-sm font-medium text-slate-800">Drop instrument exports or processed tables here</p>
      <input
        id={inputId}
        type="file"
        multiple
        disabled={disabled}
        aria-describedby={hintId}
        className="peer sr-only"
        onChange={(event) => {
          onFiles(Array.from(event.currentTarget.files ?? []), []);
          event.currentTarget.value = ''; // picking the same file again still fires a change
        }}
      />
      <label
        htmlFor={inputId}
        className="inline-flex cursor-pointer items-center justify-center rounded-md bg-copper-600 px-4 py-2 text-sm font-semibold text-white transition-colors hover:bg-copper-700 peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-copper-500 peer-disabled:cursor-not-allowed peer-disabled:bg-copper-300"
      >
        Choose files…
      </label>
      <p id={hintId} className="max-w-prose text-xs text-slate-600">
        Several files at once. Each is checked (SHA-256) in your browser, then sent in parts straight to storage; you
        can pause, and pick up again after a dropped connection or a reload.
      </p>
    </div>
  );
}
