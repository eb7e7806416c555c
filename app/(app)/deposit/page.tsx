import type { Metadata } from 'next';
import Link from 'next/link';
import { DraftsList } from '@/components/deposit/drafts-list';
import { StartDatasetForm } from '@/components/deposit/start-dataset-form';
import { PageTitle } from '@/components/ui/page-title';
import { listDrafts } from '@/lib/datasets/list-drafts';
import { groupsOfUser } from '@/lib/groups/repo';
import { requireSignedIn } from '../_auth/require-signed-in';
import { startDatasetAction } from './actions';

export const metadata: Metadata = { title: 'Deposit' };
export const dynamic = 'force-dynamic';

export default async function DepositPage() {
  const user = await requireSignedIn('/deposit');
  const [groups, drafts] = await Promise.all([groupsOfUser(user.id), listDrafts(user)]);
  return (
    <div className="flex flex-col gap-8">
      <PageTitle lead="Start a dataset in one of your groups, add its files, check how the columns were read, and describe the measurement. Drafts save as you go; only your group sees them.">
        Deposit
      </PageTitle>
      <section aria-labelledby="start-heading" className="rounded-lg border border-slate-200 bg-white p-6">
        <h2 id="start-heading" className="text-lg font-semibold">Start a dataset</h2>
        {groups.length === 0 ? (
          <p className="mt-2 text-sm text-slate-600">
            You are not in a group yet, and datasets belong to groups. Ask a group owner to invite you; the{' '}
            <Link href="/groups" className="text-copper-700 underline">groups page</Link> lists who they are.
          </p>
        ) : (
          <StartDatasetForm action={startDatasetAction} groups={groups.map((g) => ({ slug: g.slug, name: g.name }))} />
        )}
      </section>
      <section aria-labelledby="drafts-heading">
        <h2 id="drafts-heading" className="mb-3 text-lg font-semibold">Drafts of your groups</h2>
        <DraftsList drafts={drafts} />
      </section>
    </div>
  );
}
