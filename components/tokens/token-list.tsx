import { LocalTime } from '@/components/deposit/local-time';
import type { ActionState } from '@/lib/http/action';
import type { TokenView } from '@/lib/tokens/token-view';
import { RevokeTokenButton } from './revoke-token-button';

export type TokenListProps = {
  tokens: TokenView[];
  revokeAction: (prev: ActionState<unknown>, form: FormData) => Promise<ActionState<unknown>>;
};

const STATUS_STYLE: Record<TokenView['status'], string> = {
  active: 'bg-emerald-50 text-emerald-900 border-emerald-300',
  expired: 'bg-slate-100 text-slate-700 border-slate-300',
  revoked: 'bg-red-50 text-red-900 border-red-300',
};

function When({ iso, none }: { iso: string | null; none: string }) {
  return iso ? <LocalTime iso={iso} /> : <span className="text-slate-500">{none}</span>;
}

/** The user's tokens with scopes, dates and status; active ones can be revoked. */
export function TokenList({ tokens, revokeAction }: TokenListProps) {
  if (tokens.length === 0) return <p className="text-sm text-slate-600">No tokens yet. Create one above to script uploads from a lab PC.</p>;
  return (
    <ul className="flex flex-col gap-3">
      {tokens.map((t) => (
        <li key={t.id} className="flex flex-col gap-3 rounded-lg border border-slate-200 bg-white p-4 sm:flex-row sm:items-start sm:justify-between">
          <div className="min-w-0">
            <p className="flex flex-wrap items-center gap-2">
              <span className="font-semibold break-words">{t.name}</span>
              <span className={`rounded border px-1.5 py-0.5 text-xs ${STATUS_STYLE[t.status]}`}>{t.status}</span>
            </p>
            <p className="mt-1 font-mono text-sm text-slate-700">{t.displayPrefix}…</p>
            <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm text-slate-700">
              <dt className="text-slate-500">Scopes</dt><dd className="font-mono">{t.scopes.join(', ')}</dd>
              <dt className="text-slate-500">Created</dt><dd><When iso={t.createdAt} none="—" /></dd>
              <dt className="text-slate-500">Last used</dt><dd><When iso={t.lastUsedAt} none="never" /></dd>
              <dt className="text-slate-500">{t.status === 'revoked' ? 'Revoked' : 'Expires'}</dt>
              <dd>{t.status === 'revoked' ? <When iso={t.revokedAt} none="—" /> : <When iso={t.expiresAt} none="never" />}</dd>
            </dl>
          </div>
          {t.status === 'active' && <RevokeTokenButton tokenId={t.id} tokenName={t.name} action={revokeAction} />}
        </li>
      ))}
    </ul>
  );
}
