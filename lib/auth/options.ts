import bcrypt from 'bcryptjs';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { z } from 'zod';

import { db } from '@/lib/db';
import { env } from '@/lib/env';
import { checkSignInAllowed, recordSignInResult } from '@/lib/auth/sign-in-limiter';
import { User } from '@/models';

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  password: z.string().min(1).max(200),
});

/**
 * The caller's address for the per-address sign-in limit: the last X-Forwarded-For entry,
 * which is the one the nearest proxy appended (earlier entries are whatever the client sent).
 * In production run behind one proxy that appends it; without a proxy the header is the
 * client's own word, and only the per-account limit can be relied on.
 */
export function clientAddress(header: unknown): string {
  const value = Array.isArray(header) ? header.join(',') : typeof header === 'string' ? header : '';
  const last = value
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean)
    .pop();
  return last ? last.slice(0, 64) : 'unknown';
}

/** A session lasts a working day (12 h) from sign-in, enforced by the token itself. */
export const SESSION_MAX_AGE_S = 12 * 60 * 60;

/**
 * Session and CSRF cookies are `Secure` (and `__Secure-`/`__Host-` prefixed) when the app is
 * served over HTTPS. Set from APP_URL rather than left to next-auth's guess from NEXTAUTH_URL,
 * so that a deployment behind a TLS proxy cannot silently hand out cookies that travel in clear.
 */
export function secureCookiesFor(appUrl: string): boolean {
  return appUrl.startsWith('https://');
}

export const authOptions: NextAuthOptions = {
  secret: env().NEXTAUTH_SECRET,
  useSecureCookies: secureCookiesFor(env().APP_URL),
  session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_S },
  // next-auth 4 signs the sign-in token with jwt.maxAge (30 days unless set), whatever the
  // session's maxAge: without this a copied cookie would stay valid for a month.
  jwt: { maxAge: SESSION_MAX_AGE_S },
  pages: { signIn: '/login' },
  providers: [
    CredentialsProvider({
      name: 'Email and password',
      credentials: { email: { type: 'email' }, password: { type: 'password' } },
      async authorize(raw, req) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const address = clientAddress(req?.headers?.['x-forwarded-for']);
        await checkSignInAllowed(email, address);
        db();
        const user = await User.findOne({ where: { email } });
        const ok = !!user?.passwordHash && user.active && (await bcrypt.compare(password, user.passwordHash));
        await recordSignInResult(email, address, ok);
        if (!ok || !user) return null;
        return {
          id: user.id,
          email: user.email,
          name: user.name,
          role: user.role,
          organisationId: user.organisationId,
        };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.userId = user.id;
        token.role = user.role;
        token.organisationId = user.organisationId;
      }
      return token;
    },
    session({ session, token }) {
      session.user = {
        ...session.user,
        id: token.userId,
        role: token.role,
        organisationId: token.organisationId,
      };
      return session;
    },
  },
};
