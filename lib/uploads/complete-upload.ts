import 'server-only';
import { recordAudit } from '@/lib/audit/record-audit';
import { AppError } from '@/lib/errors';
import { formatBytes } from '@/lib/format/bytes';
import { log } from '@/lib/log';
import { ComposeMismatchError, composeObject, listStagedParts, type StagedPart } from '@/lib/storage/multipart';
import { defaultStore, deleteObjects, deletePrefix, stripQuotes, type ObjectStore } from '@/lib/storage/objects';
import { validateWith } from '@/lib/validation/validate';
import schema from '@/schemas/api/complete-upload.schema.json';
import { hashStagedParts } from './hash-staged-parts';
import { expectedPartBytes, planParts, type PartPlan } from './limits';
import { toFileView, type FileView } from './list-files';
import { fileGone, loadFileFor } from './load-file';
import { blobExists, deleteUnverifiedFile, findFileRow, finishVerifiedUpload, type FileRow } from './repo';
import { isAnalysable } from './text-like';

type UserLike = { id: string; siteRole: 'admin' | 'user' };
type CompleteInput = { parts?: { partNumber: number; etag: string }[] };

/** Content address of a verified file: each distinct SHA-256 is stored once. */
export const blobKey = (sha256: string) => `blobs/sha256/${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}`;

const bytes = (n: number) => `${formatBytes(n)} (${n.toLocaleString('en-US')} bytes)`;

/** Failed verification keeps nothing: the row goes, then the parts (the stale-upload cleanup catches any it misses). */
async function discard(store: ObjectStore, file: FileRow): Promise<void> {
  await deleteUnverifiedFile(file.id);
  if (file.staging_key) {
    await deletePrefix(store, file.staging_key).catch((error: unknown) => log('warn', 'could not delete the parts of a refused upload', { fileId: file.id, error: String(error) }));
  }
}

function sizeMismatch(declared: number, actual: number, detail?: string): AppError {
  return new AppError(
    'validation_failed',
    `The upload holds ${bytes(actual)} but ${bytes(declared)} was declared${detail ? ` (${detail})` : ''}. Nothing was kept; upload the file again.`,
    { declaredSizeBytes: declared, actualSizeBytes: actual },
  );
}

/** Refusals decided from the listing alone: wrong-sized or extra parts (422, discarded), missing parts (409, kept to resume). */
async function checkStagedParts(store: ObjectStore, file: FileRow, plan: PartPlan, staged: StagedPart[], given: CompleteInput['parts']): Promise<void> {
  const total = staged.reduce((sum, p) => sum + p.sizeBytes, 0);
  const wrong = staged.find((p) => p.partNumber > plan.partCount || p.sizeBytes !== expectedPartBytes(file.size_bytes, plan, p.partNumber));
  if (wrong) {
    await discard(store, file);
    const detail = wrong.partNumber > plan.partCount
      ? `part ${wrong.partNumber} is beyond the ${plan.partCount} parts this size needs`
      : `part ${wrong.partNumber} holds ${wrong.sizeBytes} bytes where ${expectedPartBytes(file.size_bytes, plan, wrong.partNumber)} belong`;
    throw sizeMismatch(file.size_bytes, total, detail);
  }
  const have = new Set(staged.map((p) => p.partNumber));
  const missing = Array.from({ length: plan.partCount }, (_, i) => i + 1).filter((n) => !have.has(n));
  if (missing.length) {
    const list = missing.length > 10 ? `${missing.slice(0, 10).join(', ')}, …` : missing.join(', ');
    throw new AppError('conflict', `${missing.length} of ${plan.partCount} parts have not arrived yet (part ${list}). Upload them, then complete again.`, { missingParts: missing });
  }
  const byNumber = new Map(staged.map((p) => [p.partNumber, p]));
  const changed = (given ?? []).find((g) => byNumber.get(g.partNumber)?.etag !== stripQuotes(g.etag));
  if (changed) {
    throw new AppError('conflict', `Part ${changed.partNumber} in storage is not the one you sent (its ETag differs). Send that part again, then complete.`, {
      partNumber: changed.partNumber,
    });
  }
}

/**
 * Verifies a finished upload and records it: the staged parts are streamed through SHA-256 and counted; any
 * difference from the declared size or digest refuses the file (422) and keeps nothing. A match stores the content
 * once under its address, marks the file verified and queues text files for analysis.
 */
export async function completeUpload(args: { user: UserLike; fileId: string; input?: unknown }, options: { store?: ObjectStore } = {}): Promise<{ file: FileView }> {
  const { file, ctx } = await loadFileFor(args.fileId, args.user, 'edit');
  const parsed = validateWith<CompleteInput>(schema, args.input ?? {});
  if (!parsed.ok) throw new AppError('validation_failed', 'The completion request has errors.', { fieldErrors: parsed.fieldErrors });
  if (file.upload_state === 'verified') return { file: toFileView(file) };
  if (file.upload_state !== 'pending' || !file.staging_key || !file.declared_sha256) {
    throw new AppError('conflict', 'This upload can no longer be completed. Start it again.');
  }
  const declared = file.declared_sha256;
  const store = options.store ?? defaultStore();
  const plan = planParts(file.size_bytes);
  const staged = await listStagedParts(store, file.staging_key);
  await checkStagedParts(store, file, plan, staged, parsed.value.parts);

  const digest = await hashStagedParts(store, staged);
  if (digest.sizeBytes !== file.size_bytes) {
    await discard(store, file);
    throw sizeMismatch(file.size_bytes, digest.sizeBytes);
  }
  const checksumError = (actual: string) =>
    new AppError(
      'validation_failed',
      `The file arrived with SHA-256 ${actual}, but ${declared} was declared: it changed or was damaged on the way. Nothing was kept; upload it again.`,
      { declaredSha256: declared, actualSha256: actual },
    );
  if (digest.sha256 !== declared) {
    await discard(store, file);
    throw checksumError(digest.sha256);
  }

  const key = blobKey(declared);
  const analysisState = isAnalysable(file.name, digest.head, digest.sizeBytes <= digest.head.length) ? 'queued' : 'none';
  let exists = await blobExists(declared);
  let wrote = false;
  let newBlob = false;
  for (let attempt = 0; ; attempt += 1) {
    if (!exists && !wrote) {
      try {
        await composeObject(store, digest.sources, key, declared);
      } catch (error) {
        if (!(error instanceof ComposeMismatchError)) throw error;
        await discard(store, file);
        throw checksumError(error.actualSha256);
      }
      wrote = true;
    }
    const result = await finishVerifiedUpload({ fileId: file.id, groupId: ctx.version.group_id, sha256: declared, sizeBytes: file.size_bytes, storageKey: key, analysisState, wroteObject: wrote });
    if (result.outcome === 'verified') {
      newBlob = result.newBlob;
      break;
    }
    if (result.outcome === 'not-pending') {
      // Completed (or cancelled) by a concurrent request meanwhile.
      const now = await findFileRow(file.id);
      if (now?.upload_state === 'verified') return { file: toFileView(now) };
      throw fileGone();
    }
    if (attempt >= 2) throw new Error(`blob ${declared} kept disappearing while upload ${file.id} was being recorded`);
    exists = false;
  }

  await deleteObjects(store, staged.map((p) => p.key)).catch((error: unknown) =>
    log('warn', 'could not delete the staged parts of a verified upload', { fileId: file.id, error: String(error) }),
  );
  await recordAudit({
    action: 'file.upload', actorKind: 'user', actorUserId: args.user.id, groupId: ctx.version.group_id, targetType: 'file', targetId: file.id,
    details: { versionId: file.version_id, name: file.name, sizeBytes: file.size_bytes, sha256: declared, storedOnce: !newBlob },
  });
  const done = await findFileRow(file.id);
  if (!done) throw fileGone();
  return { file: toFileView(done) };
}
