import Link from 'next/link';
import { LINK_PROBLEM_MESSAGES, type LinkProblem } from '@/lib/review/resolve-reviewer-link';

const TITLES: Readonly<Record<LinkProblem['reason'], string>> = {
  not_found: 'Review link not found',
  expired: 'Review link expired',
  revoked: 'Review link revoked',
};

/** The page an expired or revoked link shows: what happened and the one next step (ask the authors). */
export function LinkProblemPage({ reason }: { reason: LinkProblem['reason'] }) {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold text-slate-900">{TITLES[reason]}</h1>
      <p className="mt-2 text-slate-700">{LINK_PROBLEM_MESSAGES[reason]}</p>
      <p className="mt-2 text-sm text-slate-600">If you review through a journal, its editorial office can pass your request on without telling the authors who you are.</p>
      <Link href="/" className="mt-6 inline-block text-copper-700 underline">Go to the home page</Link>
    </div>
  );
}
