import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { HttpError } from '@/lib/errors';

const params = z.object({ siteId: z.uuid() });

/** GET /api/sites/:siteId/pack: the site pack PDF (the diagram and carried values, then each board's schedule). */
export const GET = defineRoute({
  action: 'schedule.print-draft',
  params,
  handler: async () => {
    throw new HttpError(501, 'Not built yet.');
  },
});
