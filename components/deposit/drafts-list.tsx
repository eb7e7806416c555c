import Link from 'next/link';
import type { DraftSummary } from '@/lib/datasets/list-drafts';
import { plural } from '@/lib/format/plural';
import { LocalTime } from './local-time';

/** The drafts of the viewer's groups, newest first, each a link back into its workspace. */
export function DraftsList({ drafts }: { drafts: DraftSummary[] }) {
  if (drafts.length === 0) {
    return (
      <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-sm text-slate-600">
        No drafts yet. Start a dataset above; it stays here, saved, until it is submitted.
      </p>
    );
  }
  return (
    <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white" aria-label="Drafts">
      {drafts.map((d) => (
        <li key={d.versionId} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3">
          <div className="min-w-0">
            <Link href={`/deposit/${d.versionId}`} className="font-medium text-slate-900 hover:text-copper-700 hover:underline">
              {d.title || 'Untitled dataset'}
            </Link>
            <p className="text-xs text-slate-600">
              {d.groupName} · version <span className="num">{d.versionNumber}</span> · {plural(d.fileCount, 'file')} · last saved <LocalTime iso={d.updatedAt} />
            </p>
          </div>
          <Link href={`/deposit/${d.versionId}`} className="rounded-md border border-slate-300 px-3 py-1.5 text-sm font-semibold text-slate-800 hover:bg-slate-100">
            Continue<span className="sr-only"> {d.title}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
