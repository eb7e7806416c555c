import { notFound } from 'next/navigation';
import type { ReactNode } from 'react';
import { currentUser } from '@/lib/auth/session';

// Site administration: only site admins; everyone else gets the plain 404, so the pages do not announce themselves.
// Each page checks again on its own (layouts are not re-run on every navigation).
export default async function AdminLayout({ children }: { children: ReactNode }) {
  const user = await currentUser();
  if (user?.siteRole !== 'admin') notFound();
  return (
    <div className="flex flex-col gap-4">
      <p className="w-fit rounded-full bg-slate-800 px-3 py-1 text-xs font-semibold uppercase tracking-wide text-slate-100">Site administration</p>
      {children}
    </div>
  );
}
