import { defineRoute } from '@/lib/api/handler';
import { db } from '@/lib/db';
import { env } from '@/lib/env';
import { OutgoingMail } from '@/models';

/**
 * GET /api/dev/mailbox (admins): the organisation's outbox with each message's status,
 * and, when a local mail catcher is configured, what it has received for the organisation's
 * own recipients.
 */
export const GET = defineRoute({
  action: 'mailbox.read',
  scope: 'list',
  handler: async ({ actor }) => {
    db();
    const outbox = await OutgoingMail.findAll({
      where: { organisationId: actor.organisationId },
      order: [['createdAt', 'DESC']],
      limit: 100,
      attributes: ['id', 'toAddress', 'subject', 'status', 'attempts', 'lastError', 'createdAt', 'sentAt'],
    });
    let caught: { to: string[] }[] | null = null;
    const catcher = env().MAIL_CATCHER_URL;
    if (catcher) {
      const all = await fetch(new URL('/messages', catcher), { signal: AbortSignal.timeout(2_000) })
        .then((r) => (r.ok ? (r.json() as Promise<{ to: string[] }[]>) : null))
        .catch(() => null);
      // The catcher is shared by every organisation: show only what this one's outbox sent.
      const ours = new Set(
        (
          await OutgoingMail.findAll({
            where: { organisationId: actor.organisationId },
            attributes: ['toAddress'],
            group: ['toAddress'],
          })
        ).map((m) => m.toAddress.toLowerCase()),
      );
      caught = all?.filter((m) => m.to.some((t) => ours.has(t.toLowerCase()))) ?? null;
    }
    return Response.json({ outbox: outbox.map((m) => m.toJSON()), caught });
  },
});
