import Link from 'next/link';
import type { LandingVersionLink } from '@/lib/datasets/landing-types';
import { LocalDateTime } from './local-date-time';
import { embargoText } from './state-badges';

const STATE_WORDS: Record<LandingVersionLink['state'], string> = { draft: 'Draft', in_review: 'In review', published: 'Published', withdrawn: 'Withdrawn' };

function When({ v }: { v: LandingVersionLink }) {
  if (v.state === 'withdrawn' && v.withdrawnAt) return <>Withdrawn <LocalDateTime iso={v.withdrawnAt} withTime={false} /></>;
  if (v.publishedAt) return <>Published <LocalDateTime iso={v.publishedAt} withTime={false} /></>;
  return <>{STATE_WORDS[v.state]}</>;
}

export type VersionsListProps = { versions: LandingVersionLink[] };

/** Every version this viewer may open, newest first, each with its state, date and DOI. */
export function VersionsList({ versions }: VersionsListProps) {
  return (
    <ol className="flex flex-col divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white">
      {versions.map((v) => (
        <li key={v.id} className={`flex flex-col gap-1 px-4 py-3 sm:flex-row sm:items-baseline sm:gap-4 ${v.current ? 'bg-copper-50' : ''}`}>
          <span className="flex-none font-medium sm:w-44">
            {v.current ? (
              <span aria-current="page">Version <span className="num">{v.number}</span> <span className="text-xs font-normal text-slate-600">(this page)</span></span>
            ) : (
              <Link href={v.href} className="text-copper-800 underline">Version <span className="num">{v.number}</span></Link>
            )}
          </span>
          <span className="text-sm text-slate-700 sm:w-64 sm:flex-none"><When v={v} /></span>
          <span className="flex flex-col text-xs text-slate-600">
            {v.doi && <span className="font-mono break-all">{v.doi}</span>}
            {v.embargoUntil && <span>Files embargoed until {embargoText(v.embargoUntil)}</span>}
          </span>
        </li>
      ))}
    </ol>
  );
}
