'use client';

import { useId, useRef, useState, type KeyboardEvent } from 'react';
import { CopyButton } from './copy-button';

export type CitationFormatKey = 'text' | 'bibtex' | 'ris' | 'csl-json';

export type CitationBoxProps = {
  /** Each format already written on the server; this component only shows and copies them. */
  citations: Record<CitationFormatKey, string>;
};

const TABS: { key: CitationFormatKey; label: string }[] = [
  { key: 'text', label: 'Text' },
  { key: 'bibtex', label: 'BibTeX' },
  { key: 'ris', label: 'RIS' },
  { key: 'csl-json', label: 'CSL-JSON' },
];

/** "How to cite": one tab per format (arrow keys move between tabs), the text, and a copy button. */
export function CitationBox({ citations }: CitationBoxProps) {
  const [active, setActive] = useState<CitationFormatKey>('text');
  const tabs = useRef<(HTMLButtonElement | null)[]>([]);
  const id = useId();

  function onKeyDown(event: KeyboardEvent<HTMLButtonElement>, index: number) {
    const moves: Record<string, number> = { ArrowRight: index + 1, ArrowLeft: index - 1, Home: 0, End: TABS.length - 1 };
    if (!(event.key in moves)) return;
    event.preventDefault();
    const next = (moves[event.key] + TABS.length) % TABS.length;
    setActive(TABS[next].key);
    tabs.current[next]?.focus();
  }

  const current = TABS.find((t) => t.key === active)!;
  return (
    <div className="flex flex-col gap-2">
      <div role="tablist" aria-label="Citation format" className="flex flex-wrap gap-1 border-b border-slate-200">
        {TABS.map((t, i) => (
          <button key={t.key} ref={(el) => { tabs.current[i] = el; }} type="button" role="tab" id={`${id}-tab-${t.key}`}
            aria-selected={t.key === active} aria-controls={`${id}-panel`} tabIndex={t.key === active ? 0 : -1}
            onClick={() => setActive(t.key)} onKeyDown={(e) => onKeyDown(e, i)}
            className={`-mb-px rounded-t border-b-2 px-3 py-1.5 text-sm font-medium ${t.key === active
              ? 'border-copper-600 text-copper-800' : 'border-transparent text-slate-600 hover:text-slate-900'}`}>
            {t.label}
          </button>
        ))}
      </div>
      <div role="tabpanel" id={`${id}-panel`} aria-labelledby={`${id}-tab-${active}`} className="flex flex-col gap-2">
        <pre tabIndex={0} aria-label={`Citation as ${current.label}`}
          className={`max-h-64 overflow-auto rounded-md border border-slate-200 bg-slate-50 p-3 leading-relaxed text-slate-900 ${active === 'text'
            ? 'font-sans text-sm whitespace-pre-wrap' : 'font-mono text-xs whitespace-pre'}`}>
          {citations[active]}
        </pre>
        <CopyButton text={citations[active]} label={`Copy the citation as ${current.label}`} doneMessage={`${current.label} citation copied`}>
          Copy {current.label}
        </CopyButton>
      </div>
    </div>
  );
}
