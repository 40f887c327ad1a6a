import { beforeAll, describe, expect, it } from 'vitest';

import * as submitRoute from '@/app/api/boards/[boardId]/submit/route';
import type { Actor } from '@/lib/auth/session';
import { transition } from '@/lib/boards/lifecycle';
import { findBoard, readBoard } from '@/lib/dal/board-repository';
import { queueNotices } from '@/lib/dal/notices';
import { db } from '@/lib/db';
import { dispatchDueMail } from '@/lib/mail/outbox';
import type { ReviewRequestedFacts } from '@/lib/mail/templates';
import { OutgoingMail } from '@/models';

import { caughtMail, ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

// Lifecycle e-mails: the change's transaction gathers the facts and the recipients only; the
// e-mail is rendered and queued in the outbox once the change is committed (lib/dal/notices.ts).
type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
let designer: Actor;

beforeAll(async () => {
  team = await makeOrganisation('Notices');
  const u = team.users.designer;
  designer = { userId: u.id, organisationId: team.org.id, role: 'designer', name: u.name, email: u.email };
});

const queuedFor = (to: string) => OutgoingMail.count({ where: { toAddress: to } });
const facts = (boardId: string, boardName: string): ReviewRequestedFacts => ({
  appUrl: 'http://127.0.0.1',
  boardId,
  boardName,
  siteName: 'Test site',
  revision: 1,
  senderName: designer.name,
  counts: '12 ways',
  boardChecks: [],
});

describe('lifecycle e-mails after commit', () => {
  it('nothing reaches the outbox inside the transaction, and a rolled-back change sends nothing', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    const inspector = team.users.inspector.email;
    const step = transition('draft', 'submit', { revision: 1 });
    if (step.refused) throw new Error(step.message);
    const rolledBack = db().transaction(async (transaction) => {
      const row = await findBoard(designer, board.id, { transaction, lock: true });
      await queueNotices(step, row, { 'review-requested': facts(board.id, 'Rolled back board') }, transaction);
      expect(await OutgoingMail.count({ where: { toAddress: inspector }, transaction })).toBe(0);
      throw new Error('the change fails after its notices were gathered');
    });
    await expect(rolledBack).rejects.toThrow('the change fails');
    await dispatchDueMail();
    expect(await queuedFor(inspector)).toBe(0);
    expect((await caughtMail()).filter((m) => m.subject.includes('Rolled back board'))).toEqual([]);
  });

  it('a committed change queues the e-mail; a failed send keeps the change and the mail is sent on a retry', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    const inspector = team.users.inspector.email;
    // The outbox's transport pointed at a port where nothing listens: every send fails
    const holder = globalThis as unknown as { boardwrightMailer?: unknown };
    const working = holder.boardwrightMailer;
    const nodemailer = (await import('nodemailer')).default;
    holder.boardwrightMailer = nodemailer.createTransport({ host: '127.0.0.1', port: 9, connectionTimeout: 1000 });
    try {
      signInAs(team.users.designer);
      const res = await submitRoute.POST(jsonRequest('POST'), ctx({ boardId: board.id }));
      expect(res.status).toBe(200);
      expect((await readBoard(designer, board.id)).status).toBe('in-review');
      // The send tried once committed (the outbox's own kick, or this dispatch) fails
      let mail: OutgoingMail | undefined;
      for (let i = 0; i < 50 && !mail?.attempts; i++) {
        await dispatchDueMail();
        [mail] = await OutgoingMail.findAll({ where: { toAddress: inspector } });
        if (!mail?.attempts) await new Promise((r) => setTimeout(r, 100));
      }
      if (!mail) throw new Error('no e-mail was queued');
      expect(mail.status).toBe('queued');
      expect(mail.attempts).toBeGreaterThanOrEqual(1);
      expect(mail.lastError).toBeTruthy();
      expect(mail.subject).toContain('For review');
    } finally {
      holder.boardwrightMailer = working;
    }
    // Due again now: the retry goes through the working transport to the catcher
    await OutgoingMail.update({ nextAttemptAt: new Date() }, { where: { toAddress: inspector } });
    await dispatchDueMail();
    const sent = (await caughtMail()).filter((m) => m.to.includes(inspector));
    expect(sent.map((m) => m.subject)).toEqual([expect.stringContaining('For review')]);
  });
});
