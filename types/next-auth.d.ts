import 'next-auth';
import 'next-auth/jwt';
import type { Role } from '@/lib/domain/vocabulary';

declare module 'next-auth' {
  interface Session {
    user?: {
      id: string;
      name?: string | null;
      email?: string | null;
      image?: string | null;
      role?: Role;
      siteIds?: number[] | 'all';
    };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid?: number;
    /** Unix seconds of the sign-in: a session ends SESSION_HOURS after it, however often it is renewed. */
    signedInAt?: number;
  }
}
