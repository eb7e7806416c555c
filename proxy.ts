import { NextResponse, type NextRequest } from 'next/server';
import { newNonce, securityHeaders } from '@/lib/http/security-headers';

/**
 * Next 16 proxy (formerly middleware): a per-request CSP nonce plus the security headers. The CSP also goes on the
 * request headers so Next finds the nonce and stamps it on its own scripts while rendering.
 */
export function proxy(request: NextRequest): NextResponse {
  const nonce = newNonce();
  // Named reads: the bundler inlines process.env.NODE_ENV only when it is spelled out.
  const headers = securityHeaders(request.nextUrl.pathname, nonce, {
    NEXTAUTH_URL: process.env.NEXTAUTH_URL,
    S3_ENDPOINT: process.env.S3_ENDPOINT,
    S3_PUBLIC_ENDPOINT: process.env.S3_PUBLIC_ENDPOINT,
    ORCID_ISSUER: process.env.ORCID_ISSUER,
    NODE_ENV: process.env.NODE_ENV,
  });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('x-nonce', nonce);
  requestHeaders.set('Content-Security-Policy', headers['Content-Security-Policy']!);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  for (const [name, value] of Object.entries(headers)) response.headers.set(name, value);
  return response;
}

export const config = {
  // Static build output is immutable and carries no HTML; everything else (pages and API routes) gets the headers.
  matcher: ['/((?!_next/static|_next/image|favicon.ico).*)'],
};
