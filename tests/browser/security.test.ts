/**
 * Security of the built app over HTTP on loopback: the response headers of pages and API
 * routes, the session cookie's flags and lifetime, the sign-in lock-out message on the page,
 * and that no page can be framed or breaks its own content security policy.
 */
import crypto from 'node:crypto';

import { decode } from 'next-auth/jwt';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { SESSION_MAX_AGE_S } from '@/lib/auth/options';

import { APP_URL, demoUser, openBrowser, signIn } from './helpers';

type Browser = Awaited<ReturnType<typeof openBrowser>>;

const SECRET = process.env.NEXTAUTH_SECRET ?? 'local-demo-secret-change-me-0123456789abcdef';

// Failed sign-ins in this file come from documentation addresses (RFC 3849) so that the
// shared loopback address keeps its allowance for the other browser tests.
const testAddress = () => `2001:db8::${crypto.randomBytes(4).toString('hex').match(/.{4}/g)!.join(':')}`;

/** Next-auth's credentials sign-in over HTTP; returns the raw Set-Cookie lines and the jar. */
async function credentialsSignIn(email: string, password: string, address = testAddress()) {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      jar.set(pair.slice(0, pair.indexOf('=')), pair.slice(pair.indexOf('=') + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrf = await fetch(`${APP_URL}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${APP_URL}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: {
      'content-type': 'application/x-www-form-urlencoded',
      cookie: cookie(),
      'x-forwarded-for': address,
    },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true' }),
  });
  const setCookies = res.headers.getSetCookie();
  keep(res);
  return { res, setCookies, jar, cookie };
}

function expectSecurityHeaders(res: Response, what: string) {
  const csp = res.headers.get('content-security-policy') ?? '';
  for (const directive of [
    "default-src 'self'",
    "frame-ancestors 'none'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
  ]) {
    expect(csp, `${what}: ${directive}`).toContain(directive);
  }
  expect(res.headers.get('x-frame-options'), what).toBe('DENY');
  expect(res.headers.get('referrer-policy'), what).toBe('strict-origin-when-cross-origin');
  expect(res.headers.get('x-content-type-options'), what).toBe('nosniff');
  expect(res.headers.get('x-powered-by'), what).toBeNull();
}

describe('security headers', () => {
  it('on a page, on API routes signed out and signed in, and on an error answer', async () => {
    expectSecurityHeaders(await fetch(`${APP_URL}/login`), 'GET /login');
    const signedOut = await fetch(`${APP_URL}/api/boards`);
    expect(signedOut.status).toBe(401);
    expectSecurityHeaders(signedOut, 'GET /api/boards signed out');
    const { cookie } = await credentialsSignIn(demoUser('inspector').email, demoUser('inspector').password);
    const signedIn = await fetch(`${APP_URL}/api/boards`, { headers: { cookie: cookie() } });
    expect(signedIn.status).toBe(200);
    expectSecurityHeaders(signedIn, 'GET /api/boards signed in');
    const junk = await fetch(`${APP_URL}/api/sites`, {
      method: 'POST',
      headers: { cookie: cookie(), 'content-type': 'application/json' },
      body: '{"name":',
    });
    expect(junk.status).toBe(403);
    expectSecurityHeaders(junk, 'POST /api/sites refused');
  });
});

describe('the session cookie', () => {
  it('is HttpOnly, SameSite=Lax, not Secure over plain HTTP, and lasts 12 hours, token included', async () => {
    const before = Date.now();
    const { res, setCookies, jar } = await credentialsSignIn(demoUser('designer').email, demoUser('designer').password);
    expect(res.status).toBe(200);
    const line = setCookies.find((c) => c.startsWith('next-auth.session-token='));
    expect(line, setCookies.join('\n')).toBeTruthy();
    const attrs = line!.split(';').map((a) => a.trim().toLowerCase());
    expect(attrs).toContain('httponly');
    expect(attrs).toContain('samesite=lax');
    expect(attrs).toContain('path=/');
    // Served over http://, so not Secure (and not __Secure- prefixed); https gets both
    expect(APP_URL.startsWith('http://')).toBe(true);
    expect(attrs).not.toContain('secure');
    // The cookie and the token inside it both end 12 hours from now
    const expires = Date.parse(attrs.find((a) => a.startsWith('expires='))!.slice('expires='.length));
    expect(Math.abs(expires - (before + SESSION_MAX_AGE_S * 1000))).toBeLessThan(120_000);
    const token = await decode({ token: jar.get('next-auth.session-token'), secret: SECRET });
    expect(token?.exp).toBeDefined();
    expect(Math.abs((token!.exp as number) * 1000 - (before + SESSION_MAX_AGE_S * 1000))).toBeLessThan(120_000);
  });
});

describe('in the browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser.close();
  });

  it('shows the lock-out message on the sign-in page after repeated failures', async () => {
    const email = `locked-${crypto.randomUUID().slice(0, 8)}@example.test`;
    const address = testAddress();
    // Five failures for one account…
    for (let i = 0; i < 5; i++) {
      const { res } = await credentialsSignIn(email, 'not-the-password-1', address);
      expect(res.status).toBe(401);
    }
    // …and the sixth, on the page, says why and for how long
    const { page } = browser;
    await page.setExtraHTTPHeaders({ 'x-forwarded-for': address });
    await page.goto(`${APP_URL}/login`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('not-the-password-1');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect
      .poll(() => page.locator('form').getByRole('alert').textContent())
      .toBe('Too many failed sign-ins. Try again in 15 minutes.');
    await page.setExtraHTTPHeaders({});
  });

  it('pages run under their content security policy without violations', async () => {
    const b = await openBrowser();
    const violations: string[] = [];
    b.page.on('console', (msg) => {
      if (/Content Security Policy|Refused to/i.test(msg.text())) violations.push(msg.text());
    });
    try {
      await signIn(b.page, 'designer');
      await b.page.goto(`${APP_URL}/boards`);
      await b.page.waitForLoadState('networkidle');
      await b.page.goto(`${APP_URL}/sites`);
      await b.page.waitForLoadState('networkidle');
      expect(violations).toEqual([]);
    } finally {
      await b.close();
    }
  });

  it('no other page can frame the app', async () => {
    const { page } = browser;
    await page.setContent(
      `<iframe name="control" srcdoc="<form><input></form>"></iframe>` +
        `<iframe name="app" src="${APP_URL}/login" width="600" height="400"></iframe>`,
    );
    await page.waitForTimeout(1_500);
    // The control frame shows its form, so a framed sign-in form would be seen too
    const control = page.frames().find((f) => f.name() === 'control')!;
    expect(await control.locator('form').count()).toBe(1);
    // The app's frame never shows the sign-in form: the browser refused to render it
    const app = page.frames().find((f) => f.name() === 'app');
    const shown = app
      ? await app
          .locator('form')
          .count()
          .catch(() => 0)
      : 0;
    expect(shown).toBe(0);
  });
});
