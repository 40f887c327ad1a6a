import { NextResponse, type NextRequest } from 'next/server';

import { SESSION_COOKIE_NAMES } from '@/lib/auth/cookie-names';

/**
 * Pages need a session; the sign-in and invitation pages do not. A request without a session
 * cookie goes to the sign-in page, which brings the person back here after (`callbackUrl`).
 * This is an optimistic first gate only, on the cookie's presence: the token is decrypted and
 * the member read once, by the page (`getActor`, whose layout sends a bad or stale session to
 * the sign-in page too). Decrypting it here as well cost every page about 2 ms of CPU, a sixth
 * of the review page's (scripts/bench/pages.ts). API routes are left to their handlers, which
 * answer 401/403 as JSON (lib/api/handler.ts).
 */
export default function proxy(request: NextRequest) {
  if (SESSION_COOKIE_NAMES.some((name) => request.cookies.get(name)?.value)) return NextResponse.next();
  const signIn = new URL('/login', request.url);
  signIn.searchParams.set('callbackUrl', `${request.nextUrl.pathname}${request.nextUrl.search}`);
  return NextResponse.redirect(signIn);
}

/**
 * The proxy runs only for a page request that carries neither session cookie (`missing`: the
 * matcher fails when any of them is present, with a value), so a signed-in page view does not
 * pay for it: about 1 ms of CPU on the review page (DEVELOPERS.md). Next reads this object
 * without running the module, so the names are written out; a unit test holds them equal to
 * SESSION_COOKIE_NAMES (tests/unit/auth/proxy-matcher.test.ts).
 */
export const config = {
  matcher: [
    {
      source: '/((?!api|_next/static|_next/image|favicon.ico|login|invite|icon.svg).*)',
      missing: [
        { type: 'cookie', key: '__Secure-next-auth.session-token' },
        { type: 'cookie', key: 'next-auth.session-token' },
      ],
    },
  ],
};
