import type { SiteRole } from '@/lib/access';

// The session and JWT carry the user's id and site role; group roles are resolved on the server per request.
declare module 'next-auth' {
  interface Session {
    user: { id: string; email: string; name: string; siteRole: SiteRole };
  }
  interface User {
    siteRole?: SiteRole;
  }
}

declare module 'next-auth/adapters' {
  interface AdapterUser {
    siteRole?: SiteRole;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid?: string;
    siteRole?: SiteRole;
  }
}
