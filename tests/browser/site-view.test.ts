/**
 * The site view in Chromium against the built app: a board is linked to another board's
 * sub-main by dragging it onto the way; a longer sub-main saved in the upstream board's editor
 * changes the downstream board's verdicts (carried volt drop), and its editor says which ways
 * changed; the diagram opens a board. A site of this test's own, so the demo is left alone.
 */
import crypto from 'node:crypto';

import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { db } from '@/lib/db';
import type { SiteTreeDto } from '@/lib/sites/tree-types';
import { Board, Organisation, Site, Way } from '@/models';
import { DEMO_ORG, FLAT_BOARD, WORKSHOP_SITE_BOARD, WORKSHOP_SUB_MAINS, demoWays } from '@/scripts/demo-data';

import { APP_URL, openBrowser, signIn, watchErrors } from './helpers';

const tag = crypto.randomUUID().slice(0, 6);
const upName = `Yard DB ${tag}`;
const downName = `Loft CU ${tag}`;
let siteId: string;
let upId: string;
let downId: string;
let subMainId: string;

beforeAll(async () => {
  db();
  const org = await Organisation.findOne({ where: { name: DEMO_ORG } });
  const site = await Site.create({ name: `Supply tree ${tag}`, address: '', client: '', organisationId: org!.id });
  siteId = site.id;
  const { earthing, uoV, zeOhm, pfcKa, source } = WORKSHOP_SITE_BOARD.settings.supply;
  await db().query('UPDATE sites SET origin = $1::jsonb WHERE id = $2', {
    bind: [JSON.stringify({ earthing, uoV, zeOhm, pfcKa, source }), siteId],
  });
  const make = async (demo: typeof FLAT_BOARD, name: string) => {
    const row = await Board.create({ ...demo.settings, name, organisationId: org!.id, siteId });
    const ways = demoWays(demo);
    await Way.bulkCreate(ways.map((w) => ({ ...w, boardId: row.id })));
    return { id: row.id, ways };
  };
  const up = await make(WORKSHOP_SITE_BOARD, upName);
  const down = await make(FLAT_BOARD, downName);
  upId = up.id;
  downId = down.id;
  subMainId = up.ways.find((w) => w.circuit?.serves === WORKSHOP_SUB_MAINS.flat.circuit.serves)!.id;
});

afterAll(async () => {
  await db().close();
  (globalThis as { boardwrightSequelize?: unknown }).boardwrightSequelize = undefined;
});

async function center(locator: Locator) {
  const box = (await locator.boundingBox())!;
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

/** Every way's verdict as the editor draws it, by way id, once the board is sized. */
async function verdicts(page: Page): Promise<Record<string, string>> {
  await page.locator('[data-way-id] [data-verdict]').first().waitFor();
  return page.evaluate(() => {
    const out: Record<string, string> = {};
    for (const cell of document.querySelectorAll('[data-way-id]')) {
      const v = cell.querySelector('[data-verdict]')?.getAttribute('data-verdict');
      if (v) out[cell.getAttribute('data-way-id')!] = v;
    }
    return out;
  });
}

async function tree(page: Page): Promise<SiteTreeDto> {
  const res = await page.request.get(`${APP_URL}/api/sites/${siteId}/tree`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { tree: SiteTreeDto }).tree;
}

describe('the site view', () => {
  it('links a board by dragging it onto a sub-main; a longer sub-main upstream changes its verdicts', async () => {
    const { page, close } = await openBrowser();
    const errors = watchErrors(page);
    try {
      await signIn(page, 'designer');
      await page.goto(`${APP_URL}/sites/${siteId}`);
      const list = page.getByRole('list', { name: 'Boards of the site, in supply order' });
      await list.waitFor();
      await expect(page.getByRole('note', { name: 'Caution' }).first().isVisible()).resolves.toBe(true);

      // Drag the loft's board by its handle onto the yard board's free sub-main
      const handle = page.getByRole('button', { name: `Drag ${downName} onto a feeding way` });
      const target = page.locator(`[data-drop-target="${upId}:${subMainId}"]`);
      // Both in view at once (a mouse drags only over what is shown): a tall window, the
      // handle (below) scrolled to first, then the way above it if it is not in view yet
      await page.setViewportSize({ width: 1440, height: 2000 });
      await handle.scrollIntoViewIfNeeded();
      await target.scrollIntoViewIfNeeded();
      for (const box of [await handle.boundingBox(), await target.boundingBox()]) {
        expect(box!.y).toBeGreaterThanOrEqual(0);
        expect(box!.y + box!.height).toBeLessThanOrEqual(2000);
      }
      const from = await center(handle);
      await page.mouse.move(from.x, from.y);
      await page.mouse.down();
      await page.mouse.move(from.x + 10, from.y + 10, { steps: 4 });
      const to = await center(target);
      await page.mouse.move(to.x, to.y, { steps: 12 });
      await page.mouse.up();

      // Asked first, naming the board that changes
      const dialog = page.getByRole('dialog', { name: `Feed ${downName} from elsewhere?` });
      await dialog.waitFor();
      const subMain = (await tree(page)).boards.find((b) => b.boardId === upId)!.ways.find((w) => w.id === subMainId)!;
      await expect(dialog.textContent()).resolves.toContain(`from ${upName}, way ${subMain.label} after this`);
      await dialog.getByRole('button', { name: 'Change the feed' }).click();
      await dialog.waitFor({ state: 'hidden' });
      const card = page.locator(`[data-board-card="${downId}"]`);
      await expect.poll(() => card.textContent()).toContain('Sub-main: BS 88-2 fuse 80 A');
      const linked = (await tree(page)).boards.find((b) => b.boardId === downId)!;
      expect(linked.feed).toMatchObject({ from: 'way', boardId: upId, wayId: subMainId });
      expect(linked.depth).toBe(1);

      // The diagram opens the downstream board
      await page
        .getByTestId('site-diagram')
        .getByRole('link', { name: new RegExp(`^${downName}:`) })
        .click();
      await page.waitForURL(`${APP_URL}/boards/${downId}`);
      const supply = page.getByTestId('derived-supply');
      await expect(supply.textContent()).resolves.toContain(`Fed from ${upName}, way ${subMain.label}`);
      const before = await verdicts(page);

      // Upstream: the sub-main to the loft becomes 24 m → 60 m, saved in the yard board's editor
      await page.goto(`${APP_URL}/boards/${upId}`);
      await page.locator('[data-way-id] [data-verdict]').first().waitFor();
      await page.locator(`[data-way-id="${subMainId}"]`).click();
      await page.getByRole('region', { name: 'Way panel' }).getByLabel('Length (m)').fill('60');
      const button = page.getByRole('button', { name: 'Save', exact: true });
      await expect.poll(() => button.isEnabled()).toBe(true);
      await button.click();
      await page.locator('[data-testid="save-state"][data-dirty="false"]').waitFor();

      // Downstream: more volt drop used above it, so some ways' verdicts changed, and it says which
      await page.goto(`${APP_URL}/boards/${downId}`);
      await expect.poll(async () => JSON.stringify(await verdicts(page))).not.toBe(JSON.stringify(before));
      const after = await verdicts(page);
      const changed = Object.keys(after).filter((id) => after[id] !== before[id]);
      expect(changed.length).toBeGreaterThan(0);
      for (const id of changed) expect(after[id]).toBe('fails');
      const note = page.getByTestId('supply-change');
      await note.waitFor();
      for (const id of changed) await expect(note.locator(`[data-changed-way="${id}"]`).count()).resolves.toBe(1);
      expect(errors).toEqual([]);
    } finally {
      await close();
    }
  });

  it('changes the origin: a bad value is named, a good one re-sizes every board and the diagram shows it', async () => {
    const { page, close } = await openBrowser();
    const errors = watchErrors(page);
    try {
      await signIn(page, 'designer');
      await page.goto(`${APP_URL}/sites/${siteId}`);
      const values = page.getByTestId('origin-values');
      await values.waitFor();
      const zeBefore = (await tree(page)).origin!.zeOhm;
      await expect(values.textContent()).resolves.toContain(`Ze ${zeBefore.toFixed(3)} Ω`);

      await page.getByRole('button', { name: 'Change the origin' }).click();
      const dialog = page.getByRole('dialog', { name: 'The site’s origin' });
      await dialog.waitFor();
      // A negative Ze is refused, naming the field; nothing is saved
      const ze = dialog.getByLabel('Ze (Ω)');
      await ze.fill('-1');
      await dialog.getByRole('button', { name: 'Save and size the site' }).click();
      await expect.poll(() => ze.getAttribute('aria-invalid')).toBe('true');
      expect((await tree(page)).origin!.zeOhm).toBe(zeBefore);

      // Ze 1.1 Ω: every board fed from the origin carries it (the yard board directly)
      await ze.fill('1.1');
      await dialog.getByRole('button', { name: 'Save and size the site' }).click();
      await dialog.waitFor({ state: 'hidden' });
      await expect.poll(() => values.textContent()).toContain('Ze 1.100 Ω');
      const after = await tree(page);
      expect(after.origin!.zeOhm).toBe(1.1);
      const yard = after.boards.find((b) => b.boardId === upId)!;
      expect(yard.zdb?.value).toBeCloseTo(1.1, 9);
      // The diagram drawn from the answer shows the yard board's new Zdb
      const box = page.getByTestId('site-diagram').getByRole('link', { name: new RegExp(`^${upName}:`) });
      await expect
        .poll(() => box.getAttribute('aria-label'))
        .toContain('earth fault loop impedance at the board 1.100 Ω');
      expect(errors).toEqual([]);
    } finally {
      await close();
    }
  });
});
