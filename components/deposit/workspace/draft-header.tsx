import Link from 'next/link';

export type DraftHeading = {
  groupSlug: string;
  groupName: string;
  versionNumber: number;
  state: 'draft' | 'in_review' | 'published' | 'withdrawn';
  doi: string | null;
  doiState: 'none' | 'reserved' | 'pending' | 'registered' | 'findable';
  conceptDoi: string | null;
};

const STATE_WORDS: Record<DraftHeading['state'], string> = { draft: 'Draft', in_review: 'In review', published: 'Published', withdrawn: 'Withdrawn' };

function doiText(h: DraftHeading): string {
  if (!h.doi) return 'No DOI yet';
  if (h.doiState === 'none' || h.doiState === 'pending') return `${h.doi} — being reserved; we retry automatically until the DOI agency answers`;
  if (h.doiState === 'reserved') return `${h.doi} — reserved as a draft DOI; it becomes resolvable when the version is published`;
  return h.doi;
}

/** Title (live from the record), group, version, state and the reserved DOI of a draft. */
export function DraftHeader({ title, heading }: { title: string; heading: DraftHeading }) {
  return (
    <header>
      <p className="text-sm text-slate-600">
        <Link href="/deposit" className="text-copper-700 underline">Deposit</Link>
        <span aria-hidden="true"> / </span>
        <Link href={`/groups/${heading.groupSlug}`} className="hover:underline">{heading.groupName}</Link>
      </p>
      <h1 className="mt-1 text-2xl font-semibold tracking-tight text-slate-900">{title.trim() || 'Untitled dataset'}</h1>
      <dl className="mt-2 flex flex-wrap gap-x-6 gap-y-1 text-sm text-slate-700">
        <div className="flex gap-1">
          <dt className="sr-only">Version and state</dt>
          <dd>
            Version <span className="num">{heading.versionNumber}</span> ·{' '}
            <span className="rounded-full border border-copper-200 bg-copper-50 px-2 py-0.5 text-xs font-semibold text-copper-800">{STATE_WORDS[heading.state]}</span>
          </dd>
        </div>
        <div className="flex gap-1">
          <dt className="font-medium">DOI</dt>
          <dd className="font-mono text-xs leading-5">{doiText(heading)}</dd>
        </div>
        {heading.conceptDoi && (
          <div className="flex gap-1">
            <dt className="font-medium">All versions</dt>
            <dd className="font-mono text-xs leading-5">{heading.conceptDoi}</dd>
          </div>
        )}
      </dl>
    </header>
  );
}
