/**
 * The review and the label walk in real Chromium against the built app: an inspector
 * issues a board on the review page, then an installer walks it on a phone-sized screen,
 * marks ways, adds a photo, reloads, resumes on another device and finishes: labels matched on site.
 */
import crypto from 'node:crypto';

import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { db } from '@/lib/db';
import { Board, Organisation, Site, Way } from '@/models';
import { DEMO_ORG, DEMO_SITE, FLAT_BOARD, demoWays } from '@/scripts/demo-data';

import { APP_URL, demoUser, openBrowser, signIn } from './helpers';

let boardId: string;
let boardName: string;
let total: number;
const LONG_SERVES = 'Sockets: living room, both bedrooms, the landing and the loft hatch spur for the aerial amplifier';

beforeAll(async () => {
  // A board of its own in the demo organisation, so other tests' boards are left alone
  db();
  const org = await Organisation.findOne({ where: { name: DEMO_ORG } });
  const site = await Site.findOne({ where: { organisationId: org!.id, name: DEMO_SITE.name } });
  boardName = `Walk test ${crypto.randomUUID().slice(0, 6)}`;
  const board = await Board.create({
    ...FLAT_BOARD.settings,
    name: boardName,
    organisationId: org!.id,
    siteId: site!.id,
    // Sending for review is the editor's step; the row is put in review directly
    status: 'in-review',
  });
  const ways = demoWays(FLAT_BOARD).sort((a, b) => a.rail - b.rail || a.position - b.position);
  // The fourth device on the rail (an MCB, one module) serves more than its label can hold
  const fourth = ways[3];
  expect(fourth.circuit, 'the fourth device has a circuit').toBeTruthy();
  fourth.circuit = { ...fourth.circuit!, serves: LONG_SERVES };
  await Way.bulkCreate(ways.map((w) => ({ ...w, boardId: board.id })));
  boardId = board.id;
  total = ways.length;
});

afterAll(async () => {
  await db().close();
  (globalThis as { boardwrightSequelize?: unknown }).boardwrightSequelize = undefined;
});

describe('review and label walk', () => {
  it('an inspector approves the board on the review page', async () => {
    const { page, close } = await openBrowser();
    try {
      await signIn(page, 'inspector');
      await page.goto(`${APP_URL}/boards/${boardId}/review`);
      await expect.poll(() => page.getByRole('heading', { name: `Review: ${boardName}` }).count()).toBe(1);
      // A way's checks are not in the page: they load when the way is opened
      await expect(page.getByTestId('way-checks').count()).resolves.toBe(0);
      const toggle = page.locator('tr:has([data-verdict]) button[aria-expanded]').first();
      await toggle.click();
      await expect.poll(() => toggle.getAttribute('aria-expanded')).toBe('true');
      await page.getByTestId('way-checks').locator('li').first().waitFor();
      await expect(page.getByTestId('way-checks').textContent()).resolves.toMatch(/BS 7671/);
      await page.getByRole('button', { name: 'Approve and issue' }).click();
      // The confirmation asks for the issuer's name (tests/browser/records.test.ts covers it)
      await page.getByLabel('Your full name').fill(demoUser('inspector').name);
      const ticks = page.getByRole('checkbox', { name: /I issue the board as it is/ });
      if (await ticks.count()) await ticks.check();
      await page.getByRole('button', { name: 'Issue revision 1' }).click();
      await page.getByText('Issued as revision 1').waitFor();
      expect((await Board.findByPk(boardId))!.status).toBe('issued');
    } finally {
      await close();
    }
  });

  it('an installer walks it on a phone: marks ways, adds a photo, reloads, resumes elsewhere, finishes with labels matched on site', async () => {
    const photo = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#9aa3ad' } })
      .jpeg()
      .toBuffer();
    const first = await openBrowser({ phone: true });
    try {
      const { page } = first;
      await signIn(page, 'installer');
      await page.goto(`${APP_URL}/boards/${boardId}/walk`);
      await page.getByRole('heading', { name: `Label walk: ${boardName}` }).waitFor();
      await page.getByText(`0 of ${total} checked`).waitFor();
      // The first device on the rail is the main switch
      await expect.poll(() => page.getByRole('heading', { level: 2 }).textContent()).toBe('Main switch 100 A');

      // Three ways match; each save says so in a toast, and a new toast replaces the last
      for (let n = 1; n <= 3; n += 1) {
        await page.getByRole('button', { name: 'Label matches' }).click();
        await page.getByText(`${n} of ${total} checked`).waitFor();
        expect(await page.locator('[data-sonner-toast]').count()).toBeLessThanOrEqual(1);
      }
      await page.locator('[data-sonner-toast]').first().waitFor();
      expect(await page.locator('[data-sonner-toast]:not([data-removed="true"])').count()).toBe(1);
      // The fourth way: its label is printed shortened, and the walk says what the strip reads
      await expect(page.getByText(LONG_SERVES).count()).resolves.toBe(1);
      await expect(page.getByTestId('strip-text').textContent()).resolves.toMatch(
        /^The printed strip shortens it to fit: Sockets: living room.*…$/,
      );
      // A photo of it, then reload: the walk resumes there with the photo
      const fourth = await page.getByRole('heading', { level: 2 }).textContent();
      await page
        .locator('input[type="file"]')
        .setInputFiles({ name: 'way.jpg', mimeType: 'image/jpeg', buffer: photo });
      await page.getByRole('img', { name: /^Photo of way/ }).waitFor();
      await page.reload();
      await page.getByText(`3 of ${total} checked`).waitFor();
      expect(await page.getByRole('heading', { level: 2 }).textContent()).toBe(fourth);
      await page.getByRole('img', { name: /^Photo of way/ }).waitFor();
      const thumb = await page.request.get(
        (await page.getByRole('img', { name: /^Photo of way/ }).getAttribute('src'))!.replace(/^\//, `${APP_URL}/`),
      );
      expect(thumb.headers()['content-type']).toBe('image/jpeg');

      // A wrong label, with a note
      await page.getByLabel('Note').fill('Label says Cooker');
      await page.getByRole('button', { name: 'Label is wrong' }).click();
      await page.getByText(`4 of ${total} checked`).waitFor();
      await page.getByText('1 wrong').waitFor();

      // The summary at any time: what matched, what did not (with the note), the photo
      await page.getByRole('button', { name: 'Finish and see the summary' }).click();
      const summary = page.getByRole('region', { name: 'Walk summary' });
      await expect(summary.locator('[data-summary="matches"] dd').textContent()).resolves.toBe('3');
      await expect(summary.locator('[data-summary="wrong"] dd').textContent()).resolves.toBe('1');
      await expect(summary.locator('[data-summary="unchecked"] dd').textContent()).resolves.toBe(String(total - 4));
      await expect(summary.locator('[data-summary="photos"] dd').textContent()).resolves.toBe('1');
      const wrongOne = await summary.getByRole('button', { name: /Label says Cooker/ }).textContent();
      expect(wrongOne).toContain('Label is wrong');
      expect(wrongOne).toMatch(/printed shortened: Sockets: living room.*…/);
    } finally {
      await first.close();
    }

    // Another phone: the progress is there; go back to the wrong one, fix it, finish the rest
    const second = await openBrowser({ phone: true });
    try {
      const { page } = second;
      await signIn(page, 'installer');
      await page.goto(`${APP_URL}/boards/${boardId}/walk`);
      await page.getByText(`4 of ${total} checked`).waitFor();
      const goTo = page.getByRole('combobox', { name: 'Go to way' });
      const wrong = await goTo.locator('option', { hasText: 'Label is wrong' }).getAttribute('value');
      await goTo.selectOption(wrong!);
      await page.getByLabel('Note').fill('Relabelled on site');
      await page.getByRole('button', { name: 'Label matches' }).click();
      await page.getByText(`4 of ${total} checked · 4 match`).waitFor();
      for (let n = 5; n <= total; n += 1) {
        await page.getByRole('button', { name: 'Label matches' }).click();
        await page.getByText(`${n} of ${total} checked`).waitFor();
      }
      await page.getByRole('status').filter({ hasText: 'labels matched on site' }).first().waitFor();
      expect((await Board.findByPk(boardId))!.status).toBe('labels-matched');
      // The last way leads to the walk's summary: all matched, none wrong or missing, one photo
      await page.getByRole('heading', { name: 'Walk summary' }).waitFor();
      const summary = page.getByRole('region', { name: 'Walk summary' });
      await expect(summary.locator('[data-summary="matches"] dd').textContent()).resolves.toBe(String(total));
      await expect(summary.locator('[data-summary="wrong"] dd').textContent()).resolves.toBe('0');
      await expect(summary.locator('[data-summary="missing"] dd').textContent()).resolves.toBe('0');
      await expect(summary.locator('[data-summary="photos"] dd').textContent()).resolves.toBe('1');
      await expect(summary.getByText('None: every label checked matches the schedule.').count()).resolves.toBe(1);
      await summary.getByRole('img', { name: /^Photo of way/ }).waitFor();
      expect(await page.locator('[data-sonner-toast]:not([data-removed="true"])').count()).toBeLessThanOrEqual(1);
      // Every label confirmed: back on a way, a label found missing says the board's state will change, first
      await page.getByRole('button', { name: 'Previous' }).click();
      await page.getByRole('button', { name: 'Label is missing' }).click();
      const ask = page.getByRole('dialog', { name: 'This changes the board’s state' });
      await expect(ask.textContent()).resolves.toMatch(/labels matched on site.*back to issued/);
      await ask.getByRole('button', { name: 'Keep the labels matched' }).click();
      await expect.poll(() => ask.count(), { timeout: 15_000 }).toBe(0);
      expect((await Board.findByPk(boardId))!.status).toBe('labels-matched');
    } finally {
      await second.close();
    }
  });
});
