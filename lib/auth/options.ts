import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { authSecret } from './secret';
import { SESSION_HOURS, sessionUser } from './session';
import { SignInRefused, verifySignIn } from './sign-in';

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
    // What the browser's session endpoint answers; the server reads the cookie itself (lib/auth/actor.ts).
    async session({ session, token }) {
      const user = await sessionUser(token);
      if (!user) return { ...session, user: undefined };
      session.user = { id: String(user.userId), name: user.name, email: user.email, role: user.role, siteIds: user.siteIds };
      return session;
    },
  },
};
