import 'server-only';
import schema from '@/schemas/api/audit-query.schema.json';
import type { SiteRole } from '@/lib/access';
import { AppError } from '@/lib/errors';
import { mayInGroup } from '@/lib/groups/group-access';
import { groupRoleOf } from '@/lib/groups/repo';
import { requireGroup } from '@/lib/groups/require-group';
import { validateWith } from '@/lib/validation/validate';
import { countAuditRows, listAuditActions, listAuditRows, type AuditFilter, type AuditRow } from './repo-list';

export type AuditQuery = { group?: string; action?: string; actor?: string; targetType?: string; targetId?: string; from?: string; to?: string; page?: string; pageSize?: string };
export type AuditViewer = { id: string; siteRole: SiteRole };
export type AuditListEntry = {
  id: string; at: string; action: string; actorKind: string;
  actor: { id: string; name: string; email: string } | null;
  group: { slug: string; name: string } | null;
  target: { type: string; id: string; name: string | null } | null;
  details: Record<string, unknown> | null;
};
export type AuditPage = {
  scope: { kind: 'group'; slug: string; name: string } | { kind: 'all' };
  entries: AuditListEntry[]; total: number; page: number; pageSize: number; pageCount: number;
  /** Actions that occur in the scope, for a filter menu. */
  actions: string[];
  query: AuditQuery;
};

export const DEFAULT_PAGE_SIZE = 50;
export const MAX_PAGE_SIZE = 200;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const DAY_MS = 86_400_000;

/** Query parameters (URLSearchParams or a plain object) as strings, empty ones dropped; 422 when one does not fit. */
export function parseAuditQuery(input: URLSearchParams | Record<string, string | string[] | undefined>): AuditQuery {
  const entries = input instanceof URLSearchParams ? [...input.entries()] : Object.entries(input).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v] as const);
  const query: Record<string, string> = {};
  for (const [k, v] of entries) if (typeof v === 'string' && v.trim() !== '') query[k] = v.trim();
  const parsed = validateWith<AuditQuery>(schema, query);
  if (!parsed.ok) throw new AppError('validation_failed', 'Please correct the highlighted filters.', { fieldErrors: parsed.fieldErrors });
  const q = parsed.value;
  if (q.from && q.to && q.from > q.to) {
    throw new AppError('validation_failed', 'The date range ends before it starts.', { fieldErrors: { to: 'Choose a day on or after the first day.' } });
  }
  return q;
}

/** The query as typed (unchecked), to fill the filter form again after a refusal. */
export function typedQuery(input: Record<string, string | string[] | undefined>): AuditQuery {
  const keys = Object.keys(schema.properties) as (keyof AuditQuery)[];
  return Object.fromEntries(keys.map((k) => [k, input[k]]).filter((kv): kv is [string, string] => typeof kv[1] === 'string')) as AuditQuery;
}

function actorFilter(actor: string | undefined): AuditFilter['actor'] {
  if (!actor) return undefined;
  if (UUID.test(actor)) return { userId: actor.toLowerCase() };
  return actor.includes('@') ? { email: actor } : { nameContains: actor };
}

function parseDetails(raw: unknown): Record<string, unknown> | null {
  const value = typeof raw === 'string' ? JSON.parse(raw) : raw;
  return value && typeof value === 'object' ? (value as Record<string, unknown>) : null;
}

function toEntry(r: AuditRow): AuditListEntry {
  return {
    id: String(r.id), at: new Date(r.created_at).toISOString(), action: r.action, actorKind: r.actor_kind,
    actor: r.actor_user_id ? { id: r.actor_user_id, name: r.actor_name ?? '(deleted account)', email: r.actor_email ?? '' } : null,
    group: r.group_slug ? { slug: r.group_slug, name: r.group_name ?? r.group_slug } : null,
    target: r.target_type && r.target_id ? { type: r.target_type, id: r.target_id, name: r.target_user_name } : null,
    details: parseDetails(r.details),
  };
}

/**
 * The audit log as its viewer may see it: curators and owners their group's entries (the query must name the
 * group), site admins every entry. Filters: action, actor, target, UTC day range; pages of up to 200 entries.
 */
export async function listAuditEntries(args: { viewer: AuditViewer | null; query: AuditQuery }): Promise<AuditPage> {
  if (!args.viewer) throw new AppError('not_signed_in', 'Sign in to see the audit log.');
  const { viewer, query } = args;
  let scope: AuditPage['scope'] = { kind: 'all' };
  let groupId: string | undefined;
  if (query.group) {
    const group = await requireGroup(query.group);
    if (!mayInGroup(viewer, await groupRoleOf(viewer.id, group.id), 'view_access_log')) {
      throw new AppError('forbidden', `Only curators and owners of ${group.name} (and site admins) see its audit log.`);
    }
    scope = { kind: 'group', slug: group.slug, name: group.name };
    groupId = group.id;
  } else if (viewer.siteRole !== 'admin') {
    throw new AppError('forbidden', 'Only site admins see the whole audit log; curators and owners choose their group (?group=<slug>).');
  }
  const pageSize = Math.min(MAX_PAGE_SIZE, Number(query.pageSize ?? DEFAULT_PAGE_SIZE));
  const filter: AuditFilter = {
    groupId, action: query.action, actor: actorFilter(query.actor), targetType: query.targetType, targetId: query.targetId,
    from: query.from ? new Date(`${query.from}T00:00:00Z`) : undefined,
    before: query.to ? new Date(new Date(`${query.to}T00:00:00Z`).getTime() + DAY_MS) : undefined,
  };
  const [total, actions] = await Promise.all([countAuditRows(filter), listAuditActions(groupId)]);
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  const page = Math.min(Number(query.page ?? 1), pageCount);
  const rows = await listAuditRows(filter, (page - 1) * pageSize, pageSize);
  return { scope, entries: rows.map(toEntry), total, page, pageSize, pageCount, actions, query };
}
