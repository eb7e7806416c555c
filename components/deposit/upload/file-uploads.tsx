'use client';

import { useState } from 'react';
import { Notice } from '@/components/ui/notice';
import { formatBytes } from '@/lib/format/bytes';
import { plural } from '@/lib/format/plural';
import type { FileView } from '@/lib/client/uploads/types';
import { DropZone } from './drop-zone';
import { FileRow } from './file-row';
import { useUploads } from './use-uploads';

export type FileUploadsProps = {
  versionId: string;
  /** The version's files as the server lists them (verified ones, and uploads left unfinished). */
  initialFiles: FileView[];
  /** The viewer may change this draft ('edit'); otherwise the list is read-only. */
  canEdit: boolean;
  /** Told when a file becomes verified or analysed, changes role or is removed; without it the page is refreshed. */
  onChange?: (files: FileView[]) => void;
};

/** The draft's Files section: drop zone and picker, then one row per file with its own progress. */
export function FileUploads({ versionId, initialFiles, canEdit, onChange }: FileUploadsProps) {
  const { manager, rows, announcement } = useUploads(versionId, initialFiles, onChange);
  const [refusals, setRefusals] = useState<string[]>([]);
  const storedBytes = rows.reduce((sum, r) => sum + (r.file?.uploadState === 'verified' ? r.sizeBytes : 0), 0);
  const stored = rows.filter((r) => r.file?.uploadState === 'verified').length;

  return (
    <div className="flex flex-col gap-4">
      {canEdit && (
        <DropZone onFiles={(files, refused) => setRefusals([...refused, ...manager.addFiles(files)])} />
      )}
      {refusals.length > 0 && (
        <Notice tone="error" title="Not added">
          <ul className="list-disc pl-5">{refusals.map((r) => <li key={r}>{r}</li>)}</ul>
        </Notice>
      )}
      {rows.length === 0 ? (
        <p className="text-sm text-slate-600">{canEdit ? 'No files yet. Add the exports this dataset is built from.' : 'No files in this version yet.'}</p>
      ) : (
        <>
          <p className="num text-sm text-slate-600">{plural(stored, 'file')} stored · {formatBytes(storedBytes)}</p>
          <ul className="flex flex-col gap-3" aria-label="Files of this draft">
            {rows.map((row) => <FileRow key={row.key} row={row} manager={manager} canEdit={canEdit} />)}
          </ul>
        </>
      )}
      <p role="status" aria-live="polite" className="sr-only">{announcement}</p>
    </div>
  );
}
