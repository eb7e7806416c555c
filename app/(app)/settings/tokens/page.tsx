import type { Metadata } from 'next';
import { CreateTokenForm } from '@/components/tokens/create-token-form';
import { TokenList } from '@/components/tokens/token-list';
import { PageTitle } from '@/components/ui/page-title';
import { listTokens } from '@/lib/tokens/list-tokens';
import { orcidOfUser } from '@/lib/users/orcid-of-user';
import { requireSignedIn } from '../../_auth/require-signed-in';
import { createTokenAction, revokeTokenAction } from './actions';

export const metadata: Metadata = { title: 'API tokens' };
export const dynamic = 'force-dynamic';

export default async function TokensPage() {
  const user = await requireSignedIn('/settings/tokens');
  const [tokens, orcid] = await Promise.all([listTokens({ id: user.id, via: 'session' }), orcidOfUser(user.id)]);
  return (
    <div className="flex flex-col gap-8">
      <PageTitle lead="Personal access tokens let scripts on a lab PC use the Ohmstead API as you, limited to the scopes you choose. Each token is shown once; revoke any you no longer use.">
        API tokens
      </PageTitle>
      <section aria-labelledby="account-heading" className="rounded-lg border border-slate-200 bg-white p-4 text-sm">
        <h2 id="account-heading" className="sr-only">Your account</h2>
        <p>
          Signed in as <span className="font-semibold">{user.name}</span>
          {!user.email.endsWith('.invalid') && <> ({user.email})</>}
        </p>
        <p className="mt-1" data-testid="account-orcid">
          {orcid ? <>ORCID iD <span className="font-mono">{orcid}</span></> : 'No ORCID iD linked. Sign in with ORCID once to link yours.'}
        </p>
      </section>
      <CreateTokenForm action={createTokenAction} />
      <section aria-labelledby="tokens-heading">
        <h2 id="tokens-heading" className="mb-3 text-lg font-semibold">Your tokens</h2>
        <TokenList tokens={tokens} revokeAction={revokeTokenAction} />
      </section>
    </div>
  );
}
