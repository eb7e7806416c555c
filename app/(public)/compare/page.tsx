import type { Metadata } from 'next';
import { CompareView } from '@/components/compare/compare-view';
import { PageTitle } from '@/components/ui/page-title';
import { currentUser } from '@/lib/auth/session';
import { getCompareBasket } from '@/lib/compare/get-compare-basket';

export const metadata: Metadata = { title: 'Compare curves' };
export const dynamic = 'force-dynamic';

// The account's basket is read here for signed-in visitors; a browser-kept basket is resolved by the client.
export default async function ComparePage() {
  const user = await currentUser();
  const initial = user ? await getCompareBasket({ user }) : null;
  return (
    <div>
      <PageTitle lead="Overlay curves from different labs in one set of units, normalise them, and export the plot or the data with each source's DOI.">
        Compare curves
      </PageTitle>
      <CompareView signedIn={Boolean(user)} initial={initial} />
    </div>
  );
}
