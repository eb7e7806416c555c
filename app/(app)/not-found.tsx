import Link from 'next/link';

export default function AuthoringNotFound() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold">Draft not found</h1>
      <p className="mt-2 text-slate-600">
        This draft does not exist, or it belongs to a group you are not in. Drafts are visible only to the depositors and
        curators of their group.
      </p>
      <Link href="/deposit" className="mt-6 inline-block text-copper-700 underline">Go to your drafts</Link>
    </div>
  );
}
