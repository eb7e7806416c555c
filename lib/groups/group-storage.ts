import 'server-only';
import schema from '@/schemas/api/update-group.schema.json';
import { AppError } from '@/lib/errors';
import { formatBytes } from '@/lib/format/bytes';
import type { GroupActor } from './group-access';
import { asObject, parseWith } from './parse-input';
import { updateStorageQuota, type GroupRow } from './repo';
import { requireGroup, requireSignedIn } from './require-group';

export type StorageLevel = 'ok' | 'high' | 'full';
export type GroupStorage = {
  usedBytes: number; quotaBytes: number; freeBytes: number;
  /** 0–100, one decimal. */
  percentUsed: number;
  level: StorageLevel;
  /** "1.25 GiB of 50.0 GiB used (2.5 %), 48.8 GiB free" */
  summary: string;
};

/** Above this share a group is told it is running out (room for about one more large run at the default quota). */
export const HIGH_USE_PERCENT = 90;

/** Storage use in bytes and in words (binary prefixes, lib/format/bytes). */
export function describeStorage(usedBytes: number, quotaBytes: number): GroupStorage {
  const used = Math.max(0, usedBytes);
  const quota = Math.max(0, quotaBytes);
  const freeBytes = Math.max(0, quota - used);
  const percentUsed = quota > 0 ? Math.round((used / quota) * 1000) / 10 : 100;
  const level: StorageLevel = used >= quota ? 'full' : percentUsed >= HIGH_USE_PERCENT ? 'high' : 'ok';
  // A little use must not read as "0 %".
  const percentText = used > 0 && percentUsed < 0.1 ? 'under 0.1 %' : `${percentUsed} %`;
  const summary = `${formatBytes(used)} of ${formatBytes(quota)} used (${percentText}), ${formatBytes(freeBytes)} free`;
  return { usedBytes: used, quotaBytes: quota, freeBytes, percentUsed, level, summary };
}

export function groupStorage(group: Pick<GroupRow, 'storage_used_bytes' | 'storage_quota_bytes'>): GroupStorage {
  return describeStorage(Number(group.storage_used_bytes), Number(group.storage_quota_bytes));
}

/** Site admins set a group's quota (audited). Lowering it below the use stops new uploads; nothing is deleted. */
export async function setStorageQuota(args: { user: GroupActor | null; slug: string; input: unknown }): Promise<GroupStorage> {
  const user = requireSignedIn(args.user, 'change quotas');
  if (user.siteRole !== 'admin') throw new AppError('forbidden', 'Only site admins change storage quotas.');
  const { storageQuotaBytes } = parseWith<{ storageQuotaBytes: number }>(schema, asObject(args.input, 'Send a JSON object with "storageQuotaBytes".'), {
    storageQuotaBytes: 'Give the quota in bytes, between 1 MiB (1048576) and 1 PiB.',
  });
  const group = await requireGroup(args.slug);
  await updateStorageQuota(group.id, storageQuotaBytes, user.id);
  return describeStorage(Number(group.storage_used_bytes), storageQuotaBytes);
}
