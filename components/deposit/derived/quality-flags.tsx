import type { QualityFlag, QualitySeverity } from '@/lib/transport/quality/types';

const SEVERITY: Record<QualitySeverity, { word: string; tone: string; mark: string }> = {
  serious: { word: 'Serious', tone: 'border-red-300 bg-red-50 text-red-950', mark: '◆' },
  warning: { word: 'Warning', tone: 'border-amber-300 bg-amber-50 text-amber-950', mark: '▲' },
  info: { word: 'Note', tone: 'border-slate-300 bg-white text-slate-800', mark: '●' },
};
const ORDER: QualitySeverity[] = ['serious', 'warning', 'info'];

/** Quality flags, most severe first: what fired, the rule and its source; a lab-safety caution where one applies. */
export function QualityFlags({ flags }: { flags: QualityFlag[] }) {
  if (flags.length === 0) {
    return <p className="text-sm text-slate-600">No quality flags: nothing in the settings or the data looks questionable to the checks we run.</p>;
  }
  const sorted = [...flags].sort((a, b) => ORDER.indexOf(a.severity) - ORDER.indexOf(b.severity));
  return (
    <ul className="flex flex-col gap-2" aria-label="Quality flags">
      {sorted.map((flag, i) => {
        const s = SEVERITY[flag.severity];
        return (
          <li key={`${flag.code}-${i}`} className={`rounded-md border px-3 py-2 text-sm ${s.tone}`}>
            <p>
              <span aria-hidden="true" className="mr-1">{s.mark}</span>
              <span className="font-semibold">{s.word}:</span> {flag.message}
            </p>
            {flag.safety && (
              <p className="mt-2 rounded border border-amber-400 bg-amber-100 px-2 py-1 text-amber-950">
                <span className="font-semibold">Lab safety:</span> {flag.safety}
              </p>
            )}
            <details className="mt-1 text-xs">
              <summary className="cursor-pointer">Rule and source</summary>
              <p className="mt-1">Rule: {flag.rule}</p>
              <p>Source: {flag.source}</p>
            </details>
          </li>
        );
      })}
    </ul>
  );
}
