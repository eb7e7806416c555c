import 'server-only';
import type { Knex } from 'knex';
import type { GroupRole } from '@/lib/access';
import { insertAudit, type AuditEntry } from '@/lib/audit/repo';
import { db } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { MAIL_TOPIC, type MailJob } from '@/lib/notify/mail-jobs';
import { enqueue } from '@/lib/outbox/repo';
import { INVALID_INVITATION } from './invitation-status';
import { applyMembershipChanges, lockGroup, type LockedGroup, type MembershipChange } from './repo-members';

// Invitations by e-mail. The mailed token is never stored; its mail job is scrubbed once delivered or once the
// invitation is answered, replaced or revoked, so no live link stays in the outbox.

export type InvitationRow = {
  id: string; group_id: string; email: string; role: GroupRole; invited_by: string | null; expires_at: Date;
  accepted_at: Date | null; declined_at: Date | null; created_at: Date;
};
export type InvitationView = InvitationRow & { group_slug: string; group_name: string; inviter_name: string | null };

const VIEW_COLUMNS = [
  'i.id', 'i.group_id', 'i.email', 'i.role', 'i.invited_by', 'i.expires_at', 'i.accepted_at', 'i.declined_at', 'i.created_at',
  'g.slug as group_slug', 'g.name as group_name', 'u.name as inviter_name',
] as const;

const ROW_COLUMNS = ['id', 'group_id', 'email', 'role', 'invited_by', 'expires_at', 'accepted_at', 'declined_at', 'created_at'] as const;

function viewQuery(conn: Knex | Knex.Transaction = db()): Knex.QueryBuilder {
  return conn('group_invitations as i').join('groups as g', 'g.id', 'i.group_id').leftJoin('users as u', 'u.id', 'i.invited_by');
}

/** Marks the invitations' mail jobs done and drops their content (address, link). */
async function scrubMailJobs(conn: Knex | Knex.Transaction, invitationIds: string[], onlyDelivered: boolean): Promise<void> {
  if (invitationIds.length === 0) return;
  const q = conn('outbox').where('topic', MAIL_TOPIC).whereIn('aggregate_id', invitationIds);
  if (onlyDelivered) q.whereNotNull('processed_at');
  await q.update({
    payload: JSON.stringify({ kind: 'group.invitation', scrubbed: true }),
    processed_at: conn.raw('COALESCE(processed_at, UTC_TIMESTAMP())'),
    next_attempt_at: null,
  });
}

/** After the request's own first try delivered the mail. */
export async function scrubDeliveredInvitationMail(invitationId: string): Promise<void> {
  await scrubMailJobs(db(), [invitationId], true);
}

export type NewInvitation = { id: string; groupId: string; email: string; role: GroupRole; invitedBy: string; tokenHash: string; expiresAt: Date };

/**
 * Under the group lock: `check` may refuse (throws), open invitations to the same address are replaced (their
 * unsent mail is dropped), the new one is written with its mail job and audit entry. Returns the job ids.
 */
export async function insertInvitation(
  inv: NewInvitation,
  jobs: MailJob[],
  audit: AuditEntry,
  check: (group: LockedGroup) => void,
): Promise<{ jobIds: number[]; replaced: number }> {
  return db().transaction(async (trx) => {
    const group = await lockGroup(trx, inv.groupId);
    if (!group) throw new AppError('not_found', 'We could not find this group.');
    check(group);
    const open = trx('group_invitations').where({ group_id: inv.groupId, email: inv.email }).whereNull('accepted_at').whereNull('declined_at');
    const replacedIds: string[] = await open.clone().forUpdate().pluck('id');
    if (replacedIds.length) {
      await scrubMailJobs(trx, replacedIds, false);
      await trx('group_invitations').whereIn('id', replacedIds).delete();
    }
    await trx('group_invitations').insert({
      id: inv.id, group_id: inv.groupId, email: inv.email, role: inv.role, token_hash: inv.tokenHash, invited_by: inv.invitedBy, expires_at: inv.expiresAt,
    });
    const jobIds: number[] = [];
    for (const j of jobs) jobIds.push(await enqueue(trx, j.topic, j.aggregateId, j.payload, { holdMs: j.holdMs }));
    await insertAudit({ ...audit, details: { ...audit.details, replaced: replacedIds.length } }, trx);
    return { jobIds, replaced: replacedIds.length };
  });
}

export async function findInvitationByTokenHash(tokenHash: string): Promise<InvitationView | undefined> {
  return viewQuery().where('i.token_hash', tokenHash).first(...VIEW_COLUMNS);
}

/** Invitations not yet answered (expired ones included, so stewards see them and can invite again), newest first. */
export async function listOpenInvitations(groupId: string): Promise<InvitationView[]> {
  return viewQuery().where('i.group_id', groupId).whereNull('i.accepted_at').whereNull('i.declined_at')
    .orderBy([{ column: 'i.created_at', order: 'desc' }, { column: 'i.id', order: 'asc' }]).select(...VIEW_COLUMNS);
}

/** Deletes an unanswered invitation of the group (revoke) with its audit entry; false when there was none. */
export async function deleteOpenInvitation(
  groupId: string,
  invitationId: string,
  audit: (row: InvitationRow) => AuditEntry,
  check: (group: LockedGroup, row: InvitationRow | undefined) => void,
): Promise<boolean> {
  return db().transaction(async (trx) => {
    const group = await lockGroup(trx, groupId);
    if (!group) return false;
    const row: InvitationRow | undefined = await trx('group_invitations').where({ id: invitationId, group_id: groupId })
      .whereNull('accepted_at').whereNull('declined_at').forUpdate().first(...ROW_COLUMNS);
    check(group, row);
    if (!row) return false;
    await scrubMailJobs(trx, [row.id], false);
    await trx('group_invitations').where({ id: row.id }).delete();
    await insertAudit(audit(row), trx);
    return true;
  });
}

export type InvitationAnswer<T> = {
  mark: 'accepted' | 'declined';
  changes: MembershipChange[];
  audit: AuditEntry;
  /** The account whose address the answer proves (accepting through the mailed link). */
  verifyEmailOf?: string;
  result: T;
};

/**
 * Answers an invitation: locks its group, then the invitation row; `decide` sees both as locked and throws to
 * refuse. Membership changes go through the same owner check as every other change.
 */
export async function answerInvitation<T>(tokenHash: string, decide: (inv: InvitationView, group: LockedGroup) => InvitationAnswer<T>): Promise<T> {
  const first = await findInvitationByTokenHash(tokenHash);
  if (!first) throw new AppError('not_found', INVALID_INVITATION, { reason: 'not_found' });
  return db().transaction(async (trx) => {
    const group = await lockGroup(trx, first.group_id);
    // The invitation row alone is locked (a joined locking read would lock the inviter's user row too).
    const row: InvitationRow | undefined = await trx('group_invitations').where({ id: first.id }).forUpdate().first(...ROW_COLUMNS);
    if (!group || !row) throw new AppError('not_found', INVALID_INVITATION, { reason: 'not_found' });
    const inv: InvitationView = { ...row, group_slug: group.slug, group_name: group.name, inviter_name: first.inviter_name };
    const answer = decide(inv, group);
    if (answer.changes.length) await applyMembershipChanges(trx, group.id, answer.changes);
    await trx('group_invitations').where({ id: inv.id }).update(answer.mark === 'accepted' ? { accepted_at: new Date() } : { declined_at: new Date() });
    if (answer.verifyEmailOf) {
      await trx('users').where({ id: answer.verifyEmailOf }).whereNull('email_verified_at').update({ email_verified_at: new Date(), updated_at: new Date() });
    }
    await scrubMailJobs(trx, [inv.id], false);
    await insertAudit(answer.audit, trx);
    return answer.result;
  });
}
