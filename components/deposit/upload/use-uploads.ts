'use client';

import { useRouter } from 'next/navigation';
import { useEffect, useState, useSyncExternalStore } from 'react';
import { createUploadApi } from '@/lib/client/uploads/api-client';
import { createResumeStore } from '@/lib/client/uploads/resume-store';
import type { FileView, StorageLike } from '@/lib/client/uploads/types';
import { createUploadManager, type UploadManager } from '@/lib/client/uploads/upload-manager';
import type { UploadRow } from '@/lib/client/uploads/upload-state';

/** localStorage, or null where it is missing or refused (server render, strict privacy settings). */
function browserStorage(): StorageLike | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

/** One upload manager per mounted widget, its rows as React state, and a sentence for the live region. */
export function useUploads(versionId: string, initialFiles: FileView[], onChange?: (files: FileView[]) => void) {
  const router = useRouter();
  const [announcement, setAnnouncement] = useState('');

  const [manager] = useState<UploadManager>(() => {
    const m = createUploadManager({
      versionId,
      api: createUploadApi({ fetch: (input, init) => fetch(input, init) }),
      store: createResumeStore(browserStorage()),
      announce: setAnnouncement,
    });
    m.load(initialFiles); // no network or storage: safe while rendering on the server too
    return m;
  });

  useEffect(() => manager.watchFiles((files) => (onChange ? onChange(files) : router.refresh())), [manager, onChange, router]);

  const rows: readonly UploadRow[] = useSyncExternalStore(manager.subscribe, manager.getSnapshot, manager.getSnapshot);

  useEffect(() => {
    manager.sync(initialFiles);
  }, [manager, initialFiles]);

  useEffect(() => {
    manager.start();
    const warn = (event: BeforeUnloadEvent) => {
      if (manager.isBusy()) event.preventDefault(); // the browser asks "leave the page?"; records allow a resume anyway
    };
    window.addEventListener('beforeunload', warn);
    return () => {
      window.removeEventListener('beforeunload', warn);
      manager.stop();
    };
  }, [manager]);

  return { manager, rows, announcement };
}
