// The temperature range a curve covers, on a log axis from 10 mK to 1000 K (the span labs measure over).
const LOG_MIN = Math.log10(0.01);
const LOG_MAX = Math.log10(1000);
const TICKS = [0.01, 0.1, 1, 10, 100, 1000];
// Every decade gets a mark on the bar; every second one a label, so the labels fit a card's 13 rem column.
const LABELLED = [0.01, 1, 100];

const pos = (k: number) => ((Math.log10(Math.min(Math.max(k, 0.01), 1000)) - LOG_MIN) / (LOG_MAX - LOG_MIN)) * 100;
const tickLabel = (k: number) => (k < 1 ? `${k * 1000} mK` : `${k} K`);

export function TemperatureBar({ minK, maxK }: { minK: number; maxK: number }) {
  const left = pos(minK);
  const width = Math.max(pos(maxK) - left, 1);
  const text = `${minK < 1 ? `${+(minK * 1000).toPrecision(3)} mK` : `${+minK.toPrecision(3)} K`} to ${+maxK.toPrecision(3)} K`;
  return (
    <div className="w-full max-w-xs" aria-label={`Temperature covered: ${text} (log scale)`} role="img">
      <div className="relative h-2 rounded bg-slate-200">
        <div className="absolute inset-y-0 rounded bg-copper-600" style={{ left: `${left}%`, width: `${width}%` }} />
        {TICKS.slice(1, -1).map((k) => (
          <span key={k} aria-hidden="true" className="absolute inset-y-0 w-px bg-white/70" style={{ left: `${pos(k)}%` }} />
        ))}
      </div>
      <div className="relative mt-0.5 h-3 text-[10px] leading-3 text-slate-500" aria-hidden="true">
        {LABELLED.map((k) => (
          <span key={k} className={`absolute whitespace-nowrap tabular-nums ${k === TICKS[0] ? '' : '-translate-x-1/2'}`} style={{ left: `${pos(k)}%` }}>{tickLabel(k)}</span>
        ))}
      </div>
    </div>
  );
}
