import Link from 'next/link';
import { PublishedCard } from '@/components/datasets/published-card';
import { listRecentPublished } from '@/lib/datasets/repo';
import { listGroups } from '@/lib/groups/repo';
import { plural } from '@/lib/format/plural';

export const dynamic = 'force-dynamic';

export default async function HomePage() {
  const [recent, groups] = await Promise.all([listRecentPublished(), listGroups()]);
  return (
    <div className="flex flex-col gap-10">
      <section className="rounded-xl bg-gradient-to-br from-slate-800 to-slate-900 px-6 py-10 text-slate-100 sm:px-10">
        <h1 className="max-w-2xl text-3xl font-semibold tracking-tight">Transport curves with their context: geometry, excitation, detection and units.</h1>
        <p className="mt-3 max-w-2xl text-slate-300">
          Labs deposit resistance, Hall and magnetoresistance data with a validated measurement record. Ohmstead computes resistivity,
          sheet resistance, carrier density, mobility and RRR, flags questionable settings, and publishes citable versions.
        </p>
        <form action="/search" method="get" role="search" className="mt-6 flex max-w-xl gap-2">
          <label htmlFor="home-search" className="sr-only">Search published datasets</label>
          <input id="home-search" name="q" type="search" placeholder="e.g. NbSe2 sheet resistance, van der Pauw, 2–300 K"
            className="flex-1 rounded-md border border-slate-600 bg-slate-950/40 px-3 py-2 text-slate-100 placeholder:text-slate-400" />
          <button type="submit" className="rounded-md bg-copper-700 px-4 py-2 font-semibold text-white hover:bg-copper-800">Search</button>
        </form>
      </section>

      <section aria-labelledby="recent-heading">
        <h2 id="recent-heading" className="mb-3 text-lg font-semibold">Recently published</h2>
        {recent.length === 0 ? (
          <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-slate-600">
            Nothing is published yet. Authors start on the <Link className="text-copper-700 underline" href="/deposit">Deposit</Link> page.
          </p>
        ) : (
          <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
            {recent.map((d) => (
              <li key={d.version_id}><PublishedCard dataset={d} /></li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="groups-heading">
        <h2 id="groups-heading" className="mb-3 text-lg font-semibold">Groups</h2>
        <ul className="grid gap-3 sm:grid-cols-3">
          {groups.map((g) => (
            <li key={g.id}>
              <Link href={`/groups/${g.slug}`} className="block rounded-lg border border-slate-200 bg-white p-4 hover:border-copper-300">
                <p className="font-medium">{g.name}</p>
                <p className="text-sm text-slate-600">{g.institution}</p>
                <p className="mt-2 text-xs text-slate-500">{plural(Number(g.member_count), 'member')} · {plural(Number(g.dataset_count), 'dataset')}</p>
              </Link>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
