import crypto from 'node:crypto';

import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { APP_URL, boardIdByName, openBrowser, signIn } from './helpers';

type Browser = Awaited<ReturnType<typeof openBrowser>>;
type StoredBoard = {
  version: number;
  name: string;
  location: string;
  phases: 1 | 3;
  supply: unknown;
  incoming: unknown;
  enclosureModules: number;
  rails: number;
  dwelling: boolean;
  feed: { from: string; boardId?: string };
  ways: {
    id: string;
    rail: number;
    position: number;
    device: unknown;
    circuit: { serves?: string; lengthM: number } | null;
  }[];
};

async function stored(page: Page, boardId: string): Promise<StoredBoard> {
  const res = await page.request.get(`${APP_URL}/api/boards/${boardId}`);
  return (await res.json()).board;
}

/** Puts a board back as it was, so the other browser tests find the demo data unchanged. */
async function restore(page: Page, boardId: string, original: StoredBoard) {
  const now = await stored(page, boardId);
  const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = original;
  const res = await page.request.put(`${APP_URL}/api/boards/${boardId}`, {
    data: {
      version: now.version,
      settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
      ways: original.ways.map(({ id, rail, position, device, circuit }) => ({ id, rail, position, device, circuit })),
    },
  });
  expect(res.status()).toBe(200);
}

async function openEditor(page: Page, boardId: string) {
  await page.goto(`${APP_URL}/boards/${boardId}`);
  await page.getByRole('region', { name: 'Drawn board' }).waitFor();
  // The first sizing has arrived when a verdict is drawn
  await page.locator('[data-verdict]').first().waitFor();
}

/** Saves now (if autosave has not already) and waits until nothing is unsaved. */
async function saveNow(page: Page) {
  const button = page.getByRole('button', { name: 'Save', exact: true });
  if (await button.isEnabled()) await button.click();
  await page.locator('[data-testid="save-state"][data-dirty="false"]').waitFor();
}

const cellOf = (page: Page, wayId: string): Locator => page.locator(`[data-way-id="${wayId}"]`);

async function center(locator: Locator) {
  const box = (await locator.boundingBox())!;
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

describe('the board editor', () => {
  let browser: Browser;
  let flatId: string;
  let original: StoredBoard;

  beforeAll(async () => {
    browser = await openBrowser();
    await signIn(browser.page, 'designer');
    flatId = await boardIdByName(browser.page, 'Flat 1 consumer unit');
    original = await stored(browser.page, flatId);
  });
  afterAll(async () => {
    await restore(browser.page, flatId, original);
    await browser.close();
  });

  it('an MCB dragged from the tray into the free modules is sized once its circuit is filled in, and is saved', async () => {
    const { page } = browser;
    await openEditor(page, flatId);
    const before = new Set(
      await page.locator('[data-way-id]').evaluateAll((els) => els.map((e) => e.getAttribute('data-way-id'))),
    );

    // Pick a C20 MCB in the tray and drag it onto the free modules
    await page.locator('[data-tray-kind="mcb"]').click();
    await page.getByRole('group', { name: 'MCB choices' }).getByLabel('Curve').selectOption('C');
    await page.getByRole('group', { name: 'MCB choices' }).getByLabel('Rating').selectOption('20');
    const from = await center(page.locator('[data-tray-kind="mcb"]'));
    const to = await center(page.locator('[data-free-rail="0"]'));
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    await page.mouse.move(from.x + 10, from.y + 10, { steps: 3 });
    await page.mouse.move(to.x, to.y, { steps: 12 });
    await page.mouse.up();

    const ids = await page.locator('[data-way-id]').evaluateAll((els) => els.map((e) => e.getAttribute('data-way-id')));
    const added = ids.find((id) => !before.has(id))!;
    expect(added).toBeTruthy();
    // It went to the end of the rail: way 10, an MCB C20, a spare so far
    await expect.poll(() => cellOf(page, added).getAttribute('aria-label')).toBe('Way 10, MCB C20, spare');

    // The new way is selected: give it a circuit in the way panel
    const panel = page.getByRole('region', { name: 'Way panel' });
    await panel.getByRole('button', { name: 'Add a circuit' }).click();
    await panel.getByLabel('Serves').fill('Garden office heater');
    await panel.getByLabel('Load (W)').fill('2500');
    await panel.getByLabel('Length (m)').fill('24');

    // The verdict is drawn on the way, in words, and the full sizing is in the panel; read once
    // the draft as it is now is sized (each field's change is sized as it comes, so an earlier
    // answer may be showing for a moment)
    await page.waitForFunction(() => {
      const board = document.querySelector<HTMLElement>('[data-testid="drawn-board"]')?.dataset;
      return !!board && board.sizedFor === board.editSeq && board.sizing === 'done';
    });
    await expect
      .poll(() => cellOf(page, added).getAttribute('aria-label'))
      .toMatch(/^Way 10, MCB C20, serves Garden office heater, (passes|is near its limit|fails)$/);
    const verdict = await cellOf(page, added).locator('[data-verdict]').getAttribute('data-verdict');
    expect(verdict).toMatch(/^(passes|near-limit|fails)$/);
    // In words, level, in the rail's legend under way 10
    const entry = page.locator(`[data-legend-way="${added}"]`);
    await expect(entry.textContent()).resolves.toMatch(
      /^Way 10MCB C20: Garden office heater(Passes|Near limit|Fails)$/,
    );
    await expect(entry.locator('[data-verdict]').getAttribute('data-verdict')).resolves.toBe(verdict);
    await expect(panel.getByRole('region', { name: 'Sizing result' }).textContent()).resolves.toContain(
      'Design current Ib',
    );

    // A reload before saving loses nothing: the draft is kept in the tab
    await page.reload();
    await page.getByRole('region', { name: 'Drawn board' }).waitFor();
    await expect.poll(() => cellOf(page, added).getAttribute('aria-label')).toContain('Garden office heater');

    // Save, reload: it is stored
    await saveNow(page);
    const board = await stored(page, flatId);
    const way = board.ways.find((w) => w.id === added)!;
    expect(way.circuit).toMatchObject({ serves: 'Garden office heater', lengthM: 24 });
    await page.reload();
    await page.getByRole('region', { name: 'Drawn board' }).waitFor();
    await expect
      .poll(() => cellOf(page, added).getAttribute('aria-label'))
      .toMatch(/Garden office heater, (passes|is near its limit|fails)$/);
  });

  it('a device that does not fit is refused with the reason', async () => {
    const { page } = browser;
    await openEditor(page, flatId);
    // A 4-pole RCD on this single-phase board
    await page.locator('[data-tray-kind="rcd"]').click();
    await page.getByRole('group', { name: 'RCD choices' }).getByLabel('Poles').selectOption('4');
    await page.getByRole('button', { name: 'Add to the board' }).click();
    await expect(page.getByTestId('editor-notice').textContent()).resolves.toContain(
      'A 4-pole RCD needs a three-phase supply; this board is single-phase.',
    );
  });

  it('a way moves along the rail with the keyboard, with spoken feedback, and Ctrl+Z puts it back', async () => {
    const { page } = browser;
    await openEditor(page, flatId);
    const three = page.locator('[data-way-label="3"]');
    const id = (await three.getAttribute('data-way-id'))!;
    // Keep every sentence the live region says
    await page.evaluate(() => {
      const said: string[] = [];
      (window as unknown as { said: string[] }).said = said;
      const region = document.querySelector('[id^="DndLiveRegion"]')!;
      new MutationObserver(() => said.push(region.textContent ?? '')).observe(region, {
        childList: true,
        characterData: true,
        subtree: true,
      });
    });
    const said = () => page.evaluate(() => (window as unknown as { said: string[] }).said.filter(Boolean));
    await three.focus();
    await page.keyboard.press('Space');
    await expect.poll(said).toContain('Picked up way 3, MCB B6.');
    // dnd-kit's keyboard sensor starts listening for arrows a timer tick after the pick-up
    // (so the Space that picked up is not taken as a move); a key pressed before that is lost.
    await page.waitForTimeout(200);
    await page.keyboard.press('ArrowRight');
    await expect.poll(said).toContain('way 3, MCB B6 would go after way 4.');
    await page.keyboard.press('Space');
    await expect.poll(said).toContain('way 3, MCB B6 was put down after way 4.');
    await expect.poll(() => cellOf(page, id).getAttribute('data-way-label')).toBe('4');

    await page.locator('body').click({ position: { x: 5, y: 5 } });
    await page.keyboard.press('Control+z');
    await expect.poll(() => cellOf(page, id).getAttribute('data-way-label')).toBe('3');
    await page.keyboard.press('Control+Shift+z');
    await expect.poll(() => cellOf(page, id).getAttribute('data-way-label')).toBe('4');
    await saveNow(page);
    expect((await stored(page, flatId)).ways.findIndex((w) => w.id === id)).toBeGreaterThan(
      original.ways.findIndex((w) => w.id === id),
    );
  });

  it('a second session saving the same board gets the conflict prompt and loses nothing', async () => {
    const { page } = browser;
    const other = await openBrowser();
    try {
      await signIn(other.page, 'designer');
      // Both open the board
      await openEditor(page, flatId);
      await openEditor(other.page, flatId);

      // The first session changes the immersion heater's length and saves
      await page.locator('[data-way-label="4"]').click();
      await page.getByRole('region', { name: 'Way panel' }).getByLabel('Length (m)').fill('13');
      await saveNow(page);

      // The second session, still on the old version, renames the cooker way and saves
      await other.page.locator('[data-way-label="5"]').click();
      const serves = other.page.getByRole('region', { name: 'Way panel' }).getByLabel('Serves');
      await serves.fill('Cooker: range, kitchen island');
      await other.page.getByRole('button', { name: 'Save', exact: true }).click();
      const prompt = other.page.getByRole('dialog', { name: 'This board was saved elsewhere' });
      await prompt.waitFor();
      // Nothing typed is lost while the prompt is up
      await expect(serves.inputValue()).resolves.toBe('Cooker: range, kitchen island');

      // Keep mine: saved on top of the other session's version
      await prompt.getByRole('button', { name: 'Keep mine' }).click();
      await other.page.locator('[data-testid="save-state"][data-dirty="false"]').waitFor();
      const board = await stored(other.page, flatId);
      const cookerId = await other.page.locator('[data-way-label="5"]').getAttribute('data-way-id');
      expect(board.ways.find((w) => w.id === cookerId)?.circuit?.serves).toBe('Cooker: range, kitchen island');

      // The first session now meets the conflict; "Reload theirs" brings in the second's work
      await page.locator('[data-way-label="4"]').click();
      await page.getByRole('region', { name: 'Way panel' }).getByLabel('Length (m)').fill('14');
      await page.getByRole('button', { name: 'Save', exact: true }).click();
      const theirs = page.getByRole('dialog', { name: 'This board was saved elsewhere' });
      await theirs.getByRole('button', { name: 'Reload theirs' }).click();
      await expect
        .poll(() => page.locator('[data-way-label="5"]').getAttribute('aria-label'))
        .toContain('Cooker: range, kitchen island');
    } finally {
      await other.close();
    }
  });

  it('with two rails, a way is dragged from one rail to the other', async () => {
    const { page } = browser;
    const workshopId = await boardIdByName(page, 'Workshop DB1');
    const workshop = await stored(page, workshopId);
    try {
      await openEditor(page, workshopId);
      await page.getByLabel('Rails').selectOption('2');
      // 36 modules as two rails of 18: the devices flow onto the second rail
      await page.locator('[data-rail="1"]').waitFor();
      // A single-pole RCBO: it fits the second rail's free modules (a three-pole device would
      // need its phase positions left empty there and is refused, as it should be)
      const first = page.locator('[data-rail="0"] [data-way-id][aria-label*="RCBO"]').first();
      const id = (await first.getAttribute('data-way-id'))!;
      // Both rails in view, away from the window's edges (where dragging scrolls the page)
      await page.locator('[data-rail="1"]').evaluate((el) => el.scrollIntoView({ block: 'end' }));
      const from = await center(first);
      const to = await center(page.locator('[data-free-rail="1"]'));
      await page.mouse.move(from.x, from.y);
      await page.mouse.down();
      await page.mouse.move(from.x, from.y + 10, { steps: 3 });
      await page.mouse.move(to.x, to.y, { steps: 15 });
      await page.mouse.up();
      await expect.poll(() => page.locator(`[data-rail="1"] [data-way-id="${id}"]`).count()).toBe(1);
      // Undo twice: back on rail 1, and one rail again
      await page.locator('body').click({ position: { x: 5, y: 5 } });
      await page.keyboard.press('Control+z');
      await expect.poll(() => page.locator(`[data-rail="0"] [data-way-id="${id}"]`).count()).toBe(1);
      await page.keyboard.press('Control+z');
      await expect.poll(() => page.locator('[data-rail="1"]').count()).toBe(0);
    } finally {
      await restore(page, workshopId, workshop);
    }
  });

  it('removing the way that feeds another board asks before saving and names the board', async () => {
    const { page } = browser;
    const workshopId = await boardIdByName(page, 'Workshop DB1');
    const workshop = await stored(page, workshopId);
    try {
      await openEditor(page, workshopId);
      // 10L1 is the sub-main to the flat's consumer unit (the demo's tree)
      await page.locator('[data-way-label="10L1"]').focus();
      await page.keyboard.press('Delete');
      await expect.poll(() => page.locator('[data-way-label="10L1"]').count()).toBe(0);
      // The autosave (AUTOSAVE_MS after the change) asks; a click on Save raced it on a loaded
      // machine (the button is disabled while that save is under way), so the test waits for it
      const question = page.getByRole('dialog', { name: 'Other boards are fed from this board' });
      await question.waitFor({ timeout: 30_000 });
      await expect(question.textContent()).resolves.toContain('Flat 1 consumer unit');
      await question.getByRole('button', { name: 'Keep editing' }).click();
      await expect(page.getByTestId('save-state').textContent()).resolves.toMatch(/Not saved/);
      // Nothing was saved: the flat is still fed from the workshop's way
      expect((await stored(page, flatId)).feed).toMatchObject({ from: 'way', boardId: workshopId });
      expect((await stored(page, workshopId)).version).toBe(workshop.version);
      // Undo puts the way back; the draft is as stored again
      await page.keyboard.press('Control+z');
      await expect.poll(() => page.locator('[data-way-label="10L1"]').count()).toBe(1);
    } finally {
      await restore(page, workshopId, workshop);
    }
  });

  it('sending for review: a failing way is refused with the list, a sound board goes to review', async () => {
    const { page } = browser;
    // A board of its own (removed at the end): the flat's settings and one too-long way
    const flat = await stored(page, flatId);
    const site = (await (await page.request.get(`${APP_URL}/api/boards/${flatId}`)).json()).board.siteId;
    const { location, phases, supply, incoming, enclosureModules, rails, dwelling } = flat;
    const settings = {
      name: 'Editor review check',
      location,
      phases,
      supply,
      incoming,
      enclosureModules,
      rails,
      dwelling,
    };
    const created = await page.request.post(`${APP_URL}/api/boards`, { data: { ...settings, siteId: site } });
    expect(created.status()).toBe(201);
    const boardId = (await created.json()).board.id as string;
    try {
      const alarms = flat.ways.find((w) => w.circuit?.serves === 'Smoke and heat alarms')!;
      const way = {
        id: crypto.randomUUID(),
        rail: 0,
        position: 0,
        device: alarms.device,
        // 1.0 mm² fixed over 1800 m: voltage drop and Zs fail
        circuit: { ...alarms.circuit, serves: 'Workshop alarm sounder', lengthM: 1800, csaMm2: 1 },
      };
      const put = await page.request.put(`${APP_URL}/api/boards/${boardId}`, {
        data: { version: 1, settings, ways: [way] },
      });
      expect(put.status()).toBe(200);

      await openEditor(page, boardId);
      await page.getByRole('button', { name: 'Send for review' }).click();
      // "Send for review" confirms first, saying what goes
      const confirm = page.getByRole('dialog', { name: 'Send Editor review check for review?' });
      await expect(confirm.textContent()).resolves.toMatch(/Revision 1: 1 way: 1 circuit, 0 spare/);
      await confirm.getByRole('button', { name: 'Send for review' }).click();
      const refusal = page.getByRole('dialog', { name: 'Not sent for review' });
      await expect(refusal.textContent()).resolves.toMatch(/Way 1.*Workshop alarm sounder/);
      await refusal.getByRole('button', { name: 'Show them on the board' }).click();
      // The failing way is selected: give it its real length, then send again
      await page.getByRole('region', { name: 'Way panel' }).getByLabel('Length (m)').fill('20');
      await expect
        .poll(() => page.locator(`[data-way-id="${way.id}"] [data-verdict]`).getAttribute('data-verdict'))
        .not.toBe('fails');
      await page.getByRole('button', { name: 'Send for review' }).click();
      await page
        .getByRole('dialog', { name: /for review\?$/ })
        .getByRole('button', { name: 'Send for review' })
        .click();
      await expect.poll(() => page.getByText('In review', { exact: true }).count()).toBeGreaterThan(0);
      await expect(page.getByText(/In review: the board can be changed again/).count()).resolves.toBe(1);
      expect(await page.getByRole('region', { name: 'Device tray' }).count()).toBe(0);
      // Saved before it was sent
      expect((await stored(page, boardId)).ways[0].circuit?.lengthM).toBe(20);
    } finally {
      await page.request.delete(`${APP_URL}/api/boards/${boardId}`);
    }
  });

  it('every way of the three-phase board is readable, level and whole, at desktop and tablet widths', async () => {
    const { page } = browser;
    const workshopId = await boardIdByName(page, 'Workshop DB1');
    const workshop = await stored(page, workshopId);
    try {
      for (const width of [1440, 1024, 768]) {
        await page.setViewportSize({ width, height: 900 });
        await openEditor(page, workshopId);
        const cells = page.locator('[data-way-id]');
        const count = await cells.count();
        expect(count).toBe(workshop.ways.length);
        for (let i = 0; i < count; i += 1) {
          const cell = cells.nth(i);
          const id = (await cell.getAttribute('data-way-id'))!;
          const label = (await cell.getAttribute('data-way-label'))!;
          const serves = workshop.ways.find((w) => w.id === id)?.circuit?.serves;
          const entry = page.locator(`[data-legend-way="${id}"]`);
          // The legend entry: on screen, not cut, level, with the reference, description and verdict in words
          const box = (await entry.boundingBox())!;
          expect(box.x).toBeGreaterThanOrEqual(0);
          expect(box.x + box.width).toBeLessThanOrEqual(width);
          const clipped = await entry.evaluate((el) =>
            Array.from(el.querySelectorAll<HTMLElement>('*')).some(
              (e) =>
                !e.classList.contains('sr-only') &&
                (e.scrollWidth > e.clientWidth + 1 || getComputedStyle(e).writingMode !== 'horizontal-tb'),
            ),
          );
          expect(clipped).toBe(false);
          const text = (await entry.textContent())!;
          if (label) expect(text.startsWith(`Way ${label}`)).toBe(true);
          if (serves) expect(text).toContain(serves);
          if (serves) expect(text).toMatch(/(Passes|Near limit|Fails)$/);
        }
        // Hover and focus show the way in full beside the device
        const saw = cells.filter({ has: page.locator('[data-way-tip]') }).nth(3);
        await saw.hover();
        await expect(saw.locator('[data-way-tip]').isVisible()).resolves.toBe(true);
        await expect(saw.locator('[data-way-tip]').textContent()).resolves.toBe(await saw.getAttribute('aria-label'));
        await page.mouse.move(0, 0);
        await expect(saw.locator('[data-way-tip]').isVisible()).resolves.toBe(false);
        await saw.focus();
        await page.keyboard.press('Shift+Tab');
        await page.keyboard.press('Tab');
        await expect(saw.locator('[data-way-tip]').isVisible()).resolves.toBe(true);
      }
    } finally {
      await page.setViewportSize({ width: 1440, height: 900 });
    }
  });

  it('an installer sees the board read-only: no tray, disabled fields', async () => {
    const installer = await openBrowser();
    try {
      await signIn(installer.page, 'installer');
      await installer.page.goto(`${APP_URL}/boards/${flatId}`);
      await installer.page.getByRole('region', { name: 'Drawn board' }).waitFor();
      expect(await installer.page.getByRole('region', { name: 'Device tray' }).count()).toBe(0);
      await expect(installer.page.getByText(/Read only/).textContent()).resolves.toMatch(/not change it/);
      await installer.page.locator('[data-way-label="1"]').click();
      await expect(installer.page.getByLabel('Length (m)').isDisabled()).resolves.toBe(true);
    } finally {
      await installer.close();
    }
  });
});
