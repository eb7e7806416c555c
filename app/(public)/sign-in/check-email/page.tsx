import type { Metadata } from 'next';
import { PageTitle } from '@/components/ui/page-title';

export const metadata: Metadata = { title: 'Check your e-mail' };

export default function CheckEmailPage() {
  return (
    <div className="mx-auto max-w-xl">
      <PageTitle lead="If the address belongs to an account, a sign-in link is on its way. Open it on this device within 15 minutes.">
        Check your e-mail
      </PageTitle>
      <p className="text-sm text-slate-600">Nothing arrived? Look in the spam folder, or go back and ask for a new link.</p>
    </div>
  );
}
