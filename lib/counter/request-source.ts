// Who is asking, as far as COUNTER needs it: the client address and user agent of a request (never stored raw).

export type Viewer = { userId: string | null; ip: string | null; userAgent: string | null };

/** The first X-Forwarded-For address (set by our reverse proxy), else X-Real-IP; the user agent as sent. */
export function viewerFromHeaders(headers: Headers, userId: string | null = null): Viewer {
  const forwarded = headers.get('x-forwarded-for')?.split(',')[0]?.trim();
  const ip = forwarded || headers.get('x-real-ip')?.trim() || null;
  return { userId, ip, userAgent: headers.get('user-agent') };
}
