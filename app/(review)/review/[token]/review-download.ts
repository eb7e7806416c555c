import 'server-only';
import { randomUUID } from 'node:crypto';
import { AccessDeniedError } from '@/lib/access';
import { replyResponse, type DownloadReply } from '@/lib/downloads/reply';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log';
import { LINK_PROBLEM_MESSAGES, resolveReviewerLink, type LinkProblem, type ResolvedLink } from '@/lib/review/resolve-reviewer-link';

const LINK_TITLES: Readonly<Record<LinkProblem['reason'], string>> = {
  not_found: 'Review link not found',
  expired: 'Review link expired',
  revoked: 'Review link revoked',
};

// Review downloads are private: no index, no cache, and the token in the address never leaves in a Referer header.
const PRIVATE_HEADERS = { 'cache-control': 'private, no-store, no-transform', 'referrer-policy': 'no-referrer', 'x-robots-tag': 'noindex, nofollow' };

const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** A small self-contained page for a refused download (a browser shows it in place of the file). */
function problemPage(status: number, title: string, message: string, requestId: string): Response {
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex, nofollow"><title>${escapeHtml(title)} · Ohmstead</title>
<style>body{font-family:system-ui,sans-serif;color:#0f172a;background:#f8fafc;max-width:36rem;margin:4rem auto;padding:0 1rem;line-height:1.5}h1{font-size:1.5rem}small{color:#475569}</style></head>
<body><main><h1>${escapeHtml(title)}</h1><p>${escapeHtml(message)}</p>
<p><a href="/">Go to the Ohmstead home page</a></p><p><small>Request id ${escapeHtml(requestId)}</small></p></main></body></html>
`;
  return new Response(html, { status, headers: { 'content-type': 'text/html; charset=utf-8', 'x-request-id': requestId, ...PRIVATE_HEADERS } });
}

/**
 * Runs a download through a reviewer link: the token is resolved first (unknown, tampered or truncated → 404, all on
 * the same path; expired or revoked → 403), then `download` gets the link. Refusals and failures answer a plain page.
 */
export async function reviewDownload(
  req: Request, token: string, download: (link: ResolvedLink, requestId: string) => Promise<DownloadReply>,
): Promise<Response> {
  const requestId = req.headers.get('x-request-id') ?? randomUUID();
  const link = await resolveReviewerLink(token);
  if (!link.ok) return problemPage(link.reason === 'not_found' ? 404 : 403, LINK_TITLES[link.reason], LINK_PROBLEM_MESSAGES[link.reason], requestId);
  try {
    const response = replyResponse(await download(link, requestId));
    for (const [name, value] of Object.entries({ ...PRIVATE_HEADERS, 'x-request-id': requestId })) response.headers.set(name, value);
    return response;
  } catch (error) {
    if (error instanceof AccessDeniedError) return problemPage(error.status, 'Download not available', error.message, requestId);
    if (error instanceof AppError) {
      if (error.code === 'internal') log('error', 'review download failed', { requestId, error: error.message });
      return problemPage(error.status, error.status >= 500 ? 'Download failed' : 'Download not available', error.message, requestId);
    }
    log('error', 'review download failed', { requestId, error: error instanceof Error ? error.stack : String(error) });
    return problemPage(500, 'Download failed', 'Something went wrong on our side. Try again; if it persists, tell the authors the request id.', requestId);
  }
}
