/**
 * How the screens read, in real Chromium against the built app: hyphens at their own width,
 * the boards list on a phone, one date-and-time format.
 */
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { APP_URL, boardIdByName, openBrowser, signIn } from './helpers';

type Browser = Awaited<ReturnType<typeof openBrowser>>;

/**
 * The width of the first hyphen in the element's text as drawn, and the width of a hyphen in
 * the same font with no font features: equal unless a feature (Inter's tabular figures) widens it.
 */
async function hyphenWidths(locator: Locator): Promise<{ drawn: number; plain: number }> {
  return locator.evaluate((el) => {
    const walker = document.createTreeWalker(el, NodeFilter.SHOW_TEXT);
    let node = walker.nextNode();
    while (node && !node.textContent!.includes('-')) node = walker.nextNode();
    if (!node) throw new Error(`no hyphen in "${el.textContent}"`);
    const range = document.createRange();
    const at = node.textContent!.indexOf('-');
    range.setStart(node, at);
    range.setEnd(node, at + 1);
    const drawn = range.getBoundingClientRect().width;
    const style = getComputedStyle(node.parentElement!);
    const probe = document.createElement('span');
    probe.textContent = '-';
    probe.style.cssText = `font-family:${style.fontFamily};font-size:${style.fontSize};font-weight:${style.fontWeight};font-feature-settings:normal;font-variant-numeric:normal;position:absolute`;
    document.body.appendChild(probe);
    const plain = probe.getBoundingClientRect().width;
    probe.remove();
    return { drawn, plain };
  });
}

describe('screens', () => {
  let designer: Browser;
  let flatId: string;

  beforeAll(async () => {
    designer = await openBrowser();
    await signIn(designer.page, 'designer');
    flatId = await boardIdByName(designer.page, 'Flat 1 consumer unit');
  });
  afterAll(async () => {
    await designer.close();
  });

  it('a hyphen is drawn at a hyphen’s width ("Single-phase", not "Single - phase")', async () => {
    const { page } = designer;
    await page.goto(`${APP_URL}/boards/${flatId}`);
    const header = page.getByTestId('drawn-board').getByText(/^Single-phase/);
    const editor = await hyphenWidths(header);
    expect(editor.drawn).toBeGreaterThan(0);
    expect(editor.drawn).toBeCloseTo(editor.plain, 1);
    await page.goto(`${APP_URL}/boards`);
    const cell = page.getByRole('table', { name: 'Boards' }).getByText('Single-phase').first();
    const list = await hyphenWidths(cell);
    expect(list.drawn).toBeCloseTo(list.plain, 1);
  });

  it('on a phone the boards list is a column of cards, each with its stage, and nothing scrolls sideways', async () => {
    const phone = await openBrowser({ phone: true });
    try {
      const { page } = phone;
      await signIn(page, 'designer');
      await page.goto(`${APP_URL}/boards`);
      const cards = page.getByRole('list', { name: 'Boards' }).getByRole('listitem');
      await cards.first().waitFor();
      expect(await page.getByRole('table', { name: 'Boards' }).isVisible()).toBe(false);
      const flat = cards.filter({ has: page.getByRole('link', { name: 'Flat 1 consumer unit', exact: true }) });
      await expect(flat.getByText('Draft', { exact: true }).isVisible()).resolves.toBe(true);
      const widths = await page.evaluate(() => ({
        page: document.documentElement.scrollWidth,
        view: window.innerWidth,
      }));
      expect(widths.page).toBeLessThanOrEqual(widths.view);
      // Wider screens keep the table
      await page.setViewportSize({ width: 1024, height: 800 });
      await expect(page.getByRole('table', { name: 'Boards' }).isVisible()).resolves.toBe(true);
      await expect(page.getByRole('list', { name: 'Boards' }).isVisible()).resolves.toBe(false);
    } finally {
      await phone.close();
    }
  });

  it('on a phone every section of the top bar is in view (an admin has five)', async () => {
    const phone = await openBrowser({ phone: true });
    try {
      const { page } = phone;
      await signIn(page, 'admin');
      await page.goto(`${APP_URL}/boards`);
      const nav = page.getByRole('navigation', { name: 'Sections' });
      const links = nav.getByRole('link');
      await links.first().waitFor();
      expect(await links.allTextContents()).toEqual(['Boards', 'Sites', 'Quick size', 'Members', 'Outbox']);
      const width = await page.evaluate(() => window.innerWidth);
      for (const link of await links.all()) {
        const name = (await link.textContent()) ?? '';
        const box = (await link.boundingBox())!;
        expect(box.x, name).toBeGreaterThanOrEqual(0);
        expect(box.x + box.width, name).toBeLessThanOrEqual(width);
      }
    } finally {
      await phone.close();
    }
  });

  it('dates are written one way, with their time: lists and the outbox', async () => {
    const admin = await openBrowser();
    try {
      const { page } = admin;
      await signIn(page, 'admin');
      // An invitation puts a message in the outbox
      const invited = await page.request.post(`${APP_URL}/api/members`, {
        data: { email: `dates-${Date.now()}@example.test`, name: 'Dates check', role: 'installer' },
      });
      expect(invited.status()).toBeLessThan(300);
      const moments = async (p: Page) => {
        await p.locator('main time:visible').first().waitFor();
        return p.locator('main time:visible').allTextContents();
      };
      const format = /^\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec) \d{4}, \d{2}:\d{2}$/;
      for (const path of ['/boards', '/sites', '/members', '/mailbox']) {
        await page.goto(`${APP_URL}${path}`);
        const shown = await moments(page);
        expect(shown.length, path).toBeGreaterThan(0);
        for (const text of shown) expect(text, path).toMatch(format);
      }
    } finally {
      await admin.close();
    }
  });
});
