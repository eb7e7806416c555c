import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';

// Options are built per request so configuration is read at run time, never at build time.
function handler(req: Request, ctx: { params: Promise<{ nextauth: string[] }> }) {
  return NextAuth(authOptions())(req, ctx);
}

export { handler as GET, handler as POST };
