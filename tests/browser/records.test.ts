/**
 * Kept records in real Chromium against the built app: the designer reads a returned review
 * in the editor (the inspector's way comment beside its way, the reason at the top); issuing
 * asks for a confirmation that says what is issued and records the typed declaration; a
 * designer's delete of a draft board is undone from the list; an unknown board shows the
 * app's own not-found page.
 */
import crypto from 'node:crypto';

import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { layoutWays } from '@/lib/boards/layout';
import { db } from '@/lib/db';
import { AuditEvent, Board, BoardRevision, Comment, Organisation, Site, User, Way } from '@/models';
import { DEMO_ORG, DEMO_SITE, FLAT_BOARD, demoWays } from '@/scripts/demo-data';

import { APP_URL, demoUser, openBrowser, signIn } from './helpers';

/** A loaded machine may take seconds to answer: polls wait up to 15 s. */
const POLL = { timeout: 15_000, interval: 200 };

let orgId: string;
let siteId: string;

/** A board of its own in the demo organisation, in review, last changed by the demo designer. */
async function boardInReview(label: string) {
  const designer = await User.findOne({ where: { email: demoUser('designer').email } });
  const board = await Board.create({
    ...FLAT_BOARD.settings,
    name: `${label} ${crypto.randomUUID().slice(0, 6)}`,
    organisationId: orgId,
    siteId,
    status: 'in-review',
    createdById: designer!.id,
    designChangedById: designer!.id,
  });
  await Way.bulkCreate(demoWays(FLAT_BOARD).map((w) => ({ ...w, boardId: board.id })));
  return board;
}

beforeAll(async () => {
  db();
  const org = await Organisation.findOne({ where: { name: DEMO_ORG } });
  const site = await Site.findOne({ where: { organisationId: org!.id, name: DEMO_SITE.name } });
  orgId = org!.id;
  siteId = site!.id;
});

afterAll(async () => {
  await db().close();
  (globalThis as { boardwrightSequelize?: unknown }).boardwrightSequelize = undefined;
});

describe('kept records', () => {
  it('the designer sees the inspector’s way comment beside its way in the editor after a return', async () => {
    const board = await boardInReview('Returned board');
    const ways = await Way.findAll({ where: { boardId: board.id } });
    const commented = ways.find((w) => (w.circuit as { serves?: string } | null)?.serves)!;
    const ref = layoutWays(board.phases, ways as never).find((p) => p.id === commented.id)!.label;
    const wayNote = 'Run this one clear of the bench vice.';
    const reason = 'Two routes to mend before it is issued.';

    // The inspector comments on one way and returns the board from the review page
    const inspector = await openBrowser();
    try {
      const { page } = inspector;
      await signIn(page, 'inspector');
      const res = await page.request.post(`${APP_URL}/api/boards/${board.id}/comments`, {
        data: { wayId: commented.id, body: wayNote },
      });
      expect(res.status()).toBe(201);
      await page.goto(`${APP_URL}/boards/${board.id}/review`);
      await page.getByRole('button', { name: 'Return to draft' }).click();
      await page.getByLabel(/What needs changing/).fill(reason);
      await page.getByRole('button', { name: 'Return with comments' }).click();
      await page.getByText('Returned to draft').waitFor();
    } finally {
      await inspector.close();
    }

    // The designer opens the link of the e-mail: the editor at the review notes
    const designer = await openBrowser();
    try {
      const { page } = designer;
      await signIn(page, 'designer');
      await page.goto(`${APP_URL}/boards/${board.id}#review-notes`);
      const notes = page.getByRole('region', { name: 'Returned for changes' });
      await notes.waitFor();
      await expect(notes.getByTestId('return-reason').textContent()).resolves.toContain(reason);
      const comment = notes.getByTestId('way-comment');
      await expect(comment.textContent()).resolves.toContain(`Way ${ref}`);
      await expect(comment.textContent()).resolves.toContain(wayNote);
      await expect(comment.textContent()).resolves.toContain(demoUser('inspector').name);
      // Beside the way: selecting it shows the comment above the way panel
      await comment.getByRole('button', { name: 'Show the way' }).click();
      const beside = page.getByRole('complementary', { name: 'Review comments on this way' });
      await expect(beside.textContent()).resolves.toContain(wayNote);
      // Marked answered, the notes go
      await notes.getByRole('button', { name: 'Mark all answered' }).click();
      await expect.poll(() => page.getByRole('region', { name: 'Returned for changes' }).count(), POLL).toBe(0);
      expect(await Comment.count({ where: { boardId: board.id, answeredAt: null } })).toBe(0);
    } finally {
      await designer.close();
    }
  });

  it('issuing shows what is issued, asks for the typed name and records the declaration', async () => {
    const board = await boardInReview('Issue check');
    const inspectorName = demoUser('inspector').name;
    const { page, close } = await openBrowser();
    try {
      await signIn(page, 'inspector');
      await page.goto(`${APP_URL}/boards/${board.id}/review`);
      await page.getByRole('button', { name: 'Approve and issue' }).click();
      const dialog = page.getByRole('dialog', { name: `Issue ${board.name}?` });
      const text = (await dialog.textContent())!;
      const ways = demoWays(FLAT_BOARD);
      expect(text).toContain(board.name);
      expect(text).toContain('revision 1');
      // The ways counted by way number, as the boards list and the schedule count them (ways 1–9 of the flat)
      expect(text).toContain(`9 ways: ${ways.filter((w) => w.circuit).length} circuits, 1 spare`);
      expect(text).toMatch(/\d+ pass · \d+ near the limit · \d+ fail/);
      const failures = dialog.getByRole('checkbox', { name: /I issue the board as it is/ });
      if (await failures.count()) await failures.check();
      // Someone else's name is refused, beside the field
      await dialog.getByLabel('Your full name').fill(demoUser('designer').name);
      await dialog.getByRole('button', { name: 'Issue revision 1' }).click();
      await dialog.getByText(`Type your own name (${inspectorName})`).waitFor();
      expect((await Board.findByPk(board.id))!.status).toBe('in-review');
      // Their own name issues it
      await dialog.getByLabel('Your full name').fill(inspectorName);
      await dialog.getByRole('button', { name: 'Issue revision 1' }).click();
      await page.getByText('Issued as revision 1').waitFor();
      expect((await Board.findByPk(board.id))!.status).toBe('issued');
      expect((await BoardRevision.findOne({ where: { boardId: board.id } }))!.declaration).toBe(inspectorName);
      const event = await AuditEvent.findOne({ where: { boardId: board.id, action: 'review.approved' } });
      expect(event!.details).toMatchObject({ declaration: inspectorName, revision: 1, devices: ways.length });
    } finally {
      await close();
    }
  });

  it('a designer deletes a draft board from the list and undoes it', async () => {
    const board = await boardInReview('Undo check');
    await board.update({ status: 'draft' });
    const { page, close } = await openBrowser();
    try {
      await signIn(page, 'designer');
      await page.goto(`${APP_URL}/boards`);
      await page.getByRole('button', { name: `Delete ${board.name}` }).click();
      await page.getByText(`Deleted ${board.name}.`).waitFor();
      await expect.poll(async () => (await Board.findByPk(board.id))!.deletedAt, POLL).not.toBeNull();
      await expect.poll(() => page.getByRole('link', { name: board.name }).count(), POLL).toBe(0);
      await page.getByRole('button', { name: 'Undo' }).click();
      await page.getByText(`${board.name} is back.`).waitFor();
      await expect.poll(async () => (await Board.findByPk(board.id))!.deletedAt, POLL).toBeNull();
      await expect.poll(() => page.getByRole('link', { name: board.name }).count(), POLL).toBe(1);
    } finally {
      await close();
    }
  });

  it('an unknown board shows the app’s own not-found page', async () => {
    const { page, close } = await openBrowser();
    try {
      await signIn(page, 'designer');
      const res = await page.goto(`${APP_URL}/boards/${crypto.randomUUID()}`);
      expect(res!.status()).toBe(404);
      await page.getByRole('heading', { name: 'Not found' }).waitFor();
      await expect(page.getByText(/no such page, board or site in your organisation/).count()).resolves.toBe(1);
      // Inside the app's frame: its navigation is there
      await expect(page.getByRole('link', { name: 'Boards' }).count()).resolves.toBeGreaterThan(0);
    } finally {
      await close();
    }
  });
});
