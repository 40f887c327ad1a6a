import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { emailSitePack } from '@/lib/dal/schedule-mail';
import { sitePackEmailSchema } from '@/lib/sites/tree-types';

import { composeSitePack } from '../compose';

const params = z.object({ siteId: z.uuid() });

/** POST /api/sites/:siteId/pack/email {to, message?}: sends the site pack through the outbox. */
export const POST = defineRoute({
  action: 'schedule.print-draft',
  params,
  body: sitePackEmailSchema,
  handler: async ({ actor, params: { siteId }, body }) => {
    const pack = await composeSitePack(actor, siteId);
    const mail = await emailSitePack(
      actor,
      { id: siteId, name: pack.siteName, boardCount: pack.boardCount },
      { to: body.to, message: body.message, pdf: pack.pdf, fileName: pack.fileName },
    );
    return Response.json({ mail: { ...mail, to: body.to } }, { status: 202 });
  },
});
