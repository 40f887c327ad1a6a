/**
 * Board editor latency in a real browser: from a change (a field typed in the way panel, or a
 * way dropped at a new place on the rail) to the new verdict rendered on that way and painted,
 * measured inside the page with performance.now(). Runs on the demo three-phase board
 * 'Workshop DB1'. Then where the time went (medians, and of the slowest 5 %): the change drawn,
 * the sizing request sent, its time on the server (request start to first byte, Resource
 * Timing), the answer in, the verdict in the DOM, painted, and the main thread's long tasks.
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
// Time between changes: a designer's pace, longer than the editor's 80 ms debounce
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

/** Where one change's time went, ms from the change (see `installProbes`). */
type Sample = {
  total: number;
  /** The change drawn: the drawn board's `data-edit-seq` committed to the DOM. */
  edit: number;
  /** The sizing request sent (fetch start), answered (response end), and the verdict in the DOM. */
  sent: number;
  server: number;
  answered: number;
  verdict: number;
  /** Main-thread long tasks (over 50 ms) inside the change, summed. */
  longTasks: number;
};

/**
 * Page-side probes for the breakdown: when the drawn board's edit sequence reaches the DOM, and
 * the long tasks. The sizing request's own times come from the Resource Timing entries.
 */
async function installProbes(page: Page) {
  await page.evaluate(() => {
    const w = window as unknown as { benchEditAt: number; benchLongTasks: PerformanceEntry[] };
    const board = document.querySelector<HTMLElement>('[data-testid="drawn-board"]')!;
    w.benchLongTasks = [];
    performance.setResourceTimingBufferSize(100_000);
    new MutationObserver(() => (w.benchEditAt = performance.now())).observe(board, {
      attributes: true,
      attributeFilter: ['data-edit-seq'],
    });
    new PerformanceObserver((list) => w.benchLongTasks.push(...list.getEntries())).observe({ type: 'longtask' });
  });
}

/**
 * Waits, in the page, until the drawn board shows a sizing of the current edit sequence newer
 * than `before` (its `data-sized-for`; the devices are drawn in the same commit) with a
 * verdict on the way.
 */
async function waitForVerdict(page: Page, wayId: string, before: number): Promise<Sample> {
  return page.evaluate(
    ({ wayId, before }) =>
      new Promise<Sample>((resolve, reject) => {
        const board = document.querySelector<HTMLElement>('[data-testid="drawn-board"]')!;
        const w = window as unknown as { benchT0: number; benchEditAt: number; benchLongTasks: PerformanceEntry[] };
        const t0 = w.benchT0;
        const done = () => {
          const cell = document.querySelector<HTMLElement>(`[data-way-id="${wayId}"]`);
          const sized = Number(board.dataset.sizedFor ?? 0);
          const editSeq = Number(board.dataset.editSeq);
          if (cell && sized > before && sized === editSeq && cell.querySelector('[data-verdict]')) {
            const verdictAt = performance.now();
            observer.disconnect();
            clearTimeout(timer);
            // The verdict is in the DOM; count the frame that paints it
            requestAnimationFrame(() => {
              const end = performance.now();
              const request = performance
                .getEntriesByType('resource')
                .filter((e) => e.name.includes('/sizing') && e.startTime >= t0)
                .pop() as PerformanceResourceTiming | undefined;
              const longTasks = w.benchLongTasks
                .filter((e) => e.startTime + e.duration > t0 && e.startTime < end)
                .reduce((n, e) => n + Math.min(end, e.startTime + e.duration) - Math.max(t0, e.startTime), 0);
              resolve({
                total: end - t0,
                edit: w.benchEditAt - t0,
                sent: request ? request.fetchStart - t0 : NaN,
                server: request ? request.responseStart - request.requestStart : NaN,
                answered: request ? request.responseEnd - t0 : NaN,
                verdict: verdictAt - t0,
                longTasks,
              });
            });
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

/** The median of each part of the time, and of the slowest 5 % of the changes. */
function breakdown(name: string, samples: Sample[]) {
  const median = (xs: number[]) => {
    const s = xs.filter((x) => !Number.isNaN(x)).sort((a, b) => a - b);
    return s.length ? s[Math.floor((s.length - 1) / 2)] : NaN;
  };
  const row = (label: string, of: Sample[]) => {
    const m = (f: (s: Sample) => number) => median(of.map(f)).toFixed(1).padStart(6);
    return (
      `  ${label.padEnd(14)} change drawn ${m((s) => s.edit)} | request sent ${m((s) => s.sent)}` +
      ` | on the server ${m((s) => s.server)} | answer in ${m((s) => s.answered)}` +
      ` | verdict in the DOM ${m((s) => s.verdict)} | painted ${m((s) => s.total)}` +
      ` | long tasks ${m((s) => s.longTasks)}`
    );
  };
  const slowest = [...samples].sort((a, b) => b.total - a.total).slice(0, Math.max(1, Math.ceil(samples.length / 20)));
  console.log(`${name}, ms from the change (medians):`);
  console.log(row('all', samples));
  console.log(row('slowest 5 %', slowest));
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
    await installProbes(page);
    const fieldSamples: Sample[] = [];
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
    const dropSamples: Sample[] = [];
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

    const totals = (xs: Sample[]) => xs.map((x) => x.total);
    console.log(summary('field change → verdict', totals(fieldSamples)));
    console.log(summary('drop → verdict', totals(dropSamples)));
    console.log(summary('all changes', totals([...fieldSamples, ...dropSamples])));
    console.log();
    breakdown('Field changes', fieldSamples);
    breakdown('Drops', dropSamples);
    const p95 = percentile(
      totals([...fieldSamples, ...dropSamples]).sort((a, b) => a - b),
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
