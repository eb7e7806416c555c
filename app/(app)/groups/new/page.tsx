import type { Metadata } from 'next';
import { CreateGroupForm } from '@/components/groups/create-group-form';
import { PageTitle } from '@/components/ui/page-title';
import { requireSignedIn } from '../../_auth/require-signed-in';
import { createGroupAction } from './actions';

export const metadata: Metadata = { title: 'Create a group' };
export const dynamic = 'force-dynamic';

export default async function NewGroupPage() {
  await requireSignedIn('/groups/new');
  return (
    <div className="mx-auto max-w-2xl">
      <PageTitle lead="A group is a lab or team that deposits and publishes together. You become its owner and can invite members, curators and further owners.">
        Create a group
      </PageTitle>
      <CreateGroupForm action={createGroupAction} />
    </div>
  );
}
