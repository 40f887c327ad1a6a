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
