import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import { env } from '@/lib/env';
import { clientAddress } from '@/lib/http/client-address';
import { recordAudit } from '@/lib/audit/record-audit';
import { knexAdapter } from './repo-adapter';
import { signInWithPassword } from './sign-in-with-password';
import { sendSignInLink } from './send-sign-in-link';
import { linkOrcidSignIn, OrcidSignInError } from '@/lib/users/link-orcid-account';
import { claimsFromIdToken, ORCID_PROVIDER_ID, orcidProvider, type OrcidIdToken } from './orcid-provider';

function clientIp(headers: Record<string, unknown> | undefined): string {
  return clientAddress(headers) ?? 'unknown';
}

export function authOptions(): NextAuthOptions {
  const { NEXTAUTH_SECRET, MAIL_FROM, NEXTAUTH_URL } = env();
  const orcid = orcidProvider();
  return {
    secret: NEXTAUTH_SECRET,
    adapter: knexAdapter(),
    session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
    pages: { signIn: '/sign-in', verifyRequest: '/sign-in/check-email', error: '/sign-in' },
    providers: [
      CredentialsProvider({
        id: 'credentials',
        name: 'E-mail and password',
        credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
        authorize: async (credentials, req) =>
          signInWithPassword({ email: credentials?.email ?? '', password: credentials?.password ?? '', ip: clientIp(req.headers) }),
      }),
      EmailProvider({
        from: MAIL_FROM,
        maxAge: 15 * 60,
        // next-auth's default sender would open its own connection; ours goes through lib/mail.
        server: 'smtp://unused.invalid',
        sendVerificationRequest: ({ identifier, url }) => sendSignInLink(identifier, url),
      }),
      ...(orcid ? [orcid] : []),
    ],
    callbacks: {
      // Runs before next-auth looks the account up: links the ORCID iD to the right user (or makes one), so the
      // adapter then finds it. Refusals go back to the sign-in page with a code it explains.
      async signIn({ account, profile }) {
        if (account?.provider !== ORCID_PROVIDER_ID) return true;
        try {
          await linkOrcidSignIn(claimsFromIdToken(profile as OrcidIdToken));
          return true;
        } catch (error) {
          if (error instanceof OrcidSignInError) return `${NEXTAUTH_URL.replace(/\/$/, '')}/sign-in?error=orcid_${error.refusal}`;
          throw error;
        }
      },
      async jwt({ token, user }) {
        if (user) {
          token.uid = user.id;
          token.siteRole = user.siteRole ?? 'user';
        }
        return token;
      },
      async session({ session, token }) {
        session.user = { id: token.uid ?? '', email: token.email ?? '', name: token.name ?? '', siteRole: token.siteRole ?? 'user' };
        return session;
      },
    },
    events: {
      async signIn({ user, account }) {
        await recordAudit({ action: 'user.sign_in', actorKind: 'user', actorUserId: user.id, targetType: 'user', targetId: user.id, details: { method: account?.provider ?? 'unknown' } });
      },
      async signOut({ token }) {
        if (token?.uid) await recordAudit({ action: 'user.sign_out', actorKind: 'user', actorUserId: token.uid, targetType: 'user', targetId: token.uid });
      },
    },
  };
}
