import type { Metadata } from 'next';
import { PageTitle } from '@/components/ui/page-title';
import { PublishedCard } from '@/components/datasets/published-card';
import { listRecentPublished } from '@/lib/datasets/repo';

export const metadata: Metadata = { title: 'Search' };

// Title search over published versions; the faceted FlexSearch index replaces this query.
export default async function SearchPage({ searchParams }: { searchParams: Promise<{ q?: string }> }) {
  const q = ((await searchParams).q ?? '').trim().slice(0, 200);
  const results = await listRecentPublished(50, q || undefined);
  return (
    <div>
      <PageTitle lead={q ? `Published datasets whose title contains “${q}”.` : 'The newest published datasets.'}>Search</PageTitle>
      {results.length === 0 ? (
        <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-slate-600">No published dataset matches. Try a shorter word, e.g. a material or a quantity.</p>
      ) : (
        <ul className="flex flex-col gap-3">
          {results.map((d) => (
            <li key={d.version_id}><PublishedCard dataset={d} /></li>
          ))}
        </ul>
      )}
    </div>
  );
}
