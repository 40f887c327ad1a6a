/**
 * The schedule page in real Chromium as an inspector prints it: the browser's print holds the
 * schedule alone (no app bar, no board tabs, no toolbar), the table header keeps its shading,
 * and the sheet speaks the trade (design values marked, true counts, no code or id).
 */
import fs from 'node:fs';
import path from 'node:path';

import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';

import { DESIGN_VALUES_NOTE } from '@/features/schedule/utils/build-schedule';
import { countWays, countWords } from '@/lib/boards/counts';
import { SIZING_CAUTION } from '@/lib/sizing';

import { APP_URL, boardIdByName, openBrowser, signIn } from './helpers';

/** Set SCREENSHOT_DIR to keep the print view and the printed PDF of this test. */
const KEEP = process.env.SCREENSHOT_DIR;

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i;

describe('the schedule page, printed from the browser', () => {
  it('prints the schedule alone, with the table header’s shading, and the sheet speaks the trade', async () => {
    const { page, close } = await openBrowser();
    const errors: string[] = [];
    page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
    try {
      await signIn(page, 'inspector');
      const boardId = await boardIdByName(page, 'Flat 1 consumer unit');
      await page.goto(`${APP_URL}/boards/${boardId}/schedule`);
      const sheet = page.locator('[data-print-root]');
      await sheet.waitFor();
      // Its table is drawn in the browser (features/schedule/components/schedule-table.tsx)
      await sheet.locator('tbody td').first().waitFor();

      // On screen: the tabs and the toolbar are there
      expect(await page.getByRole('navigation', { name: 'Board views' }).isVisible()).toBe(true);
      expect(await page.getByRole('button', { name: /^Print/ }).isVisible()).toBe(true);

      // The words of the sheet: design values marked, true counts, no code or id
      const words = (await sheet.innerText()).replace(/\s+/g, ' ');
      expect(words).toContain('Design R1+R2 Ω');
      expect(words).toContain('Design Zs Ω (limit)');
      expect(words).toContain(DESIGN_VALUES_NOTE);
      // The counts are the way numbers printed (the demo flat: ways 1–9, the spare included)
      const board = (await (await page.request.get(`${APP_URL}/api/boards/${boardId}`)).json()).board;
      const counts = countWays(board.phases, board.ways);
      expect(words).toContain(countWords(counts));
      const printed = (await sheet.locator('tbody td:first-child').allInnerTexts()).map(Number);
      expect(Math.max(...printed)).toBe(counts.ways);
      expect(printed).toEqual(Array.from({ length: counts.ways }, (_, i) => i + 1));
      expect(words).toMatch(/do not replace the notices and labels BS 7671 requires at the board/);
      expect(words).toContain(SIZING_CAUTION);
      expect(words).not.toMatch(UUID);
      expect(words).not.toMatch(/main-switch|fuse-bs|ring-32|te-70|verified|labels-matched|\bmcb\b|\brcd\b/);

      // In print: only the sheet; the bar, the tabs and the toolbar are gone
      await page.emulateMedia({ media: 'print' });
      expect(await sheet.isVisible()).toBe(true);
      expect(await page.getByRole('navigation', { name: 'Board views' }).isVisible()).toBe(false);
      expect(await page.getByRole('navigation', { name: 'Sections' }).isVisible()).toBe(false);
      expect(await page.getByRole('button', { name: 'Sign out' }).isVisible()).toBe(false);
      expect(await page.getByRole('button', { name: /^Print/ }).isVisible()).toBe(false);
      // Nothing outside the sheet takes room on the page: it starts at the top left
      const box = (await sheet.boundingBox())!;
      expect(box.y).toBeLessThan(2);
      expect(box.x).toBeLessThan(2);
      // The header's shading prints: dark background, exact colours
      const head = await sheet.locator('thead').evaluate((el) => {
        const s = getComputedStyle(el);
        return { background: s.backgroundColor, adjust: s.getPropertyValue('print-color-adjust') };
      });
      expect(head.adjust).toBe('exact');
      expect(head.background).not.toMatch(/rgba\(0, 0, 0, 0\)|transparent/);
      if (KEEP) await page.screenshot({ path: path.join(KEEP, 'schedule-print-view.png'), fullPage: true });

      // The browser's own print to PDF holds the schedule and none of the screen's chrome
      const pdf = await page.pdf({ format: 'A4', landscape: true, printBackground: false, preferCSSPageSize: true });
      if (KEEP) fs.writeFileSync(path.join(KEEP, 'schedule-browser-print.pdf'), pdf);
      const parser = new PDFParse({ data: new Uint8Array(pdf) });
      try {
        const text = (await parser.getText()).text.replace(/\s+/g, ' ');
        expect(text).toContain('Flat 1 consumer unit');
        expect(text).toContain('Design R1+R2 Ω');
        expect(text).not.toMatch(/Sign out|Label strips \(PDF\)|Quick size/);
        expect(text).not.toMatch(/\bLabel walk\b(?! \d)/);
      } finally {
        await parser.destroy();
      }
      expect(errors).toEqual([]);
    } finally {
      await close();
    }
  });
});
