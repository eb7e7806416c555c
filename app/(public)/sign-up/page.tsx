import type { Metadata } from 'next';
import Link from 'next/link';
import { SignUpForm } from '@/components/auth/sign-up-form';
import { PageTitle } from '@/components/ui/page-title';
import { signUpAction } from './actions';

export const metadata: Metadata = { title: 'Create account' };

export default function SignUpPage() {
  return (
    <div className="mx-auto max-w-md">
      <PageTitle lead={<>Already have one? <Link href="/sign-in" className="text-copper-700 underline">Sign in</Link>.</>}>Create an account</PageTitle>
      <SignUpForm action={signUpAction} />
    </div>
  );
}
