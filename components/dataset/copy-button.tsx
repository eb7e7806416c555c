'use client';

import { useEffect, useRef, useState } from 'react';

export type CopyButtonProps = {
  /** The exact text put on the clipboard. */
  text: string;
  /** Accessible name, e.g. "Copy the SHA-256 of rho-T.csv". */
  label: string;
  /** Announced after copying, e.g. "SHA-256 copied". */
  doneMessage?: string;
  children?: React.ReactNode;
  className?: string;
};

async function writeClipboard(text: string): Promise<boolean> {
  try {
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    // Older or locked-down browsers: copy through a hidden, selected textarea.
    const area = document.createElement('textarea');
    area.value = text;
    area.setAttribute('readonly', '');
    area.style.position = 'fixed';
    area.style.opacity = '0';
    document.body.appendChild(area);
    area.select();
    const ok = document.execCommand('copy');
    area.remove();
    return ok;
  }
}

/** Copies `text` and says so in a polite live region ("copied"), or tells the reader to copy by hand. */
export function CopyButton({ text, label, doneMessage = 'Copied', children, className = '' }: CopyButtonProps) {
  const [message, setMessage] = useState('');
  const timer = useRef<ReturnType<typeof setTimeout>>(undefined);
  useEffect(() => () => clearTimeout(timer.current), []);

  async function copy() {
    const ok = await writeClipboard(text);
    setMessage(ok ? doneMessage : 'Copying failed: select the text and press Ctrl+C (⌘C on a Mac).');
    clearTimeout(timer.current);
    timer.current = setTimeout(() => setMessage(''), 4000);
  }

  return (
    <span className="inline-flex items-center gap-2">
      <button type="button" onClick={copy} aria-label={label}
        className={`rounded border border-slate-300 bg-white px-2 py-1 text-xs font-semibold text-slate-800 hover:border-copper-400 hover:bg-copper-50 ${className}`}>
        {children ?? 'Copy'}
      </button>
      <span aria-live="polite" role="status" className="text-xs text-emerald-800">{message}</span>
    </span>
  );
}
