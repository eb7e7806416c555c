import { formatBytes } from '@/lib/format/bytes';
import type { LandingFile, SectionLock } from '@/lib/datasets/landing-types';
import { CopyButton } from './copy-button';
import { LockIcon } from './state-badges';

const ROLE_WORDS: Record<LandingFile['role'], string> = { raw: 'raw data', processed: 'processed data', other: 'other' };
// Below 640 px each row becomes a block with its own labels, so the 64-character SHA-256 keeps its width.
const CELL = 'px-3 py-2 align-top max-sm:block max-sm:px-0 max-sm:py-1';
const MOBILE_LABEL = 'mr-2 text-xs font-semibold text-slate-600 sm:hidden';

export type FilesTableProps = { files: LandingFile[]; lock: SectionLock | null };

/** Name, size and SHA-256 of every file, with a download link while the viewer may download. */
export function FilesTable({ files, lock }: FilesTableProps) {
  if (files.length === 0) return <p className="text-sm text-slate-600">This version has no files.</p>;
  const total = files.reduce((sum, f) => sum + f.sizeBytes, 0);
  return (
    <div className="flex flex-col gap-3">
      {lock && (
        <p className="flex items-start gap-2 rounded-md border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-950">
          <span className="mt-0.5"><LockIcon /></span>
          <span>{lock.reason}</span>
        </p>
      )}
      <p className="text-xs text-slate-600">
        {files.length} {files.length === 1 ? 'file' : 'files'}, {formatBytes(total)} in all. Check a download with <code className="font-mono">sha256sum</code>.
      </p>
      <table className="w-full text-sm max-sm:block">
        <caption className="sr-only">Files of this version with size and SHA-256 checksum</caption>
        <thead className="text-left text-xs tracking-wide text-slate-600 uppercase max-sm:sr-only">
          <tr>
            <th scope="col" className="px-3 py-1 font-medium">Name</th>
            <th scope="col" className="px-3 py-1 text-right font-medium">Size</th>
            <th scope="col" className="px-3 py-1 font-medium">SHA-256</th>
            <th scope="col" className="px-3 py-1 font-medium"><span className="sr-only">Download</span></th>
          </tr>
        </thead>
        <tbody className="max-sm:block">
          {files.map((f) => (
            <tr key={f.id} className="border-t border-slate-200 max-sm:block max-sm:py-3">
              <td className={`${CELL} sm:min-w-[10rem]`}>
                <span className="font-medium break-words text-slate-900">{f.name}</span>
                <span className="block text-xs text-slate-600">{ROLE_WORDS[f.role]}{f.mediaType ? ` · ${f.mediaType}` : ''}</span>
              </td>
              <td className={`${CELL} num whitespace-nowrap sm:text-right`}><span className={MOBILE_LABEL}>Size</span>{formatBytes(f.sizeBytes)}</td>
              <td className={CELL}>
                <span className={MOBILE_LABEL}>SHA-256</span>
                {f.sha256 ? (
                  <span className="flex flex-wrap items-center gap-2">
                    <code className="font-mono text-xs break-all text-slate-800 sm:max-w-[22rem]">{f.sha256}</code>
                    <CopyButton text={f.sha256} label={`Copy the SHA-256 of ${f.name}`} doneMessage="SHA-256 copied" />
                  </span>
                ) : '—'}
              </td>
              <td className={`${CELL} whitespace-nowrap`}>
                {f.downloadUrl ? (
                  <a href={f.downloadUrl} download className="rounded-md bg-copper-600 px-3 py-1.5 text-xs font-semibold text-white hover:bg-copper-700">
                    Download<span className="sr-only"> {f.name}</span>
                  </a>
                ) : (
                  <span className="inline-flex items-center gap-1 text-xs text-slate-600"><LockIcon /> Locked</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
