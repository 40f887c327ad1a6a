import 'server-only';

import nodemailer, { type Transporter } from 'nodemailer';
import { QueryTypes, type Transaction } from 'sequelize';

import { db } from '@/lib/db';
import { env } from '@/lib/env';
import { OutgoingMail } from '@/models';
import type { MailAttachment } from '@/models/outgoing-mail';

/** After this many failed attempts a message is marked failed and left for an admin. */
export const MAX_ATTEMPTS = 12;

const holder = globalThis as unknown as { boardwrightMailer?: Transporter };

function transporter(): Transporter {
  if (holder.boardwrightMailer) return holder.boardwrightMailer;
  const e = env();
  holder.boardwrightMailer = nodemailer.createTransport({
    host: e.SMTP_HOST,
    port: e.SMTP_PORT,
    secure: e.SMTP_SECURE === 'true',
    auth: e.SMTP_USER ? { user: e.SMTP_USER, pass: e.SMTP_PASSWORD } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 15_000,
  });
  return holder.boardwrightMailer;
}

export type NewMail = {
  organisationId: string | null;
  to: string;
  subject: string;
  text: string;
  attachments?: MailAttachment[];
};

/**
 * Stores a message in the outbox (inside the caller's transaction when given) and, once
 * that is committed, tries to send what is due. A message is never lost to a down SMTP
 * server: it stays queued and is retried with growing delays.
 */
export async function enqueueMail(mail: NewMail, transaction?: Transaction): Promise<string> {
  db();
  const row = await OutgoingMail.create(
    {
      organisationId: mail.organisationId,
      toAddress: mail.to,
      subject: mail.subject,
      textBody: mail.text,
      attachments: mail.attachments ?? [],
    },
    { transaction },
  );
  const kick = () => void dispatchDueMail().catch(() => undefined);
  if (transaction) transaction.afterCommit(kick);
  else kick();
  return row.id;
}

/** Delay before the next attempt: 5 s, 10 s, 20 s … capped at 10 minutes. */
export function retryDelayMs(attempts: number): number {
  return Math.min(5_000 * 2 ** Math.max(0, attempts - 1), 10 * 60_000);
}

/**
 * Sends every queued message that is due. Rows are claimed with SKIP LOCKED so that
 * several app instances can run this at once without sending a message twice.
 */
export async function dispatchDueMail(limit = 20): Promise<{ sent: number; failed: number }> {
  const sequelize = db();
  let sent = 0;
  let failed = 0;
  await sequelize.transaction(async (transaction) => {
    const due = await sequelize.query<{ id: string }>(
      `select id from outgoing_mail where status = 'queued' and next_attempt_at <= now()
       order by next_attempt_at limit :limit for update skip locked`,
      { replacements: { limit }, type: QueryTypes.SELECT, transaction },
    );
    for (const { id } of due) {
      const mail = await OutgoingMail.findByPk(id, { transaction });
      if (!mail) continue;
      try {
        await transporter().sendMail({
          from: env().MAIL_FROM,
          to: mail.toAddress,
          subject: mail.subject,
          text: mail.textBody,
          attachments: mail.attachments.map((a) => ({
            filename: a.filename,
            contentType: a.contentType,
            content: Buffer.from(a.contentBase64, 'base64'),
          })),
        });
        await mail.update(
          { status: 'sent', sentAt: new Date(), attempts: mail.attempts + 1, lastError: null },
          { transaction },
        );
        sent += 1;
      } catch (err) {
        const attempts = mail.attempts + 1;
        await mail.update(
          {
            attempts,
            lastError: String((err as Error).message ?? err).slice(0, 500),
            status: attempts >= MAX_ATTEMPTS ? 'failed' : 'queued',
            nextAttemptAt: new Date(Date.now() + retryDelayMs(attempts)),
          },
          { transaction },
        );
        failed += 1;
      }
    }
  });
  return { sent, failed };
}

const timerHolder = globalThis as unknown as { boardwrightMailTimer?: NodeJS.Timeout };

/** Starts the background retry loop once per process (called from instrumentation.ts). */
export function startMailDispatcher(intervalMs = 5_000): void {
  if (timerHolder.boardwrightMailTimer) return;
  timerHolder.boardwrightMailTimer = setInterval(() => {
    void dispatchDueMail().catch(() => undefined);
  }, intervalMs);
  timerHolder.boardwrightMailTimer.unref();
}
