// Who is asking, as far as COUNTER needs it: the client address and user agent of a request (never stored raw).
import { clientAddress } from '@/lib/http/client-address';

export type Viewer = { userId: string | null; ip: string | null; userAgent: string | null };

/** The client address (see lib/http/client-address.ts) and the user agent as sent. */
export function viewerFromHeaders(headers: Headers, userId: string | null = null): Viewer {
  return { userId, ip: clientAddress(headers), userAgent: headers.get('user-agent') };
}
