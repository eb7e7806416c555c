import 'server-only';
import { env } from '@/lib/env';

/** The invitee's address: `${NEXTAUTH_URL}/invitations/${token}`; built only where the token is at hand (the mail). */
export function invitationUrl(token: string): string {
  return `${env().NEXTAUTH_URL.replace(/\/+$/, '')}/invitations/${encodeURIComponent(token)}`;
}
