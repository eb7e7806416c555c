'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';

export type CopyButtonProps = { text: string; label?: string };

/** Copies `text` to the clipboard and says so; where the clipboard is refused, asks the user to copy by hand. */
export function CopyButton({ text, label = 'Copy' }: CopyButtonProps) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  async function copy() {
    try {
      await navigator.clipboard.writeText(text);
      setState('copied');
    } catch {
      setState('failed');
    }
  }
  return (
    <span className="inline-flex items-center gap-2">
      <Button type="button" variant="secondary" onClick={copy}>{label}</Button>
      <span role="status" className="text-sm text-slate-600">
        {state === 'copied' ? 'Copied.' : state === 'failed' ? 'Copying was blocked; select the text and copy it.' : ''}
      </span>
    </span>
  );
}
