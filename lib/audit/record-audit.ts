import 'server-only';
import { createHash } from 'node:crypto';
import { insertAudit, type AuditEntry } from './repo';

/** Records one security-relevant action. The caller's IP, if given, is stored only as a hash. */
export async function recordAudit(entry: Omit<AuditEntry, 'ipHash'> & { ip?: string | null }): Promise<void> {
  const { ip, ...rest } = entry;
  await insertAudit({ ...rest, ipHash: ip ? createHash('sha256').update(ip).digest('hex') : null });
}
