// A throw-away invented lab for the group-administration tests, written straight into MariaDB, and its clean-up.
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import net from 'node:net';
import { db } from '@/lib/db';
import { processOutboxOnce, type OutboxHandlers } from '@/lib/outbox/process-outbox';
import { insertUser } from '@/lib/users/repo';

export type LabUser = { id: string; name: string; siteRole: 'admin' | 'user'; email: string };
export type GroupLab = {
  groupId: string; slug: string; name: string;
  owner: LabUser; curator: LabUser; member: LabUser; outsider: LabUser; admin: LabUser;
  /** Everyone the lab made, for clean-up (tests add more with labUser). */
  users: LabUser[];
  /** Groups made through createGroup, for clean-up. */
  extraGroupIds: string[];
};

export function uniqueEmail(prefix = 'groups'): string {
  return `${prefix}-${randomBytes(5).toString('hex')}@tests.ohmstead.example`;
}

export async function labUser(lab: Pick<GroupLab, 'users'> | null, name: string, options: { siteRole?: 'admin' | 'user'; verified?: boolean; email?: string } = {}): Promise<LabUser> {
  const row = await insertUser({
    email: options.email ?? uniqueEmail(), name, passwordHash: null, siteRole: options.siteRole ?? 'user',
    emailVerifiedAt: options.verified === false ? null : new Date(),
  });
  const u = { id: row.id, name: row.name, siteRole: row.site_role, email: row.email };
  lab?.users.push(u);
  return u;
}

export async function makeGroupLab(prefix = 'grp'): Promise<GroupLab> {
  const tag = randomBytes(4).toString('hex');
  const lab: GroupLab = {
    groupId: randomUUID(), slug: `${prefix}-bench-${tag}`, name: `Brindlecombe Admin Bench ${tag} (invented)`,
    users: [], extraGroupIds: [],
  } as unknown as GroupLab;
  lab.owner = await labUser(lab, 'Petra Vantongeren');
  lab.curator = await labUser(lab, 'Hollis Fenwright');
  lab.member = await labUser(lab, 'Ines Marlowe-Tate');
  lab.outsider = await labUser(lab, 'Dario Quennell');
  lab.admin = await labUser(lab, 'Sabine Orrick', { siteRole: 'admin' });
  await db()('groups').insert({ id: lab.groupId, slug: lab.slug, name: lab.name, institution: 'Brindlecombe Institute (invented)' });
  await db()('memberships').insert([
    { group_id: lab.groupId, user_id: lab.owner.id, role: 'owner' },
    { group_id: lab.groupId, user_id: lab.curator.id, role: 'curator' },
    { group_id: lab.groupId, user_id: lab.member.id, role: 'member' },
  ]);
  return lab;
}

/** Buckets as lib/rate-limit names them: limit name and the first 40 hex characters of SHA-256(key). */
function bucket(name: string, key: string): string {
  return `${name}:${createHash('sha256').update(key).digest('hex').slice(0, 40)}`;
}

export async function removeGroupLab(lab: GroupLab): Promise<void> {
  const groupIds = [lab.groupId, ...lab.extraGroupIds];
  const invitationIds: string[] = await db()('group_invitations').whereIn('group_id', groupIds).pluck('id');
  const auditedInvitations: string[] = await db()('audit_log').whereIn('group_id', groupIds).where('target_type', 'group_invitation').pluck('target_id');
  await db()('outbox').whereIn('aggregate_id', [...new Set([...invitationIds, ...auditedInvitations])]).delete();
  await db()('rate_limit_hits').whereIn('bucket', [
    ...groupIds.map((id) => bucket('group-invite', id)), ...lab.users.map((u) => bucket('group-create', u.id)),
  ]).delete();
  await db()('audit_log').whereIn('group_id', groupIds).delete();
  await db()('audit_log').whereIn('actor_user_id', lab.users.map((u) => u.id)).delete();
  await db()('datasets').whereIn('group_id', groupIds).delete();
  await db()('groups').whereIn('id', groupIds).delete(); // memberships and invitations cascade
  await db()('users').whereIn('id', lab.users.map((u) => u.id)).delete();
}

export async function closeDb(): Promise<void> {
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
}

export type Refusal = Error & { code?: string; status?: number; details?: { fieldErrors?: Record<string, string>; reason?: string } };

/** The error a promise rejects with (fails the test if it resolves). */
export async function rejection(promise: Promise<unknown>): Promise<Refusal> {
  const outcome = await promise.then(() => 'resolved' as const, (e: unknown) => e);
  if (outcome === 'resolved') throw new Error('expected a refusal, but the call succeeded');
  return outcome as Refusal;
}

export async function rolesOf(groupId: string): Promise<Record<string, string>> {
  const rows: { user_id: string; role: string }[] = await db()('memberships').where('group_id', groupId).select('user_id', 'role');
  return Object.fromEntries(rows.map((r) => [r.user_id, r.role]));
}

export async function auditOf(groupId: string, action?: string): Promise<{ action: string; actor_user_id: string | null; actor_kind: string; target_type: string | null; target_id: string | null; details: Record<string, unknown> | null }[]> {
  const q = db()('audit_log').where('group_id', groupId).orderBy('id').select('action', 'actor_user_id', 'actor_kind', 'target_type', 'target_id', 'details');
  if (action) q.where('action', action);
  const rows = await q;
  return rows.map((r: { details: unknown }) => ({ ...r, details: typeof r.details === 'string' ? JSON.parse(r.details) : r.details })) as never;
}

/** Makes the invitation's open mail jobs due and runs the outbox until they are done (a worker may take some). */
export async function drainInvitationMail(invitationId: string, handlers: OutboxHandlers, rounds = 5): Promise<void> {
  for (let i = 0; i < rounds; i++) {
    const open = db()('outbox').where({ aggregate_id: invitationId, topic: 'mail.send' }).whereNull('processed_at');
    if (!(await open.clone().first('id'))) return;
    await open.clone().update({ next_attempt_at: db().raw('UTC_TIMESTAMP(3) - INTERVAL 1 SECOND') });
    await processOutboxOnce(handlers, { limit: 100 });
  }
}

/** A loopback URL where nothing listens: a port the OS just handed out and took back. */
export async function closedPortUrl(): Promise<string> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return `smtp://127.0.0.1:${port}`;
}

/** The token from an invitation link in a mail (`…/invitations/<token>`). */
export function tokenFromLinks(links: string[]): string {
  const link = links.find((l) => /\/invitations\/[A-Za-z0-9_-]{43}$/.test(l));
  if (!link) throw new Error(`no invitation link among ${JSON.stringify(links)}`);
  return link.slice(link.lastIndexOf('/') + 1);
}
