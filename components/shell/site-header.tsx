import Link from 'next/link';
import { currentUser } from '@/lib/auth/session';
import { OhmsteadMark } from './ohmstead-mark';
import { UserMenu } from './user-menu';

const NAV = [
  { href: '/search', label: 'Search' },
  { href: '/groups', label: 'Groups' },
  { href: '/compare', label: 'Compare' },
  { href: '/api-docs', label: 'API' },
];

export async function SiteHeader() {
  const user = await currentUser();
  return (
    <header className="bg-slate-900 text-slate-100">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:rounded focus:bg-white focus:px-3 focus:py-2 focus:text-slate-900">
        Skip to content
      </a>
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" className="flex items-center gap-2 text-lg font-semibold tracking-tight">
          <OhmsteadMark /> Ohmstead
        </Link>
        <form action="/search" method="get" role="search" className="order-last w-full sm:order-none sm:w-auto sm:flex-1">
          <label htmlFor="header-search" className="sr-only">Search datasets</label>
          <input
            id="header-search"
            name="q"
            type="search"
            placeholder="Search curves: material, quantity, method…"
            className="w-full rounded-md border border-slate-600 bg-slate-800 px-3 py-1.5 text-sm text-slate-100 placeholder:text-slate-400"
          />
        </form>
        <nav aria-label="Main" className="flex items-center gap-1 text-sm">
          {(user ? [...NAV, { href: '/deposit', label: 'Deposit' }] : NAV).map((item) => (
            <Link key={item.href} href={item.href} className="rounded-md px-3 py-1.5 text-slate-200 hover:bg-slate-700 hover:text-white">
              {item.label}
            </Link>
          ))}
        </nav>
        <UserMenu user={user ? { name: user.name, email: user.email } : null} />
      </div>
    </header>
  );
}
