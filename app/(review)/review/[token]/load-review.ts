import 'server-only';
import { cache } from 'react';
import { resolveReviewerLink } from '@/lib/review/resolve-reviewer-link';

/** The link behind a token, resolved once per request for the layout, metadata and page. */
export const loadReviewLink = cache(async (token: string) => resolveReviewerLink(decodeURIComponent(token)));

/** Where the reviewer's page sends its links: back to itself, and downloads through the token. */
export function reviewPaths(token: string) {
  const base = `/review/${encodeURIComponent(token)}`;
  return { page: base, file: (fileId: string) => `${base}/files/${encodeURIComponent(fileId)}`, package: `${base}/package` };
}
