import { Notice } from '@/components/ui/notice';
import { CopyButton } from './copy-button';

export type NewTokenNoticeProps = { name: string; token: string };

/** The secret of a token just made: shown this once, with a copy button and a usage line. */
export function NewTokenNotice({ name, token }: NewTokenNoticeProps) {
  return (
    <Notice tone="success" title={`Token “${name}” created`}>
      <p className="mt-1">Copy it now: Ohmstead keeps only a hash and cannot show it again.</p>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <label htmlFor="new-token" className="sr-only">New token</label>
        <input
          id="new-token"
          readOnly
          value={token}
          onFocus={(e) => e.currentTarget.select()}
          className="w-full max-w-xl rounded-md border border-emerald-400 bg-white px-3 py-2 font-mono text-sm text-slate-900"
        />
        <CopyButton text={token} label="Copy token" />
      </div>
      <p className="mt-3 text-xs">
        Send it as <code className="font-mono">Authorization: Bearer {token.slice(0, 12)}…</code> to any <code className="font-mono">/api/v1</code> route.
        Keep it out of shared notebooks and version control.
      </p>
    </Notice>
  );
}
