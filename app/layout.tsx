import type { Metadata } from 'next';
import type { ReactNode } from 'react';
import { SiteHeader } from '@/components/shell/site-header';
import { plexGreek, plexMono, plexSans } from './fonts';
import './globals.css';

// Every page carries the signed-in user's menu, so pages render per request.
export const dynamic = 'force-dynamic';

export const metadata: Metadata = {
  title: { default: 'Ohmstead — electrical-transport data hub', template: '%s · Ohmstead' },
  description: 'Deposit, review, publish, find and reuse electrical-transport datasets with their geometry, excitation and units.',
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${plexSans.variable} ${plexGreek.variable} ${plexMono.variable}`}>
      <body className="flex min-h-screen flex-col font-sans">
        <SiteHeader />
        <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">{children}</main>
        <footer className="border-t border-slate-200 py-6 text-center text-xs text-slate-500">
          Ohmstead · a data hub of the Meridian Transport Consortium (demo) · dates shown in your time zone, stored in UTC
        </footer>
      </body>
    </html>
  );
}
