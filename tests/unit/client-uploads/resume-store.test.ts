import { File } from 'node:buffer';
import { describe, expect, it } from 'vitest';
import { RESUME_KEY, RESUME_MAX_AGE_MS, createResumeStore } from '@/lib/client/uploads/resume-store';
import type { LocalFile } from '@/lib/client/uploads/types';
import { MemoryStorage } from './fake-upload-server';

const SHA = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';
const rec = (fileId: string, versionId = 'v1', name = 'sweep-300K.csv') => ({ versionId, fileId, name, sizeBytes: 3, lastModified: 1_700_000_000_000, sha256: SHA });

describe('resume records in localStorage', () => {
  it('keeps, lists per version, matches by name, size and modification time, and removes', () => {
    const storage = new MemoryStorage();
    const store = createResumeStore(storage, () => 5000);
    store.save(rec('f1'));
    store.save(rec('f2', 'v2'));
    store.save({ ...rec('f1'), sha256: SHA.replace('b', 'c') }); // same file id replaces its record
    expect(store.list('v1')).toEqual([{ ...rec('f1'), sha256: SHA.replace('b', 'c'), savedAt: 5000 }]);
    const same = new File(['abc'], 'sweep-300K.csv', { lastModified: 1_700_000_000_000 }) as unknown as LocalFile;
    const touched = new File(['abc'], 'sweep-300K.csv', { lastModified: 1_700_000_000_001 }) as unknown as LocalFile;
    expect(store.findFor('v1', same)?.fileId).toBe('f1');
    expect(store.findFor('v1', touched)).toBeUndefined();
    expect(store.findFor('v2', same)?.fileId).toBe('f2');
    store.remove('f1');
    store.remove('f2');
    expect(storage.map.has(RESUME_KEY)).toBe(false);
  });

  it('forgets records older than the server keeps unfinished uploads, and prunes those the server no longer has', () => {
    let now = 0;
    const store = createResumeStore(new MemoryStorage(), () => now);
    store.save(rec('old'));
    now = RESUME_MAX_AGE_MS - 1;
    store.save(rec('f2'));
    store.save(rec('f3'));
    store.save(rec('other-version', 'v9'));
    expect(store.list('v1').map((r) => r.fileId)).toEqual(['old', 'f2', 'f3']);
    now = RESUME_MAX_AGE_MS;
    expect(store.list('v1').map((r) => r.fileId)).toEqual(['f2', 'f3']);
    store.prune('v1', new Set(['f3']));
    expect(store.list('v1').map((r) => r.fileId)).toEqual(['f3']);
    expect(store.list('v9').map((r) => r.fileId)).toEqual(['other-version']);
  });

  it('survives broken JSON, foreign entries, a full quota and missing storage', () => {
    const storage = new MemoryStorage();
    storage.setItem(RESUME_KEY, '{not json');
    const store = createResumeStore(storage, () => 1);
    expect(store.list('v1')).toEqual([]);
    storage.setItem(RESUME_KEY, JSON.stringify([{ fileId: 'x' }, { ...rec('ok'), savedAt: 1 }, { ...rec('bad'), sha256: 'xyz', savedAt: 1 }]));
    expect(store.list('v1').map((r) => r.fileId)).toEqual(['ok']);
    storage.setItem = () => { throw new Error('QuotaExceededError'); };
    expect(() => store.save(rec('f9'))).not.toThrow();
    expect(store.list('v1').map((r) => r.fileId)).toEqual(['ok']);
    const none = createResumeStore(null);
    none.save(rec('f1'));
    expect(none.list('v1')).toEqual([]);
  });
});
