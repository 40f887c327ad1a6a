/**
 * axe-core (WCAG 2.1 A and AA rules) over every page each role opens, in real Chromium
 * against the built app: sign-in, sites, a site, boards, the editor, review, the schedule
 * page, the label walk, quick size, members and the outbox, at desktop size and, for the pages
 * used on site, at phone size. Any violation fails the test and is listed with its elements.
 */
import crypto from 'node:crypto';
import { createRequire } from 'node:module';

import type { ConsoleMessage, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { db } from '@/lib/db';
import { Board, Organisation, Site, Way } from '@/models';
import { DEMO_ORG, DEMO_SITE, FLAT_BOARD, WORKSHOP_BOARD, demoUser, demoWays } from '@/scripts/demo-data';

import { APP_URL, boardIdByName, openBrowser, signIn, type Role } from './helpers';

// axe-core's own bundle, evaluated in the page (the page's CSP does not apply to evaluate)
const AXE_SOURCE: string = createRequire(import.meta.url)('axe-core').source;
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

type Violation = { rule: string; impact: string | null; help: string; nodes: string[] };

/** Runs axe over the whole page as it is now; one entry per rule broken, with its elements. */
async function axeViolations(page: Page): Promise<Violation[]> {
  await page.evaluate(AXE_SOURCE);
  return page.evaluate(async (tags) => {
    const axe = (window as unknown as { axe: typeof import('axe-core') }).axe;
    const result = await axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
    return result.violations.map((v) => ({
      rule: v.id,
      impact: v.impact ?? null,
      help: v.help,
      nodes: v.nodes.map((n) => `${n.target.join(' ')}: ${n.failureSummary?.split('\n').slice(1).join(' ').trim()}`),
    }));
  }, WCAG_TAGS);
}

let inReviewId: string;
let issuedId: string;

beforeAll(async () => {
  // Two boards of this test's own: one in review (the review page) and one issued (schedule, walk)
  db();
  const org = await Organisation.findOne({ where: { name: DEMO_ORG } });
  const site = await Site.findOne({ where: { organisationId: org!.id, name: DEMO_SITE.name } });
  const make = async (board: typeof FLAT_BOARD) => {
    const row = await Board.create({
      ...board.settings,
      name: `Axe ${board.settings.name} ${crypto.randomUUID().slice(0, 6)}`,
      organisationId: org!.id,
      siteId: site!.id,
      // Sending for review is the editor's step; the row is put in review directly
      status: 'in-review',
    });
    await Way.bulkCreate(demoWays(board).map((w) => ({ ...w, boardId: row.id })));
    return row.id;
  };
  inReviewId = await make(WORKSHOP_BOARD);
  issuedId = await make(FLAT_BOARD);
  // Issued the way an inspector issues it, so that the revision exists
  const { page, close } = await openBrowser();
  try {
    await signIn(page, 'inspector');
    const res = await page.request.post(`${APP_URL}/api/boards/${issuedId}/review/approve`, {
      // The issuer declares with their own name (separation of duties)
      data: { acknowledgeFailures: true, declaration: demoUser('inspector').name },
    });
    expect(res.status(), await res.text()).toBe(200);
  } finally {
    await close();
  }
});

afterAll(async () => {
  await db().close();
  (globalThis as { boardwrightSequelize?: unknown }).boardwrightSequelize = undefined;
});

type Screen = {
  name: string;
  role: Role | null;
  phone?: boolean;
  /** The page's path; `ids` gives the boards and site this test uses. */
  path: (ids: { workshop: string; flat: string; site: string }) => string;
  /** What shows once the page has drawn its content. */
  ready: (page: Page) => Promise<void>;
};

const heading = (name: string | RegExp) => async (page: Page) => {
  await page.getByRole('heading', { name, level: 1 }).first().waitFor();
};
// The schedule's table is drawn in the browser once the page has loaded
const scheduleSheet = async (page: Page) => {
  await heading(/Schedule/)(page);
  await page.locator('[data-print-root] tbody td').first().waitFor();
};

// The site page once its supply tree (diagram and list) has loaded
const siteView = async (page: Page) => {
  await heading(DEMO_SITE.name)(page);
  await page.getByRole('list', { name: 'Boards of the site, in supply order' }).waitFor();
  await page.getByTestId('site-diagram').locator('svg').first().waitFor();
};

// The review page once the browser has drawn its ways table (features/review/components/ways-table.tsx)
const reviewView = async (page: Page) => {
  await heading(/^Review: /)(page);
  await page.getByRole('columnheader', { name: 'Zs Ω (max)' }).waitFor();
};

// The editor of a board fed from a sub-main once its verdicts and its Supply panel have drawn
const fedEditorView = async (page: Page) => {
  await page.locator('[data-verdict]').first().waitFor();
  await page.getByTestId('derived-supply').getByLabel('Fed from').waitFor();
};

const SCREENS: Screen[] = [
  { name: 'sign-in', role: null, path: () => '/login', ready: heading('Boardwright') },
  { name: 'sites', role: 'designer', path: () => '/sites', ready: heading('Sites') },
  { name: 'a site', role: 'designer', path: ({ site }) => `/sites/${site}`, ready: siteView },
  { name: 'a site (inspector)', role: 'inspector', path: ({ site }) => `/sites/${site}`, ready: siteView },
  { name: 'a site (phone)', role: 'designer', phone: true, path: ({ site }) => `/sites/${site}`, ready: siteView },
  { name: 'boards', role: 'designer', path: () => '/boards', ready: heading('Boards') },
  { name: 'boards (phone)', role: 'installer', phone: true, path: () => '/boards', ready: heading('Boards') },
  {
    name: 'editor',
    role: 'designer',
    path: ({ workshop }) => `/boards/${workshop}`,
    ready: async (page) => {
      await page.getByTestId('drawn-board').waitFor();
      await page.locator('[data-verdict]').first().waitFor();
    },
  },
  {
    name: 'editor, a way picked (way panel)',
    role: 'designer',
    path: ({ workshop }) => `/boards/${workshop}`,
    ready: async (page) => {
      await page.locator('[data-verdict]').first().waitFor();
      await page.locator('[data-way-label="4L1"]').click();
      await page.getByRole('region', { name: 'Sizing result' }).waitFor();
    },
  },
  {
    name: 'editor of a board fed from a sub-main (derived supply)',
    role: 'designer',
    path: ({ flat }) => `/boards/${flat}`,
    ready: fedEditorView,
  },
  {
    name: 'editor (inspector, read only)',
    role: 'inspector',
    path: ({ workshop }) => `/boards/${workshop}`,
    ready: async (page) => {
      await page.locator('[data-verdict]').first().waitFor();
    },
  },
  {
    name: 'editor (installer, read only)',
    role: 'installer',
    path: ({ workshop }) => `/boards/${workshop}`,
    ready: async (page) => {
      await page.getByTestId('drawn-board').waitFor();
    },
  },
  {
    name: 'editor (phone)',
    role: 'designer',
    phone: true,
    path: ({ workshop }) => `/boards/${workshop}`,
    ready: async (page) => {
      await page.locator('[data-verdict]').first().waitFor();
    },
  },
  {
    name: 'review',
    role: 'inspector',
    path: () => `/boards/${inReviewId}/review`,
    ready: reviewView,
  },
  { name: 'schedule', role: 'inspector', path: () => `/boards/${issuedId}/schedule`, ready: scheduleSheet },
  {
    name: 'schedule (installer)',
    role: 'installer',
    path: () => `/boards/${issuedId}/schedule`,
    ready: scheduleSheet,
  },
  {
    name: 'label walk (phone)',
    role: 'installer',
    phone: true,
    path: () => `/boards/${issuedId}/walk`,
    ready: heading(/^Label walk: /),
  },
  { name: 'label walk', role: 'installer', path: () => `/boards/${issuedId}/walk`, ready: heading(/^Label walk: /) },
  { name: 'quick size', role: 'designer', path: () => '/quick-size', ready: heading('Quick size') },
  {
    name: 'quick size (phone)',
    role: 'designer',
    phone: true,
    path: () => '/quick-size',
    ready: heading('Quick size'),
  },
  {
    name: 'review (phone)',
    role: 'inspector',
    phone: true,
    path: () => `/boards/${inReviewId}/review`,
    ready: reviewView,
  },
  {
    name: 'editor of a board fed from a sub-main (phone)',
    role: 'designer',
    phone: true,
    path: ({ flat }) => `/boards/${flat}`,
    ready: fedEditorView,
  },
  { name: 'sites (phone)', role: 'designer', phone: true, path: () => '/sites', ready: heading('Sites') },
  { name: 'members', role: 'admin', path: () => '/members', ready: heading('Members') },
  { name: 'members (phone)', role: 'admin', phone: true, path: () => '/members', ready: heading('Members') },
  { name: 'outbox', role: 'admin', path: () => '/mailbox', ready: heading(/outbox/i) },
];

describe('accessibility (axe-core, WCAG 2.1 A and AA)', () => {
  let ids: { workshop: string; flat: string; site: string };

  beforeAll(async () => {
    const { page, close } = await openBrowser();
    try {
      await signIn(page, 'designer');
      const res = await page.request.get(`${APP_URL}/api/sites`);
      const { sites } = (await res.json()) as { sites: { id: string; name: string }[] };
      ids = {
        workshop: await boardIdByName(page, WORKSHOP_BOARD.settings.name),
        flat: await boardIdByName(page, FLAT_BOARD.settings.name),
        site: sites.find((s) => s.name === DEMO_SITE.name)!.id,
      };
    } finally {
      await close();
    }
  });

  // One signed-in browser per role and size, shared by the screens that use it
  const browsers = new Map<string, Awaited<ReturnType<typeof openBrowser>>>();
  async function browserFor(screen: Screen) {
    const key = `${screen.role ?? 'signed out'}${screen.phone ? ' phone' : ''}`;
    let browser = browsers.get(key);
    if (!browser) {
      browser = await openBrowser({ phone: screen.phone });
      if (screen.role) await signIn(browser.page, screen.role);
      browsers.set(key, browser);
    }
    return browser.page;
  }
  afterAll(async () => {
    for (const browser of browsers.values()) await browser.close();
  });

  it.each(SCREENS)('$name has no violations (nor, on a phone, a page wider than it)', async (screen) => {
    const page = await browserFor(screen);
    const errors: string[] = [];
    const onConsole = (m: ConsoleMessage) => {
      if (m.type() === 'error') errors.push(m.text());
    };
    const onError = (e: Error) => errors.push(String(e));
    page.on('console', onConsole);
    page.on('pageerror', onError);
    try {
      await page.goto(`${APP_URL}${screen.path(ids)}`);
      await screen.ready(page);
      await page.waitForLoadState('networkidle');
      // One line per element, so that a failure names every element and what is wrong with it
      const report = (await axeViolations(page)).flatMap((v) => [
        `${v.rule} (${v.impact}): ${v.help}`,
        ...v.nodes.map((n) => `  ${n}`),
      ]);
      expect(report.join('\n')).toBe('');
      expect(errors).toEqual([]);
      // On a phone nothing widens the page past the screen (a wide table scrolls in its own box):
      // the review page was 643 px wide on a 390 px screen, the members page 852, a fed board's editor 487
      if (screen.phone) {
        const width = await page.evaluate(() => ({
          page: document.documentElement.scrollWidth,
          screen: document.documentElement.clientWidth,
        }));
        expect(width.page, 'the page is wider than the phone').toBeLessThanOrEqual(width.screen);
      }
    } finally {
      page.off('console', onConsole);
      page.off('pageerror', onError);
    }
  });
});
