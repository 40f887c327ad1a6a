import 'server-only';

import { Op, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { findBoard } from '@/lib/dal/board-repository';
import { memberNames } from '@/lib/dal/members';
import type { ScheduleSource } from '@/lib/dal/schedule-source';
import { enqueueMail } from '@/lib/mail/outbox';
import { scheduleMail, sitePackMail } from '@/lib/mail/templates';
import { AuditEvent, OutgoingMail } from '@/models';
import type { ScheduleMail } from '@/lib/boards/review-types';

/** Queues the schedule PDF to an address through the outbox and records who sent it. */
export async function emailSchedule(
  actor: Actor,
  source: Pick<ScheduleSource, 'boardId' | 'revision' | 'snapshot' | 'frozen' | 'boardUrl'>,
  input: { to: string; message?: string; pdf: Uint8Array; fileName: string },
): Promise<{ id: string; status: 'queued' }> {
  const { boardId, revision } = source;
  await findBoard(actor, boardId);
  const content = scheduleMail({
    boardUrl: source.boardUrl,
    boardName: source.snapshot.settings.name,
    siteName: source.snapshot.siteName,
    revision,
    frozen: source.frozen,
    senderName: actor.name,
    message: input.message,
  });
  return queuePdfMail(actor, { ...input, ...content }, (mailId, transaction) =>
    audit(actor, 'schedule.emailed', { mailId, to: input.to, revision }, { boardId, transaction }),
  );
}

/** Sends a site pack through the outbox, like a board schedule, and records it in the organisation's trail. */
export async function emailSitePack(
  actor: Actor,
  site: { id: string; name: string; boardCount: number },
  input: { to: string; message?: string; pdf: Uint8Array; fileName: string },
): Promise<{ id: string; status: 'queued' }> {
  const { name: siteName, boardCount } = site;
  const content = sitePackMail({ siteName, boardCount, senderName: actor.name, message: input.message });
  return queuePdfMail(actor, { ...input, ...content }, (mailId, transaction) =>
    audit(actor, 'site.pack-emailed', { siteId: site.id, mailId, to: input.to }, { transaction }),
  );
}

/**
 * Queues a PDF to an address through the outbox (stored in the transaction, then sent and
 * retried) and records it in the trail (`record`, given the mail's id) in the same transaction.
 */
async function queuePdfMail(
  actor: Actor,
  mail: { to: string; subject: string; text: string; pdf: Uint8Array; fileName: string },
  record: (mailId: string, transaction: Transaction) => Promise<unknown>,
): Promise<{ id: string; status: 'queued' }> {
  const { pdf, fileName, to, subject, text } = mail;
  const attachment = {
    filename: fileName,
    contentType: 'application/pdf',
    contentBase64: Buffer.from(pdf).toString('base64'),
  };
  return db().transaction(async (transaction) => {
    const id = await enqueueMail(
      { organisationId: actor.organisationId, to, subject, text, attachments: [attachment] },
      transaction,
    );
    await record(id, transaction);
    return { id, status: 'queued' as const };
  });
}

/** The schedule e-mails sent for a board, newest first, with their outbox status. */
export async function listScheduleEmails(actor: Actor, boardId: string): Promise<ScheduleMail[]> {
  await findBoard(actor, boardId);
  const events = await AuditEvent.findAll({
    where: { boardId, organisationId: actor.organisationId, action: 'schedule.emailed' },
    order: [['id', 'DESC']],
    limit: 50,
  });
  const ids = events.map((e) => String(e.details.mailId ?? '')).filter(Boolean);
  const [mails, nameById] = await Promise.all([
    OutgoingMail.findAll({ where: { id: { [Op.in]: ids }, organisationId: actor.organisationId } }),
    memberNames(events.map((e) => e.userId)),
  ]);
  const mailById = new Map(mails.map((m) => [m.id, m]));
  return events.flatMap((e) => {
    const mail = mailById.get(String(e.details.mailId));
    if (!mail) return [];
    return [
      {
        id: mail.id,
        to: mail.toAddress,
        revision: Number(e.details.revision),
        status: mail.status,
        attempts: mail.attempts,
        lastError: mail.lastError,
        sentByName: (e.userId && nameById.get(e.userId)) || 'A former member',
        createdAt: mail.createdAt.toISOString(),
        sentAt: mail.sentAt ? mail.sentAt.toISOString() : null,
      },
    ];
  });
}
