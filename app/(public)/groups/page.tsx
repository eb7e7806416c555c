import type { Metadata } from 'next';
import Link from 'next/link';
import { Notice } from '@/components/ui/notice';
import { PageTitle } from '@/components/ui/page-title';
import { currentUser } from '@/lib/auth/session';
import { groupsOfUser, listGroups, listMembers } from '@/lib/groups/repo';
import { RoleBadge } from '@/components/groups/role-badge';

export const metadata: Metadata = { title: 'Groups' };
export const dynamic = 'force-dynamic';

export default async function GroupsPage({ searchParams }: { searchParams: Promise<{ left?: string | string[] }> }) {
  const user = await currentUser();
  const [groups, mine] = await Promise.all([listGroups(), user ? groupsOfUser(user.id) : Promise.resolve([])]);
  // Named from the database, not the query, so a crafted link cannot put words on the page.
  const leftSlug = (await searchParams).left;
  const left = typeof leftSlug === 'string' ? groups.find((g) => g.slug === leftSlug && !mine.some((m) => m.id === g.id))?.name : undefined;
  const members = await Promise.all(groups.map((g) => listMembers(g.id)));
  const myRole = new Map(mine.map((g) => [g.id, g.role]));
  return (
    <div>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageTitle lead="The labs that deposit in Ohmstead. Owners manage members; curators approve what the group publishes.">Groups</PageTitle>
        {user && <Link href="/groups/new" className="rounded-md bg-copper-600 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-700">Create a group</Link>}
      </div>
      {left && <div className="mb-6"><Notice tone="success">You left {left}.</Notice></div>}
      {user && (
        <section aria-labelledby="mine" className="mb-8">
          <h2 id="mine" className="mb-2 text-lg font-semibold">Your groups</h2>
          {mine.length === 0 ? (
            <p className="text-slate-600">You are not in a group yet. Ask a group owner to invite you, or <Link href="/groups/new" className="text-copper-700 underline">create a group</Link>.</p>
          ) : (
            <ul className="flex flex-wrap gap-2">
              {mine.map((g) => (
                <li key={g.id}>
                  <Link href={`/groups/${g.slug}`} className="inline-flex items-center gap-2 rounded-full border border-copper-200 bg-copper-50 px-3 py-1 text-sm">
                    {g.name} <RoleBadge role={g.role} />
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </section>
      )}
      <ul className="grid gap-4 md:grid-cols-2">
        {groups.map((g, i) => (
          <li key={g.id} className="rounded-lg border border-slate-200 bg-white p-5">
            <div className="flex items-start justify-between gap-2">
              <div>
                <h2 className="font-semibold"><Link href={`/groups/${g.slug}`} className="hover:underline">{g.name}</Link></h2>
                <p className="text-sm text-slate-600">{g.institution}</p>
              </div>
              {myRole.get(g.id) && <RoleBadge role={myRole.get(g.id)!} />}
            </div>
            <table className="mt-4 w-full text-sm">
              <caption className="sr-only">Members of {g.name}</caption>
              <thead><tr className="text-left text-xs uppercase text-slate-500"><th className="py-1 font-medium">Member</th><th className="py-1 font-medium">Role</th></tr></thead>
              <tbody>
                {members[i].map((m) => (
                  <tr key={m.user_id} className="border-t border-slate-100">
                    <td className="py-1.5">{m.name}</td>
                    <td className="py-1.5"><RoleBadge role={m.role} /></td>
                  </tr>
                ))}
              </tbody>
            </table>
          </li>
        ))}
      </ul>
    </div>
  );
}
