/** next-auth's session cookie: `__Secure-` over HTTPS, plain over HTTP (tests/integration/sign-in-limits). */
export const SESSION_COOKIE_NAMES = ['__Secure-next-auth.session-token', 'next-auth.session-token'];
