import { withAuth } from 'next-auth/middleware';

/**
 * Pages need a session; the sign-in and invitation pages do not. API routes are left
 * to their handlers, which answer 401/403 as JSON (see lib/api/handler.ts). This is a
 * first gate only: every page and route checks the session and role on the server again.
 */
export default withAuth({ pages: { signIn: '/login' } });

export const config = {
  matcher: ['/((?!api|_next/static|_next/image|favicon.ico|login|invite|icon.svg).*)'],
};
