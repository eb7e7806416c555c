// Pure: tells a cross-site browser request from a same-origin one, for CSRF checks on cookie-authenticated mutations.

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export const CROSS_SITE_MESSAGE =
  'This request came from another site and was refused: changes through a signed-in browser session must come from Ohmstead itself. Scripts should send an API token (Authorization: Bearer).';

/**
 * True when a state-changing request was sent by a page on another origin. Browsers send Origin on every non-GET
 * fetch and form post (Fetch standard §3.1) and Sec-Fetch-Site where supported; a request with neither is not from
 * a browser page, so it carries no ambient-credential risk.
 */
export function isCrossSiteMutation(req: Request, siteOrigin: string): boolean {
  if (SAFE_METHODS.has(req.method.toUpperCase())) return false;
  const origin = req.headers.get('origin');
  if (origin !== null) return origin === 'null' || origin !== siteOrigin;
  const fetchSite = req.headers.get('sec-fetch-site');
  return fetchSite === 'cross-site' || fetchSite === 'same-site';
}
