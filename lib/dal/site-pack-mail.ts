import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { audit } from '@/lib/dal/audit';
import { queuePdfMail } from '@/lib/dal/schedule-mail';
import { SIZING_CAUTION } from '@/lib/sizing';

/** Sends a site pack through the outbox, like a board schedule, and records it in the organisation's trail. */
export async function emailSitePack(
  actor: Actor,
  site: { id: string; name: string; boardCount: number },
  input: { to: string; message?: string; pdf: Uint8Array; fileName: string },
): Promise<{ id: string; status: 'queued' }> {
  const subject = `Site pack: ${site.name}`;
  const text = [
    `${actor.name} sent you the site pack of ${site.name}: the single-line diagram of its supply, the values carried to each board, and the schedule of each of its ${site.boardCount} board${site.boardCount === 1 ? '' : 's'}.`,
    ...(input.message ? ['', input.message] : []),
    '',
    'The pack is attached as a PDF.',
    '',
    SIZING_CAUTION,
  ].join('\n');
  return queuePdfMail(actor, { ...input, subject, text }, (mailId, transaction) =>
    audit(actor, 'site.pack-emailed', { siteId: site.id, mailId, to: input.to }, { transaction }),
  );
}
