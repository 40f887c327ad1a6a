/**
 * Browser tests drive Debian's chromium with playwright-core against the built app that
 * scripts/test.sh starts on APP_URL (default http://127.0.0.1:3100), seeded with the demo.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

import { chromium, type BrowserContext, type Page } from 'playwright-core';

import { type DEMO_USERS, demoUser } from '@/scripts/demo-data';

export { demoUser };

export const APP_URL = process.env.APP_URL ?? 'http://127.0.0.1:3100';

export type Role = (typeof DEMO_USERS)[number]['role'];

/** A fresh browser profile (its own cookies), desktop or phone sized. */
export async function openBrowser(opts: { phone?: boolean } = {}): Promise<{
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'bw-browser-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: opts.phone ? { width: 390, height: 844 } : { width: 1440, height: 900 },
    deviceScaleFactor: opts.phone ? 2 : 1,
    hasTouch: !!opts.phone,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(15_000);
  return {
    context,
    page,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Signs in through the sign-in page as a demo user (or given credentials). */
export async function signIn(page: Page, who: Role | { email: string; password: string }) {
  const { email, password } = typeof who === 'string' ? demoUser(who) : who;
  await page.goto(`${APP_URL}/login`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await Promise.all([
    page.waitForURL((url) => !url.pathname.startsWith('/login'), { timeout: 15_000 }),
    page.getByRole('button', { name: 'Sign in' }).click(),
  ]);
}

/** The id of a seeded demo board, looked up by name through the API as the page's user. */
export async function boardIdByName(page: Page, name: string): Promise<string> {
  const res = await page.request.get(`${APP_URL}/api/boards`);
  const { boards } = (await res.json()) as { boards: { id: string; name: string }[] };
  const board = boards.find((b) => b.name === name);
  if (!board) throw new Error(`no board named ${name}`);
  return board.id;
}

/** What the page reports as going wrong from now on: console errors and uncaught exceptions. */
export function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(String(e)));
  return errors;
}
