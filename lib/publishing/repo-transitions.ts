import 'server-only';
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { VersionState } from '@/lib/access';
import { db } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { enqueue } from '@/lib/outbox/repo';

/** The version row as read under its row lock inside a transition. */
export type LockedVersion = {
  id: string; dataset_id: string; version_number: number; state: VersionState; title: string; metadata: unknown;
  doi: string | null; created_by: string | null;
  /** YYYY-MM-DD or null. */
  requested_embargo_until: string | null;
  embargo_until: string | null;
};

export type OutboxJobSpec = { topic: string; aggregateId: string; payload: unknown; holdMs?: number };
export type AuditSpec = { action: string; actorUserId: string; groupId: string; details: Record<string, unknown> };

/** What one transition writes, decided by the caller from the locked row. */
export type TransitionPlan = {
  patch: Record<string, unknown>;
  audit: AuditSpec;
  jobs: OutboxJobSpec[];
  /** Set for publication: the version_publications row (its primary key refuses a second one). */
  publication?: { approvedBy: string; embargoUntil: string | null };
};

const STATE_WORDS: Record<VersionState, string> = { draft: 'a draft', in_review: 'in review', published: 'published', withdrawn: 'withdrawn' };

export function stateChangedError(now: VersionState, expected: VersionState): AppError {
  return new AppError(
    'conflict',
    `This version is ${STATE_WORDS[now]} now (it was ${STATE_WORDS[expected]} when you started), so nothing was changed. Reload to see its current state.`,
    { state: now },
  );
}

const parseJson = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);

async function lockVersion(trx: Knex.Transaction, versionId: string): Promise<LockedVersion | undefined> {
  const row = await trx('dataset_versions')
    .where('id', versionId)
    .forUpdate()
    .first(
      'id', 'dataset_id', 'version_number', 'state', 'title', 'metadata', 'doi', 'created_by',
      trx.raw("DATE_FORMAT(requested_embargo_until, '%Y-%m-%d') as requested_embargo_until"),
      trx.raw("DATE_FORMAT(embargo_until, '%Y-%m-%d') as embargo_until"),
    );
  return row ? { ...row, metadata: parseJson(row.metadata) } : undefined;
}

async function insertAuditRow(trx: Knex.Transaction, versionId: string, a: AuditSpec): Promise<void> {
  // Same columns as lib/audit's insertAudit; written here so the entry commits (or not) with the transition.
  await trx('audit_log').insert({
    action: a.action, actor_kind: 'user', actor_user_id: a.actorUserId, group_id: a.groupId, target_type: 'dataset_version',
    target_id: versionId, details: JSON.stringify(a.details),
  });
}

async function enqueueAll(trx: Knex.Transaction, jobs: OutboxJobSpec[]): Promise<number[]> {
  const ids: number[] = [];
  for (const j of jobs) ids.push(await enqueue(trx, j.topic, j.aggregateId, j.payload, { holdMs: j.holdMs }));
  return ids;
}

/**
 * One state transition in one transaction: lock the row, let `plan` decide from what it sees (it may throw),
 * then a conditional UPDATE (`WHERE state = expected`), the audit entry and the outbox jobs. Returns the jobs as
 * committed, with their ids.
 */
export async function applyTransition(
  versionId: string,
  expected: VersionState,
  plan: (locked: LockedVersion) => TransitionPlan,
): Promise<{ jobIds: number[]; jobs: OutboxJobSpec[]; locked: LockedVersion }> {
  return db().transaction(async (trx) => {
    const locked = await lockVersion(trx, versionId);
    if (!locked) throw new AppError('not_found', 'We could not find this dataset version, or you do not have access to it.');
    if (locked.state !== expected) throw stateChangedError(locked.state, expected);
    const p = plan(locked);
    const changed = await trx('dataset_versions').where({ id: versionId, state: expected }).update({ ...p.patch, updated_at: new Date() });
    if (changed !== 1) throw stateChangedError(locked.state, expected);
    if (p.publication) {
      await trx('version_publications').insert({
        version_id: versionId, dataset_id: locked.dataset_id, approved_by: p.publication.approvedBy, embargo_until: p.publication.embargoUntil,
      });
    }
    await insertAuditRow(trx, versionId, p.audit);
    return { jobIds: await enqueueAll(trx, p.jobs), jobs: p.jobs, locked };
  });
}

export type NextVersionInput = {
  sourceVersionId: string; newVersionId: string; doi: string; userId: string; groupId: string; holdMs: number;
};

const FILE_COPY_COLUMNS = [
  'name', 'role', 'media_type', 'size_bytes', 'sha256', 'upload_state', 'analysis_state', 'analysis_progress', 'analysis',
  'analysis_error', 'created_by',
] as const;

/**
 * Draft v(n+1) from published v(n): metadata, title and the verified files (new rows, same blobs), the
 * 'doi.reserve' job and the audit entry, in one transaction. A concurrent second start hits the
 * (dataset_id, version_number) unique key and is refused with 409.
 */
export async function insertNextVersion(input: NextVersionInput): Promise<{ versionNumber: number; outboxId: number; fileCount: number }> {
  try {
    return await db().transaction(async (trx) => {
      const source = await lockVersion(trx, input.sourceVersionId);
      if (!source) throw new AppError('not_found', 'We could not find this dataset version, or you do not have access to it.');
      if (source.state !== 'published') throw stateChangedError(source.state, 'published');
      const versionNumber = source.version_number + 1;
      await trx('dataset_versions').insert({
        id: input.newVersionId, dataset_id: source.dataset_id, version_number: versionNumber, state: 'draft', title: source.title,
        metadata: JSON.stringify(source.metadata), doi: input.doi, doi_state: 'none', created_by: input.userId,
      });
      const files: Record<string, unknown>[] = await trx('files')
        .where({ version_id: source.id, upload_state: 'verified' })
        .select(...FILE_COPY_COLUMNS);
      if (files.length) await trx('files').insert(files.map((f) => ({ ...f, id: randomUUID(), version_id: input.newVersionId })));
      const outboxId = await enqueue(trx, 'doi.reserve', input.newVersionId, { versionId: input.newVersionId }, { holdMs: input.holdMs });
      await insertAuditRow(trx, input.newVersionId, {
        action: 'version.create', actorUserId: input.userId, groupId: input.groupId,
        details: { datasetId: source.dataset_id, fromVersionId: source.id, versionNumber, doi: input.doi, fileCount: files.length },
      });
      return { versionNumber, outboxId, fileCount: files.length };
    });
  } catch (error) {
    if ((error as { code?: string }).code === 'ER_DUP_ENTRY') {
      throw new AppError('conflict', 'A newer version of this dataset was started a moment ago; open it from your drafts instead.');
    }
    throw error;
  }
}
