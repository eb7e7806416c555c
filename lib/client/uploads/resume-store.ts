import type { LocalFile, StorageLike } from './types';

/** What the browser keeps of an unfinished upload so it can be matched after a reload. */
export type ResumeRecord = {
  versionId: string;
  fileId: string;
  name: string;
  sizeBytes: number;
  lastModified: number;
  sha256: string;
  savedAt: number;
};

export const RESUME_KEY = 'ohmstead.uploads.v1';
/** The server clears unfinished uploads after 24 h (lib/analysis, lib/uploads); older records point at nothing. */
export const RESUME_MAX_AGE_MS = 24 * 60 * 60 * 1000;

function isRecord(v: unknown): v is ResumeRecord {
  const r = v as ResumeRecord;
  return !!r && typeof r.versionId === 'string' && typeof r.fileId === 'string' && typeof r.name === 'string'
    && typeof r.sizeBytes === 'number' && typeof r.lastModified === 'number' && /^[0-9a-f]{64}$/.test(String(r.sha256))
    && typeof r.savedAt === 'number';
}

export type ResumeStore = ReturnType<typeof createResumeStore>;

/** Resume records in one localStorage key; unreadable or full storage never breaks an upload, it only loses resume. */
export function createResumeStore(storage: StorageLike | null, now: () => number = Date.now) {
  function readAll(): ResumeRecord[] {
    if (!storage) return [];
    try {
      const parsed: unknown = JSON.parse(storage.getItem(RESUME_KEY) ?? '[]');
      return Array.isArray(parsed) ? parsed.filter(isRecord).filter((r) => now() - r.savedAt < RESUME_MAX_AGE_MS) : [];
    } catch {
      return [];
    }
  }
  function writeAll(records: ResumeRecord[]): void {
    if (!storage) return;
    try {
      if (records.length === 0) storage.removeItem(RESUME_KEY);
      else storage.setItem(RESUME_KEY, JSON.stringify(records));
    } catch {
      // quota exceeded or storage disabled: the upload goes on, only resume-after-reload is lost
    }
  }

  return {
    list(versionId: string): ResumeRecord[] {
      return readAll().filter((r) => r.versionId === versionId);
    },
    save(record: Omit<ResumeRecord, 'savedAt'>): void {
      writeAll([...readAll().filter((r) => r.fileId !== record.fileId), { ...record, savedAt: now() }]);
    },
    remove(fileId: string): void {
      const all = readAll();
      writeAll(all.filter((r) => r.fileId !== fileId));
    },
    /** Drops this version's records whose upload the server no longer has pending. */
    prune(versionId: string, pendingFileIds: Set<string>): void {
      writeAll(readAll().filter((r) => r.versionId !== versionId || pendingFileIds.has(r.fileId)));
    },
    /** The record of this very file (same name, size and modification time), if any. */
    findFor(versionId: string, file: LocalFile): ResumeRecord | undefined {
      return readAll().find((r) => r.versionId === versionId && r.name === file.name && r.sizeBytes === file.size
        && r.lastModified === file.lastModified);
    },
  };
}
