// Pure: builds the Content-Security-Policy and the other security headers proxy.ts puts on every response.

export type SecurityEnv = {
  NEXTAUTH_URL?: string;
  S3_ENDPOINT?: string;
  S3_PUBLIC_ENDPOINT?: string;
  ORCID_ISSUER?: string;
  NODE_ENV?: string;
};

function originOf(url: string | undefined): string | null {
  if (!url) return null;
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

/** A fresh nonce per request: 128 random bits, base64 (CSP3 §2.3.1 nonce-source is base64-value). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

export function contentSecurityPolicy(nonce: string, e: SecurityEnv): string {
  // Browsers upload to and download from presigned object-store URLs directly.
  const objectStore = originOf(e.S3_PUBLIC_ENDPOINT) ?? originOf(e.S3_ENDPOINT);
  // next-auth answers the ORCID sign-in form with a redirect to the issuer; Chromium checks form-action on it.
  const orcid = originOf(e.ORCID_ISSUER);
  // React's development build evaluates strings for its stack traces; production never needs 'unsafe-eval' (the record
  // validator the deposit workspace runs in the browser is compiled ahead of time: lib/schema/generate-transport-dataset-validator.ts).
  const devEval = e.NODE_ENV === 'development' ? " 'unsafe-eval'" : '';
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic' 'wasm-unsafe-eval'${devEval}`,
    // uPlot and React `style` attributes set inline styles.
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    `connect-src 'self'${objectStore ? ` ${objectStore}` : ''}`,
    "font-src 'self'",
    "frame-ancestors 'none'",
    "base-uri 'self'",
    `form-action 'self'${orcid ? ` ${orcid}` : ''}`,
    "object-src 'none'",
  ];
  return directives.join('; ');
}

/** Every header for a response to `pathname`; HSTS only when the site is served over https (RFC 6797 §7.2). */
export function securityHeaders(pathname: string, nonce: string, e: SecurityEnv): Record<string, string> {
  const headers: Record<string, string> = {
    'Content-Security-Policy': contentSecurityPolicy(nonce, e),
    'X-Content-Type-Options': 'nosniff',
    // Reviewer links carry a secret token in the path: never leak it in a Referer.
    'Referrer-Policy': pathname === '/review' || pathname.startsWith('/review/') ? 'no-referrer' : 'strict-origin-when-cross-origin',
    'Permissions-Policy': 'camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()',
    'Cross-Origin-Opener-Policy': 'same-origin',
    'X-Frame-Options': 'DENY',
  };
  if (e.NEXTAUTH_URL?.startsWith('https://')) headers['Strict-Transport-Security'] = 'max-age=31536000; includeSubDomains';
  return headers;
}
