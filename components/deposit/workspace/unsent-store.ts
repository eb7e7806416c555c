// Edits not yet accepted by the server are kept in this browser until they are, so a reload, a dropped connection or
// a sign-out loses nothing. The server stays the source of truth: a kept copy older than the server's is only offered.

export type UnsentEdit = { record: unknown; editedAt: number };
type StorageLike = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

const key = (versionId: string) => `ohmstead:unsent-metadata:${versionId}`;

export function readUnsent(storage: StorageLike | undefined, versionId: string): UnsentEdit | null {
  try {
    const raw = storage?.getItem(key(versionId));
    if (!raw) return null;
    const parsed = JSON.parse(raw) as Partial<UnsentEdit>;
    return typeof parsed.editedAt === 'number' && 'record' in parsed ? { record: parsed.record, editedAt: parsed.editedAt } : null;
  } catch {
    return null;
  }
}

export function writeUnsent(storage: StorageLike | undefined, versionId: string, edit: UnsentEdit): void {
  try {
    storage?.setItem(key(versionId), JSON.stringify(edit));
  } catch {
    // Storage full or disabled: the debounced save is then the only copy, as without this store.
  }
}

export function clearUnsent(storage: StorageLike | undefined, versionId: string): void {
  try {
    storage?.removeItem(key(versionId));
  } catch {
    // Nothing to clear when storage is disabled.
  }
}

export type UnsentDecision = 'none' | 'restore' | 'offer';

/**
 * What to do with a kept copy on load: nothing when it equals the server's record; restore it when it was edited
 * after the server's last save (it simply never arrived); otherwise offer it, since someone saved after it.
 */
export function decideUnsent(unsent: UnsentEdit | null, serverRecord: unknown, serverUpdatedAt: string): UnsentDecision {
  if (!unsent) return 'none';
  if (JSON.stringify(unsent.record) === JSON.stringify(serverRecord)) return 'none';
  return unsent.editedAt > Date.parse(serverUpdatedAt) ? 'restore' : 'offer';
}
