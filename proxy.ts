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

export const config = {
  matcher: ['/((?!api|_next/static|_next/image|favicon.ico|login|invite|icon.svg).*)'],
};
