import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { env } from '@/lib/env';
import { verifyCredentials } from './credentials';
import { membershipsOf } from './memberships';
import { clientAddress } from './client-address';

// next-auth 4 with e-mail + password and JWT sessions. The token carries the
// person's studios and roles for navigation; every permission check reads the
// database again (lib/auth/actor.ts), so a changed role takes effect at once.
export const authOptions: NextAuthOptions = {
  secret: env.NEXTAUTH_SECRET,
  session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(credentials, req) {
        const result = await verifyCredentials(credentials, clientAddress(req?.headers ?? {}));
        if (result.ok) return result.user;
        // The message reaches the sign-in page as ?error=...; it never says whether the e-mail exists.
        throw new Error(result.reason === 'throttled' ? 'throttled' : 'invalid');
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user, trigger }) {
      if (user) token.userId = user.id;
      if ((user || trigger === 'update') && token.userId) token.memberships = await membershipsOf(token.userId);
      return token;
    },
    async session({ session, token }) {
      session.user = { id: token.userId, email: token.email ?? '', name: token.name ?? '', memberships: token.memberships ?? [] };
      return session;
    },
  },
};
