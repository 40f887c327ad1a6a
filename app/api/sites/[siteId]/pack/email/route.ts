import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { HttpError } from '@/lib/errors';
import { sitePackEmailSchema } from '@/lib/sites/tree-types';

const params = z.object({ siteId: z.uuid() });

/** POST /api/sites/:siteId/pack/email {to, message?}: sends the site pack through the outbox. */
export const POST = defineRoute({
  action: 'schedule.print-draft',
  params,
  body: sitePackEmailSchema,
  handler: async () => {
    throw new HttpError(501, 'Not built yet.');
  },
});
