import NextAuth from 'next-auth';

import { declareRoute } from '@/lib/api/handler';
import { authOptions } from '@/lib/auth/options';

const handler = NextAuth(authOptions);

/** next-auth's own endpoints: the CSRF token, the session, sign-out. */
export const GET = declareRoute((req: Request, ctx: unknown) => handler(req, ctx), {
  action: 'public',
  publicBecause: 'next-auth’s own endpoints (CSRF token, sign-in, sign-out, session) must answer signed-out callers.',
  scope: 'none',
});

/** The credentials sign-in itself. */
export const POST = declareRoute((req: Request, ctx: unknown) => handler(req, ctx), {
  action: 'public',
  publicBecause: 'the credentials sign-in itself; limited per account and per address (lib/auth/sign-in-limiter.ts).',
  scope: 'none',
});
