import { LocalDateTime } from '@/components/dataset/local-date-time';

export type ReviewBandProps = { expiresAt: string; anonymous: boolean };

/** The band across every reviewer page: what this copy is and how to treat it. */
export function ReviewBand({ expiresAt, anonymous }: ReviewBandProps) {
  return (
    <div role="note" aria-label="Confidential review copy" className="mb-6 rounded-lg border-2 border-copper-600 bg-copper-50 px-4 py-3 text-sm text-slate-900">
      <p className="text-base font-semibold tracking-tight text-copper-900">Confidential review copy — do not share</p>
      <p className="mt-1">
        You are reading this dataset through a private review link, valid until <LocalDateTime iso={expiresAt} />. Please keep the link and
        the files to yourself and delete your copies when the review is done.
      </p>
      <p className="mt-1 text-slate-700">
        {anonymous ? 'Authors, group and affiliations are hidden in this copy. ' : ''}
        The authors can see when the link was used, never who used it. No account is needed.
      </p>
    </div>
  );
}
