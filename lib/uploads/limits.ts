import { formatBytes } from '@/lib/format/bytes';

export const MiB = 1024 ** 2;
export const GiB = 1024 ** 3;
/** Part size for browser uploads; S3 needs ≥ 5 MiB for every part but the last when parts are joined. */
export const DEFAULT_PART_BYTES = 8 * MiB;
export const MIN_PART_BYTES = 5 * MiB;
/** S3's limit on parts in one multipart upload (the join in lib/storage/multipart.ts is one). */
export const MAX_PARTS = 10_000;
export const DEFAULT_MAX_UPLOAD_BYTES = 20 * GiB;
/** Presigned part URLs stay valid this long; GET /api/v1/uploads/:id signs fresh ones for the missing parts. */
export const PART_URL_TTL_S = 12 * 3600;
/** Pending uploads older than this are abandoned: cleanupStaleUploads removes them. */
export const STALE_UPLOAD_MS = 24 * 3600 * 1000;

export type PartPlan = { partSizeBytes: number; partCount: number };

/** 8 MiB parts; for files over 10 000 × 8 MiB (≈ 84 GB) the smallest whole MiB that keeps partCount ≤ 10 000. */
export function planParts(sizeBytes: number): PartPlan {
  const needed = Math.ceil(sizeBytes / MAX_PARTS / MiB) * MiB;
  const partSizeBytes = Math.max(DEFAULT_PART_BYTES, needed);
  return { partSizeBytes, partCount: Math.max(1, Math.ceil(sizeBytes / partSizeBytes)) };
}

/** Bytes part `partNumber` (1-based) must hold: full parts, then the remainder (an empty file is one empty part). */
export function expectedPartBytes(sizeBytes: number, plan: PartPlan, partNumber: number): number {
  if (partNumber < plan.partCount) return plan.partSizeBytes;
  return sizeBytes - (plan.partCount - 1) * plan.partSizeBytes;
}

/** MAX_UPLOAD_BYTES (validated by lib/env.ts as a decimal string) or 20 GiB. */
export function maxUploadBytes(configured: string | undefined): number {
  return configured ? Number(configured) : DEFAULT_MAX_UPLOAD_BYTES;
}

const words = (n: number) => `${formatBytes(n)} (${n.toLocaleString('en-US')} bytes)`;

export function fileTooLargeMessage(sizeBytes: number, limitBytes: number): string {
  return `This file is ${words(sizeBytes)}; one file may be at most ${words(limitBytes)}. Split it, or ask the site admin about the limit.`;
}

export type QuotaState = { groupName: string; quotaBytes: number; usedBytes: number; pendingBytes: number };

/** Null when the file fits in the group's storage; otherwise the refusal in words. */
export function quotaProblem(q: QuotaState, sizeBytes: number): string | null {
  const free = Math.max(0, q.quotaBytes - q.usedBytes - q.pendingBytes);
  if (sizeBytes <= free) return null;
  const pending = q.pendingBytes > 0 ? ` and ${formatBytes(q.pendingBytes)} is reserved by uploads in progress` : '';
  return (
    `${q.groupName} has ${formatBytes(q.quotaBytes)} of storage; ${formatBytes(q.usedBytes)} is used${pending}, ` +
    `so ${formatBytes(free)} is free, but this file is ${formatBytes(sizeBytes)}. Remove files from drafts, or ask a group owner to raise the quota.`
  );
}
