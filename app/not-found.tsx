import Link from 'next/link';

export default function NotFound() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold">Not found</h1>
      <p className="mt-2 text-slate-600">This page does not exist, or you do not have access to it. If someone sent you a link, check that it is complete.</p>
      <Link href="/" className="mt-6 inline-block text-copper-700 underline">Go to the home page</Link>
    </div>
  );
}
