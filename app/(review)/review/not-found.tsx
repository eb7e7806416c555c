import Link from 'next/link';
import { LINK_PROBLEM_MESSAGES } from '@/lib/review/resolve-reviewer-link';

/** An unknown token, a mistyped or cut-off address, or a version that is gone: one answer for all. */
export default function ReviewLinkNotFound() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold">Review link not found</h1>
      <p className="mt-2 text-slate-700">{LINK_PROBLEM_MESSAGES.not_found}</p>
      <Link href="/" className="mt-6 inline-block text-copper-700 underline">Go to the home page</Link>
    </div>
  );
}
