import type { Metadata } from 'next';
import type { ReactNode } from 'react';

// Review copies are private: never indexed, and the token in the address never leaves in a Referer header.
export const metadata: Metadata = {
  robots: { index: false, follow: false, nocache: true, googleBot: { index: false, follow: false } },
  referrer: 'no-referrer',
};

export default function ReviewLayout({ children }: { children: ReactNode }) {
  return children;
}
