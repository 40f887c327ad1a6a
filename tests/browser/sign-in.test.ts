import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { APP_URL, demoUser, openBrowser, signIn, type Role } from './helpers';

type Browser = Awaited<ReturnType<typeof openBrowser>>;

// What each role sees in the top bar: what the permissions table (lib/auth/permissions.ts) allows it.
const expected: Record<Role, { sees: string[]; hidden: string[] }> = {
  admin: { sees: ['Boards', 'Sites', 'Quick size', 'Members', 'Outbox'], hidden: [] },
  designer: { sees: ['Boards', 'Sites', 'Quick size'], hidden: ['Members', 'Outbox'] },
  inspector: { sees: ['Boards', 'Sites', 'Quick size'], hidden: ['Members', 'Outbox'] },
  installer: { sees: ['Boards', 'Sites'], hidden: ['Quick size', 'Members', 'Outbox'] },
};

describe('sign-in', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser.close();
  });

  it('a signed-out visit to a page goes to the sign-in page', async () => {
    const { page } = browser;
    await page.goto(`${APP_URL}/boards`);
    await expect.poll(() => new URL(page.url()).pathname).toBe('/login');
    await expect(page.getByRole('heading', { name: 'Sign in' }).isVisible()).resolves.toBe(true);
  });

  it('a signed-out deep link comes back to its page after signing in', async () => {
    const b = await openBrowser();
    try {
      await b.page.goto(`${APP_URL}/sites?from=mail`);
      await expect.poll(() => new URL(b.page.url()).pathname).toBe('/login');
      expect(new URL(b.page.url()).searchParams.get('callbackUrl')).toBe('/sites?from=mail');
      await b.page.getByLabel('E-mail').fill(demoUser('inspector').email);
      await b.page.getByLabel('Password').fill(demoUser('inspector').password);
      await b.page.getByRole('button', { name: 'Sign in' }).click();
      await expect
        .poll(() => `${new URL(b.page.url()).pathname}${new URL(b.page.url()).search}`)
        .toBe('/sites?from=mail');
    } finally {
      await b.close();
    }
  });

  it('a session cookie that does not decrypt is no session: the page sends the visitor to sign in', async () => {
    const b = await openBrowser();
    try {
      const { hostname } = new URL(APP_URL);
      // proxy.ts lets a request with the cookie through; the page's own check (getActor) refuses it
      await b.context.addCookies([
        { name: 'next-auth.session-token', value: 'not-a-token', domain: hostname, path: '/' },
      ]);
      const res = await b.page.goto(`${APP_URL}/boards`);
      await expect.poll(() => new URL(b.page.url()).pathname).toBe('/login');
      expect(res?.ok()).toBe(true);
      await expect(b.page.getByRole('heading', { name: 'Sign in' }).isVisible()).resolves.toBe(true);
      expect(await b.page.getByRole('link', { name: 'Boards' }).count()).toBe(0);
    } finally {
      await b.close();
    }
  });

  it('a wrong password is refused with a message', async () => {
    const { page } = browser;
    await page.goto(`${APP_URL}/login`);
    await page.getByLabel('E-mail').fill(demoUser('designer').email);
    await page.getByLabel('Password').fill('not-the-password-1');
    await page.getByRole('button', { name: 'Sign in' }).click();
    // The form's own alert (Next's route announcer is an alert too), once the answer is in
    await expect.poll(() => page.locator('form').getByRole('alert').textContent()).toContain('do not match');
  });

  for (const role of Object.keys(expected) as Role[]) {
    it(`the ${role} signs in and sees what the role may see`, async () => {
      const b = await openBrowser();
      try {
        await signIn(b.page, role);
        const nav = b.page.getByRole('navigation', { name: 'Sections' });
        for (const link of expected[role].sees) {
          await expect(nav.getByRole('link', { name: link, exact: true }).isVisible()).resolves.toBe(true);
        }
        for (const link of expected[role].hidden) {
          await expect(nav.getByRole('link', { name: link, exact: true }).count()).resolves.toBe(0);
        }
        await expect(b.page.getByText(demoUser(role).name).isVisible()).resolves.toBe(true);
        // The members API agrees with the screen: only admins get in.
        const members = await b.page.request.get(`${APP_URL}/api/members`);
        expect(members.status()).toBe(role === 'admin' ? 200 : 403);
      } finally {
        await b.close();
      }
    });
  }

  it('signs out', async () => {
    const b = await openBrowser();
    try {
      await signIn(b.page, 'installer');
      await b.page.getByRole('button', { name: 'Sign out' }).click();
      await b.page.waitForURL(/\/login/);
      const res = await b.page.request.get(`${APP_URL}/api/boards`);
      expect(res.status()).toBe(401);
    } finally {
      await b.close();
    }
  });

  it('answers with the security headers', async () => {
    const res = await fetch(`${APP_URL}/login`);
    expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
  });
});
