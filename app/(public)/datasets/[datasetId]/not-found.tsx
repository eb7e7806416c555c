import Link from 'next/link';

/**
 * A version that disappears between the layout's check and the page (the page streams, so this shows in place).
 * Same words for unknown and hidden versions, so nothing confirms a hidden one exists.
 */
export default function DatasetNotFound() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold">Dataset not found</h1>
      <p className="mt-2 text-slate-600">
        We could not find this dataset version, or you do not have access to it. If you were sent a link, check that it is complete;
        if the dataset belongs to your group, sign in first.
      </p>
      <p className="mt-6 flex justify-center gap-6">
        <Link href="/search" className="text-copper-700 underline">Search published datasets</Link>
        <Link href="/sign-in" className="text-copper-700 underline">Sign in</Link>
      </p>
    </div>
  );
}
