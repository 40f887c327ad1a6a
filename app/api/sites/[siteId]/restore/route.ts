import { z } from 'zod';

import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { restoreSite } from '@/lib/dal/sites';

const paramsSchema = z.object({ siteId: z.uuid() });

/** POST /api/sites/:siteId/restore: an archived site and its boards come back into the lists (admins). */
export const POST = route<{ siteId: string }>(async (_req, params) => {
  // Params, then session and role
  const { siteId } = parseParams(params, paramsSchema);
  const actor = await requireActor('records.archive');
  // Restore (ownership and state checked in the DAL)
  return Response.json({ site: await restoreSite(actor, siteId) });
});
