import { notFound } from 'next/navigation';
import type { ReactNode } from 'react';
import { loadReviewLink } from './load-review';
import { ReviewBand } from './review-band';

type Props = { children: ReactNode; params: Promise<{ token: string }> };

/**
 * Resolves the token before anything streams, so an unknown, tampered or truncated token answers HTTP 404; a live
 * link gets the confidentiality band, an expired or revoked one the page's own explanation.
 */
export default async function ReviewTokenLayout({ children, params }: Props) {
  const link = await loadReviewLink((await params).token);
  if (!link.ok && link.reason === 'not_found') notFound();
  return (
    <>
      {link.ok && <ReviewBand expiresAt={link.grant.expiresAt.toISOString()} anonymous={link.grant.anonymous} />}
      {children}
    </>
  );
}
