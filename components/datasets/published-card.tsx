import Link from 'next/link';
import type { PublishedCard as PublishedCardData } from '@/lib/datasets/repo';

export type PublishedCardProps = { dataset: PublishedCardData };

/** One published version in a list: group, title, DOI and version, and the embargo if files are locked. */
export function PublishedCard({ dataset: d }: PublishedCardProps) {
  return (
    <div className="relative h-full rounded-lg border border-slate-200 bg-white p-4 shadow-sm focus-within:border-copper-400 hover:border-copper-300">
      <p className="text-xs uppercase tracking-wide text-slate-500">{d.group_name}</p>
      <p className="mt-1 font-medium text-slate-900">
        {/* The title's link covers the whole card (after:inset-0), so the card is one click target and one tab stop. */}
        <Link href={`/datasets/${d.dataset_id}/versions/${d.version_number}`} className="after:absolute after:inset-0 hover:text-copper-800">{d.title}</Link>
      </p>
      <p className="mt-2 font-mono text-xs text-slate-600">{d.doi ?? 'DOI pending'} · v{d.version_number}</p>
      {d.embargo_until && <p className="mt-1 text-xs text-amber-800">Files under embargo until {d.embargo_until} (00:00 UTC)</p>}
    </div>
  );
}
