import { describe, expect, it } from 'vitest';

import { SESSION_COOKIE_NAMES } from '@/lib/auth/cookie-names';
import proxy, { config } from '@/proxy';
import { NextRequest } from 'next/server';

describe('the sign-in proxy (proxy.ts)', () => {
  it('is skipped by its matcher for a request carrying either session cookie: the names written out are the session cookies', () => {
    const [matcher] = config.matcher;
    expect(matcher.missing.map((m) => (m.type === 'cookie' ? m.key : null)).sort()).toEqual(
      [...SESSION_COOKIE_NAMES].sort(),
    );
  });

  it('sends a page request without a session to sign in, with the page and its query to come back to', () => {
    const res = proxy(new NextRequest('http://127.0.0.1:3000/sites?from=mail'));
    expect(res.status).toBe(307);
    const to = new URL(res.headers.get('location')!);
    expect(to.pathname).toBe('/login');
    expect(to.searchParams.get('callbackUrl')).toBe('/sites?from=mail');
  });

  it('lets a request with a session cookie through (the page checks the session itself)', () => {
    const req = new NextRequest('http://127.0.0.1:3000/boards', { headers: { cookie: 'next-auth.session-token=x' } });
    expect(proxy(req).headers.get('location')).toBeNull();
  });
});
