'use client';

import Link from 'next/link';
import { signOut } from 'next-auth/react';

export type UserMenuProps = { user: { name: string; email: string } | null };

export function UserMenu({ user }: UserMenuProps) {
  if (!user) {
    return (
      <div className="flex items-center gap-2 text-sm">
        <Link href="/sign-in" className="rounded-md px-3 py-1.5 font-medium text-slate-100 hover:bg-slate-700">Sign in</Link>
        <Link href="/sign-up" className="rounded-md bg-copper-700 px-3 py-1.5 font-semibold text-white hover:bg-copper-800">Create account</Link>
      </div>
    );
  }
  return (
    <details className="relative">
      <summary className="cursor-pointer list-none rounded-md px-3 py-1.5 text-sm font-medium text-slate-100 hover:bg-slate-700" aria-label={`Account menu for ${user.name}`}>
        {user.name} <span aria-hidden="true">▾</span>
      </summary>
      <div className="absolute right-0 z-20 mt-1 w-56 rounded-md border border-slate-200 bg-white p-1 text-sm text-slate-800 shadow-lg">
        <p className="truncate px-3 py-2 text-xs text-slate-500">{user.email}</p>
        <Link href="/groups" className="block rounded px-3 py-2 hover:bg-slate-100">My groups</Link>
        <button type="button" onClick={() => signOut({ callbackUrl: '/' })} className="block w-full rounded px-3 py-2 text-left hover:bg-slate-100">
          Sign out
        </button>
      </div>
    </details>
  );
}
