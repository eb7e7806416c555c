import Link from 'next/link';
import type { LandingVersionLink } from '@/lib/datasets/landing-types';

const STATE_WORDS: Record<LandingVersionLink['state'], string> = { draft: 'draft', in_review: 'in review', published: 'published', withdrawn: 'withdrawn' };

export type VersionPickerProps = { versions: LandingVersionLink[] };

/** "Version 2 of 3" with a menu of the other versions this viewer may open (works without JavaScript). */
export function VersionPicker({ versions }: VersionPickerProps) {
  const current = versions.find((v) => v.current);
  if (!current) return null;
  if (versions.length === 1) return <span className="text-sm text-slate-700">Version <span className="num">{current.number}</span></span>;
  return (
    <details className="group relative text-sm">
      <summary className="inline-flex cursor-pointer list-none items-center gap-1 rounded-md border border-slate-300 bg-white px-2.5 py-1 font-medium text-slate-800 hover:border-copper-400">
        Version <span className="num">{current.number}</span>
        <span className="text-slate-500">of {versions.length}</span>
        <span aria-hidden="true" className="text-slate-500 group-open:rotate-180">▾</span>
      </summary>
      <ul className="absolute left-0 z-20 mt-1 w-72 max-w-[calc(100vw-2rem)] rounded-md border border-slate-200 bg-white py-1 shadow-lg">
        {versions.map((v) => (
          <li key={v.id}>
            <Link href={v.href} aria-current={v.current ? 'page' : undefined}
              className={`flex justify-between gap-3 px-3 py-1.5 hover:bg-copper-50 ${v.current ? 'font-semibold text-copper-800' : 'text-slate-800'}`}>
              <span>Version <span className="num">{v.number}</span></span>
              <span className="text-xs text-slate-600">{STATE_WORDS[v.state]}</span>
            </Link>
          </li>
        ))}
      </ul>
    </details>
  );
}
