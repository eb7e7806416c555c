import 'server-only';
import { randomUUID } from 'node:crypto';
import { db } from '@/lib/db';
import type { CurveRef } from './types';

export type CompareItemRow = CurveRef & { id: string; addedAt: Date };

type Raw = { id: string; version_id: string; file_id: string; x: string; y: string; added_at: Date };
const toRow = (r: Raw): CompareItemRow => ({ id: r.id, versionId: r.version_id, fileId: r.file_id, x: r.x, y: r.y, addedAt: new Date(r.added_at) });

/** The user's basket, oldest first (the order curves were added is the order they are numbered). */
export async function listCompareItems(userId: string): Promise<CompareItemRow[]> {
  const rows: Raw[] = await db()('compare_items').where({ user_id: userId }).orderBy([{ column: 'added_at' }, { column: 'id' }]).select('id', 'version_id', 'file_id', 'x', 'y', 'added_at');
  return rows.map(toRow);
}

export type InsertOutcome = { outcome: 'added' | 'present'; item: CompareItemRow } | { outcome: 'full'; count: number };

/**
 * Adds curves in one transaction that locks the user's row, so two tabs adding at once cannot pass the limit. A curve
 * already in the basket stays where it is; past `max` curves nothing more is added.
 */
export async function insertCompareItems(userId: string, refs: CurveRef[], max: number): Promise<InsertOutcome[]> {
  return db().transaction(async (trx) => {
    await trx('users').where({ id: userId }).forUpdate().first('id');
    const existing: Raw[] = await trx('compare_items').where({ user_id: userId }).select('id', 'version_id', 'file_id', 'x', 'y', 'added_at');
    let count = existing.length;
    const out: InsertOutcome[] = [];
    for (const ref of refs) {
      // The unique key compares with the column collation; so does this lookup.
      const same = await trx('compare_items').where({ user_id: userId, file_id: ref.fileId, x: ref.x, y: ref.y }).first('id', 'version_id', 'file_id', 'x', 'y', 'added_at');
      if (same) {
        out.push({ outcome: 'present', item: toRow(same) });
        continue;
      }
      if (count >= max) {
        out.push({ outcome: 'full', count });
        continue;
      }
      const id = randomUUID();
      // Millisecond timestamps from the client side of the transaction keep a batch in its given order.
      const addedAt = new Date(Date.now() + out.length);
      await trx('compare_items').insert({ id, user_id: userId, version_id: ref.versionId, file_id: ref.fileId, x: ref.x, y: ref.y, added_at: addedAt });
      count++;
      out.push({ outcome: 'added', item: { ...ref, id, addedAt } });
    }
    return out;
  });
}

export async function deleteCompareItem(userId: string, itemId: string): Promise<boolean> {
  return (await db()('compare_items').where({ user_id: userId, id: itemId }).delete()) > 0;
}

export async function deleteAllCompareItems(userId: string): Promise<number> {
  return db()('compare_items').where({ user_id: userId }).delete();
}

/** Where a verified file's bytes are kept (its content-addressed blob), or undefined. */
export async function fileStorageKey(fileId: string): Promise<string | undefined> {
  const row = await db()('files as f').join('blobs as b', 'b.sha256', 'f.sha256').where('f.id', fileId).where('f.upload_state', 'verified').first('b.storage_key');
  return row?.storage_key;
}
