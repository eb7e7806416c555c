import type { GroupRole } from '@/lib/access';

const STYLE: Record<GroupRole, string> = {
  owner: 'bg-slate-800 text-white',
  curator: 'bg-copper-100 text-copper-900',
  member: 'bg-slate-100 text-slate-700',
};

export function RoleBadge({ role }: { role: GroupRole }) {
  return <span className={`rounded px-2 py-0.5 text-xs font-medium ${STYLE[role]}`}>{role}</span>;
}
