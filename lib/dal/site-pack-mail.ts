import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { audit } from '@/lib/dal/audit';
import { queuePdfMail } from '@/lib/dal/schedule-mail';
import { sitePackMail } from '@/lib/mail/templates';

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
