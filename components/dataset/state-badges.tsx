import type { LandingView } from '@/lib/datasets/landing-types';

const STATE: Record<LandingView['version']['state'], { word: string; tone: string }> = {
  draft: { word: 'Draft', tone: 'border-slate-300 bg-white text-slate-800' },
  in_review: { word: 'In review', tone: 'border-sky-300 bg-sky-50 text-sky-900' },
  published: { word: 'Published', tone: 'border-emerald-300 bg-emerald-50 text-emerald-900' },
  withdrawn: { word: 'Withdrawn', tone: 'border-red-300 bg-red-50 text-red-900' },
};

export function LockIcon() {
  return (
    <svg aria-hidden="true" viewBox="0 0 16 16" className="h-3.5 w-3.5 flex-none" fill="currentColor">
      <path d="M8 1a3.5 3.5 0 0 0-3.5 3.5V6H4a1.5 1.5 0 0 0-1.5 1.5v6A1.5 1.5 0 0 0 4 15h8a1.5 1.5 0 0 0 1.5-1.5v-6A1.5 1.5 0 0 0 12 6h-.5V4.5A3.5 3.5 0 0 0 8 1Zm2 5H6V4.5a2 2 0 1 1 4 0V6Z" />
    </svg>
  );
}

/** The files-open date of an embargo, said the same way everywhere: "2027-04-01 at 00:00 UTC". */
export function embargoText(until: string): string {
  return `${until} at 00:00 UTC`;
}

export type StateBadgesProps = { state: LandingView['version']['state']; embargo: LandingView['embargo'] };

/** Version state, and a lock while files are under embargo. */
export function StateBadges({ state, embargo }: StateBadgesProps) {
  const s = STATE[state];
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <span className={`rounded-full border px-2.5 py-0.5 text-xs font-semibold ${s.tone}`}>{s.word}</span>
      {embargo?.active && (
        <span className="inline-flex items-center gap-1 rounded-full border border-amber-400 bg-amber-50 px-2.5 py-0.5 text-xs font-semibold text-amber-950">
          <LockIcon />
          Files open on {embargoText(embargo.until)}
        </span>
      )}
    </span>
  );
}
