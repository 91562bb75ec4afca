import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { authSecret } from './secret';
import { activeUser } from './current-user';
import { SignInRefused, verifySignIn } from './sign-in';

const SESSION_HOURS = 10; // one working day in the plant, then sign in again

function clientIp(headers: Record<string, unknown> | undefined): string | null {
  const forwarded = headers?.['x-forwarded-for'];
  if (typeof forwarded === 'string' && forwarded) return forwarded.split(',')[0].trim();
  const real = headers?.['x-real-ip'];
  return typeof real === 'string' ? real : null;
}

export const authOptions: NextAuthOptions = {
  // A getter, so the demo's generated secret is read when a request needs it, not at build time.
  get secret() {
    return authSecret();
  },
  session: { strategy: 'jwt', maxAge: SESSION_HOURS * 3600 },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(credentials, req) {
        if (!credentials?.email || !credentials.password) throw new Error('Enter your e-mail and password.');
        try {
          return await verifySignIn(credentials.email, credentials.password, clientIp(req?.headers));
        } catch (err) {
          if (err instanceof SignInRefused) throw new Error(err.message);
          throw err;
        }
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.signedInAt = Math.floor(Date.now() / 1000);
      }
      return token;
    },
    async session({ session, token }) {
      // next-auth renews the cookie's expiry whenever the session is read, so a page left polling
      // would stay signed in for ever: the working day counts from the sign-in itself.
      const signedInAt = typeof token.signedInAt === 'number' ? token.signedInAt : 0;
      if (Date.now() / 1000 - signedInAt > SESSION_HOURS * 3600) return { ...session, user: undefined };
      // Role and sites come from the database on every call, never from the token, so a change
      // made by an admin shows at once. Authorisation itself re-reads them too (lib/auth/actor.ts).
      const current = token.uid ? await activeUser(token.uid) : null;
      if (!current) return { ...session, user: undefined };
      session.user = {
        id: String(token.uid), name: current.user.name, email: current.user.email, role: current.role, siteIds: current.siteIds,
      };
      return session;
    },
  },
};
