import Link from 'next/link';
import { LocalDateTime } from '@/components/dataset/local-date-time';
import { ACTOR_KIND_LABELS, auditActionLabel } from '@/lib/audit/action-labels';
import type { AuditListEntry, AuditPage } from '@/lib/audit/list-audit';
import { formatCount } from '@/lib/format/plural';

export type AuditTableProps = { page: AuditPage; path: string; showGroup: boolean };

function detailText(details: Record<string, unknown> | null): string {
  if (!details) return '';
  return Object.entries(details)
    .map(([k, v]) => `${k}: ${typeof v === 'string' ? v : JSON.stringify(v)}`)
    .join(' · ');
}

function Actor({ e }: { e: AuditListEntry }) {
  if (!e.actor) return <span className="text-slate-500">{ACTOR_KIND_LABELS[e.actorKind] ?? e.actorKind}</span>;
  return <span>{e.actor.name}<span className="block break-all text-xs text-slate-500">{e.actor.email}</span></span>;
}

// The group's own log has the group in its address; the site-wide log keeps it as a filter.
function Target({ e }: { e: AuditListEntry }) {
  if (!e.target) return <>—</>;
  return <>{e.target.name ?? e.target.type.replace(/_/g, ' ')}<span className="block break-all font-mono text-xs text-slate-500">{e.target.id}</span></>;
}

/** Narrow screens: one card per entry instead of a wide table. */
function EntryCard({ e, showGroup }: { e: AuditListEntry; showGroup: boolean }) {
  const details = detailText(e.details);
  return (
    <li className="flex flex-col gap-1 px-4 py-3 text-sm">
      <p className="font-medium text-slate-900">{auditActionLabel(e.action)} <span className="font-mono text-xs font-normal text-slate-500">{e.action}</span></p>
      <p className="text-xs text-slate-600"><LocalDateTime iso={e.at} /></p>
      <p><span className="text-slate-500">by </span><Actor e={e} /></p>
      {showGroup && e.group && <p><span className="text-slate-500">in </span>{e.group.name}</p>}
      {e.target && <p><span className="text-slate-500">on </span><Target e={e} /></p>}
      {details && <p className="break-words text-xs text-slate-600">{details}</p>}
    </li>
  );
}

function pageHref(path: string, query: AuditPage['query'], page: number, keepGroup: boolean): string {
  const { group, ...rest } = query;
  const params = new URLSearchParams(Object.entries({ ...rest, ...(keepGroup ? { group } : {}), page: String(page) }).filter((kv): kv is [string, string] => typeof kv[1] === 'string' && kv[1] !== ''));
  return `${path}?${params.toString()}`;
}

/** One row per entry, newest first, with a pager; times in the viewer's zone, named. */
export function AuditTable({ page, path, showGroup }: AuditTableProps) {
  if (page.total === 0) {
    return <p className="rounded-lg border border-dashed border-slate-300 bg-white p-6 text-slate-600">No entries match these filters.</p>;
  }
  return (
    <div className="flex flex-col gap-3">
      <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white md:hidden">
        {page.entries.map((e) => <EntryCard key={e.id} e={e} showGroup={showGroup} />)}
      </ul>
      <div className="hidden overflow-x-auto rounded-lg border border-slate-200 bg-white md:block">
        <table className="w-full min-w-[44rem] text-left text-sm">
          <caption className="sr-only">Audit log entries, newest first</caption>
          <thead className="bg-slate-50 text-xs uppercase tracking-wide text-slate-500">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">When</th>
              <th scope="col" className="px-3 py-2 font-medium">Action</th>
              <th scope="col" className="px-3 py-2 font-medium">Actor</th>
              {showGroup && <th scope="col" className="px-3 py-2 font-medium">Group</th>}
              <th scope="col" className="px-3 py-2 font-medium">Target</th>
              <th scope="col" className="px-3 py-2 font-medium">Details</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-slate-100 align-top">
            {page.entries.map((e) => (
              <tr key={e.id}>
                <td className="whitespace-nowrap px-3 py-2 text-slate-700"><LocalDateTime iso={e.at} /></td>
                <td className="px-3 py-2">{auditActionLabel(e.action)}<span className="block font-mono text-xs text-slate-500">{e.action}</span></td>
                <td className="px-3 py-2"><Actor e={e} /></td>
                {showGroup && <td className="px-3 py-2">{e.group ? <Link href={`/groups/${e.group.slug}`} className="text-copper-700 underline">{e.group.name}</Link> : <span className="text-slate-500">site</span>}</td>}
                <td className="px-3 py-2"><Target e={e} /></td>
                <td className="max-w-xs break-words px-3 py-2 text-xs text-slate-600">{detailText(e.details)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <nav aria-label="Audit log pages" className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <p className="num text-slate-600">Page {formatCount(page.page)} of {formatCount(page.pageCount)} · {formatCount(page.total)} {page.total === 1 ? 'entry' : 'entries'}</p>
        <div className="flex gap-2">
          {page.page > 1 && <Link href={pageHref(path, page.query, page.page - 1, showGroup)} rel="prev" className="rounded-md border border-slate-300 bg-white px-3 py-1.5 font-semibold text-slate-800 hover:bg-slate-100">Newer</Link>}
          {page.page < page.pageCount && <Link href={pageHref(path, page.query, page.page + 1, showGroup)} rel="next" className="rounded-md border border-slate-300 bg-white px-3 py-1.5 font-semibold text-slate-800 hover:bg-slate-100">Older</Link>}
        </div>
      </nav>
    </div>
  );
}
