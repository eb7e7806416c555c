import 'server-only';
import { env } from '@/lib/env';

/** The reviewer's address: `${NEXTAUTH_URL}/review/${token}`; built only where the token is at hand (creation, mail). */
export function reviewUrl(token: string): string {
  return `${env().NEXTAUTH_URL.replace(/\/+$/, '')}/review/${encodeURIComponent(token)}`;
}
