import Link from 'next/link';

export default function GroupNotFound() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold">Group not found</h1>
      <p className="mt-2 text-slate-600">There is no group at this address. Groups keep their address once created; check the link.</p>
      <Link href="/groups" className="mt-6 inline-block text-copper-700 underline">All groups</Link>
    </div>
  );
}
