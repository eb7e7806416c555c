import type { Metadata } from 'next';
import { NewPasswordForm } from '@/components/auth/new-password-form';
import { PageTitle } from '@/components/ui/page-title';
import { resetPasswordAction } from '../actions';

export const metadata: Metadata = { title: 'Choose a new password' };

export default async function NewPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <div className="mx-auto max-w-md">
      <PageTitle>Choose a new password</PageTitle>
      <NewPasswordForm token={token} action={resetPasswordAction} />
    </div>
  );
}
