/**
 * Board editor latency in a real browser: from a change (a field typed in the way panel, or a
 * way dropped at a new place on the rail) to the new verdict rendered on that way, measured
 * inside the page with performance.now(). Runs on the demo three-phase board 'Workshop DB1'.
 * Also reports the editor route's first-load JavaScript as the browser fetched it.
 *
 *   APP_URL=http://127.0.0.1:3000 npx tsx scripts/bench/editor-latency.ts [changes=60]
 *
 * Needs the built app running (next start) with the demo data, and Debian's chromium. The
 * board is put back as it was at the end (the editor autosaves).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

import { chromium, type Page } from 'playwright-core';

const APP_URL = process.env.APP_URL ?? 'http://127.0.0.1:3000';
const CHANGES = Math.max(50, Number(process.argv[2] ?? 60));
// Time between changes: a designer's pace, longer than the editor's 150 ms debounce
const GAP_MS = 250;

function percentile(sorted: number[], p: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i];
}

function summary(name: string, samples: number[]) {
  const s = [...samples].sort((a, b) => a - b);
  const mean = s.reduce((a, b) => a + b, 0) / s.length;
  return `${name.padEnd(26)} n=${String(s.length).padStart(3)}  p50 ${percentile(s, 50).toFixed(1).padStart(6)} ms  p95 ${percentile(s, 95).toFixed(1).padStart(6)} ms  max ${s[s.length - 1].toFixed(1).padStart(6)} ms  mean ${mean.toFixed(1)} ms`;
}

/** Waits, in the page, until the way shows a sizing of the current edit sequence newer than `before`. */
async function waitForVerdict(page: Page, wayId: string, before: number): Promise<number> {
  return page.evaluate(
    ({ wayId, before }) =>
      new Promise<number>((resolve, reject) => {
        const board = document.querySelector<HTMLElement>('[data-testid="drawn-board"]')!;
        const t0 = (window as unknown as { benchT0: number }).benchT0;
        const done = () => {
          const cell = document.querySelector<HTMLElement>(`[data-way-id="${wayId}"]`);
          const sized = Number(cell?.dataset.sizedFor ?? 0);
          const editSeq = Number(board.dataset.editSeq);
          if (cell && sized > before && sized === editSeq && cell.querySelector('[data-verdict]')) {
            observer.disconnect();
            clearTimeout(timer);
            // The verdict is in the DOM; count the frame that paints it
            requestAnimationFrame(() => resolve(performance.now() - t0));
            return true;
          }
          return false;
        };
        const observer = new MutationObserver(done);
        observer.observe(board, { attributes: true, subtree: true, childList: true });
        const timer = setTimeout(() => {
          observer.disconnect();
          reject(new Error('no verdict within 5 s'));
        }, 5000);
        done();
      }),
    { wayId, before },
  );
}

async function main() {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'bw-bench-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1440, height: 900 },
    args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
  });
  // tsx keeps function names with a helper the page does not have; give it one
  await context.addInitScript('window.__name = (f) => f;');
  const page = context.pages()[0] ?? (await context.newPage());
  try {
    // Sign in as the demo designer and find the workshop board
    await page.goto(`${APP_URL}/login`);
    await page.getByLabel('E-mail').fill('designer@example.test');
    await page.getByLabel('Password').fill('designer-demo-2026');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((u) => !u.pathname.startsWith('/login'));
    const { boards } = (await (await page.request.get(`${APP_URL}/api/boards`)).json()) as {
      boards: { id: string; name: string }[];
    };
    const boardId = boards.find((b) => b.name === 'Workshop DB1')?.id;
    if (!boardId) throw new Error('the demo board "Workshop DB1" is missing; run scripts/seed.ts');
    const original = (await (await page.request.get(`${APP_URL}/api/boards/${boardId}`)).json()).board;

    // First load of the editor route, with a cold cache: the JavaScript the browser fetched
    await page.goto(`${APP_URL}/boards/${boardId}`, { waitUntil: 'networkidle' });
    await page.locator('[data-verdict]').first().waitFor();
    const js = await page.evaluate(() =>
      performance
        .getEntriesByType('resource')
        .filter((e) => (e as PerformanceResourceTiming).initiatorType === 'script' || e.name.endsWith('.js'))
        .map((e) => {
          const r = e as PerformanceResourceTiming;
          return { encoded: r.encodedBodySize, body: r.decodedBodySize };
        }),
    );
    const kb = (n: number) => `${(n / 1024).toFixed(1)} kB`;
    const ways = await page.locator('[data-way-id]').count();
    console.log(
      `Editor route first load: ${js.length} scripts, ${kb(js.reduce((n, r) => n + r.encoded, 0))} as sent (compressed), ${kb(js.reduce((n, r) => n + r.body, 0))} uncompressed`,
    );
    console.log(
      `Board: Workshop DB1, ${ways} devices on the rail; ${CHANGES} changes of each kind, ${GAP_MS} ms apart\n`,
    );

    // 1. Field changes: the length of one circuit in the way panel
    const target = page.locator('[data-way-label="4L2"]');
    const targetId = (await target.getAttribute('data-way-id'))!;
    await target.click();
    await page.getByRole('region', { name: 'Way panel' }).getByLabel('Length (m)').waitFor();
    const fieldSamples: number[] = [];
    for (let i = 0; i < CHANGES; i++) {
      const before = Number(await page.locator('[data-testid="drawn-board"]').getAttribute('data-edit-seq'));
      await page.evaluate(
        (value) => {
          const input = [...document.querySelectorAll<HTMLInputElement>('input')].find(
            (el) => el.labels?.[0]?.textContent === 'Length (m)',
          )!;
          const setter = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
          (window as unknown as { benchT0: number }).benchT0 = performance.now();
          setter.call(input, String(value));
          input.dispatchEvent(new Event('input', { bubbles: true }));
        },
        10 + (i % 30),
      );
      fieldSamples.push(await waitForVerdict(page, targetId, before));
      await page.waitForTimeout(GAP_MS);
    }

    // 2. Drops: a way dragged with the pointer one place along the rail and back again
    const dropSamples: number[] = [];
    const mover = page.locator('[data-way-label="5L1"]');
    const moverId = (await mover.getAttribute('data-way-id'))!;
    await page.evaluate(() => {
      // The clock starts when the pointer is let go, before the editor handles the drop
      document.addEventListener(
        'pointerup',
        () => ((window as unknown as { benchT0: number }).benchT0 = performance.now()),
        {
          capture: true,
        },
      );
    });
    for (let i = 0; i < CHANGES; i++) {
      const cell = page.locator(`[data-way-id="${moverId}"]`);
      const box = (await cell.boundingBox())!;
      const step = i % 2 === 0 ? 1 : -1;
      const neighbour = (await page.locator('[data-way-id]').evaluateAll(
        (els, { id, step }) => {
          const i = els.findIndex((e) => e.getAttribute('data-way-id') === id);
          return els[i + step]?.getAttribute('data-way-id');
        },
        { id: moverId, step },
      ))!;
      const to = (await page.locator(`[data-way-id="${neighbour}"]`).boundingBox())!;
      const before = Number(await page.locator('[data-testid="drawn-board"]').getAttribute('data-edit-seq'));
      await page.mouse.move(box.x + box.width / 2, box.y + 60);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width / 2 + 8 * step, box.y + 60, { steps: 2 });
      await page.mouse.move(to.x + to.width / 2 + (step * to.width) / 4, to.y + 60, { steps: 4 });
      await page.mouse.up();
      dropSamples.push(await waitForVerdict(page, moverId, before));
      await page.waitForTimeout(GAP_MS);
    }

    console.log(summary('field change → verdict', fieldSamples));
    console.log(summary('drop → verdict', dropSamples));
    console.log(summary('all changes', [...fieldSamples, ...dropSamples]));
    const p95 = percentile(
      [...fieldSamples, ...dropSamples].sort((a, b) => a - b),
      95,
    );
    console.log(`\nTarget p95 < 150 ms: ${p95 < 150 ? 'met' : 'NOT met'} (${p95.toFixed(1)} ms)`);

    // Put the board back as it was (the editor autosaves the changes made here)
    await page.locator('[data-testid="save-state"][data-dirty="false"]').waitFor({ timeout: 15_000 });
    const now = (await (await page.request.get(`${APP_URL}/api/boards/${boardId}`)).json()).board;
    const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = original;
    const res = await page.request.put(`${APP_URL}/api/boards/${boardId}`, {
      data: {
        version: now.version,
        settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
        ways: original.ways.map(({ id, rail, position, device, circuit }: Record<string, unknown>) => ({
          id,
          rail,
          position,
          device,
          circuit,
        })),
      },
    });
    if (res.status() !== 200) console.error(`Could not put the board back: HTTP ${res.status()}`);
  } finally {
    await context.close();
    fs.rmSync(profile, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
