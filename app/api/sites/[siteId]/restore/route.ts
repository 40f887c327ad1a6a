import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { restoreSite } from '@/lib/dal/sites';

/** POST /api/sites/:siteId/restore: an archived site and its boards come back into the lists (admins). */
export const POST = defineRoute({
  action: 'records.archive',
  params: z.object({ siteId: z.uuid() }),
  // Restore (ownership and state checked in the DAL)
  handler: async ({ actor, params: { siteId } }) => Response.json({ site: await restoreSite(actor, siteId) }),
});
