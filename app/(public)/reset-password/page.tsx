import type { Metadata } from 'next';
import { ResetRequestForm } from '@/components/auth/reset-request-form';
import { PageTitle } from '@/components/ui/page-title';
import { requestResetAction } from './actions';

export const metadata: Metadata = { title: 'Reset password' };

export default function ResetPasswordPage() {
  return (
    <div className="mx-auto max-w-md">
      <PageTitle lead="We e-mail you a link to choose a new password.">Reset your password</PageTitle>
      <ResetRequestForm action={requestResetAction} />
    </div>
  );
}
