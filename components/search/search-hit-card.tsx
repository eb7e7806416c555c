import Link from 'next/link';
import type { SearchHit } from '@/lib/search/types';
import { formatRange } from '@/lib/format/quantity';
import { EXCITATION_WORDS, METHOD_WORDS } from './facet-labels';
import { Highlighted } from './highlighted';
import { Sparkline } from './sparkline';
import { TemperatureBar } from './temperature-bar';

/** One result: group, title (highlighted), material, methods, ranges, the main curve and the temperature span. */
export function SearchHitCard({ hit }: { hit: SearchHit }) {
  const d = hit.doc;
  const tags = [...d.methods.map((m) => METHOD_WORDS[m] ?? m), ...(d.excitation ? [EXCITATION_WORDS[d.excitation]] : [])];
  const field = d.ranges.fieldT;
  return (
    <article className="relative flex flex-col gap-3 rounded-lg border border-slate-200 bg-white p-4 shadow-sm focus-within:border-copper-400 hover:border-copper-300 sm:flex-row">
      <div className="flex min-w-0 flex-1 flex-col gap-1">
        <p className="text-xs uppercase tracking-wide text-slate-500">{d.group.name} · {d.year}</p>
        <h3 className="font-medium text-slate-900">
          <Link href={`/datasets/${d.datasetId}/versions/${d.versionNumber}`} className="after:absolute after:inset-0 hover:text-copper-800">
            <Highlighted segments={hit.highlights.title} fallback={d.title} />
          </Link>
        </h3>
        {hit.highlights.description && <p className="line-clamp-2 text-sm text-slate-700"><Highlighted segments={hit.highlights.description} fallback="" /></p>}
        <p className="text-sm text-slate-700">{[d.material || d.formula, ...tags].filter(Boolean).join(' · ')}</p>
        {field && <p className="text-xs text-slate-600">{field[0] === 0 && field[1] === 0 ? 'Zero field' : `Field ${formatRange(field[0], field[1], 'T')}`}</p>}
        <p className="font-mono text-xs text-slate-600">{d.doi ?? 'DOI registration pending'} · v{d.versionNumber}</p>
        {d.embargoed && (
          <p className="flex items-center gap-1 text-xs font-medium text-amber-900">
            <svg aria-hidden="true" viewBox="0 0 16 16" className="h-3.5 w-3.5 fill-current"><path d="M4 7V5a4 4 0 1 1 8 0v2h1v8H3V7h1Zm2 0h4V5a2 2 0 1 0-4 0v2Z" /></svg>
            Files under embargo: record public, files locked
          </p>
        )}
      </div>
      <div className="flex shrink-0 flex-col items-start gap-2 sm:w-52 sm:items-end">
        {d.sparkline && <Sparkline points={d.sparkline} label={`Main curve of ${d.title}`} />}
        {d.temperatureSpanK ? <TemperatureBar minK={d.temperatureSpanK[0]} maxK={d.temperatureSpanK[1]} />
          : d.ranges.temperatureK && <TemperatureBar minK={d.ranges.temperatureK[0]} maxK={d.ranges.temperatureK[1]} />}
      </div>
    </article>
  );
}
