import Link from 'next/link';

export type GroupNavProps = { slug: string; current: 'page' | 'members' | 'audit'; showAudit: boolean; showMembers: boolean };

/** The group's own pages, as tabs under its title. */
export function GroupNav({ slug, current, showAudit, showMembers }: GroupNavProps) {
  const items = [
    { key: 'page', href: `/groups/${slug}`, label: 'Group page' },
    ...(showMembers ? [{ key: 'members', href: `/groups/${slug}/members`, label: 'Members' }] : []),
    ...(showAudit ? [{ key: 'audit', href: `/groups/${slug}/audit`, label: 'Audit log' }] : []),
  ];
  return (
    <nav aria-label="Group" className="flex flex-wrap gap-1 border-b border-slate-200">
      {items.map((i) => (
        <Link
          key={i.key}
          href={i.href}
          aria-current={i.key === current ? 'page' : undefined}
          className={`-mb-px border-b-2 px-3 py-2 text-sm font-medium ${i.key === current ? 'border-copper-600 text-copper-800' : 'border-transparent text-slate-600 hover:text-slate-900'}`}
        >
          {i.label}
        </Link>
      ))}
    </nav>
  );
}
