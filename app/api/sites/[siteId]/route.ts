import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { archiveSite, getSite, updateSite } from '@/lib/dal/sites';
import { siteInputSchema } from '@/lib/sites/schemas';

const params = z.object({ siteId: z.uuid() });

/** GET /api/sites/:siteId */
export const GET = defineRoute({
  action: 'boards.read',
  params,
  handler: async ({ actor, params: { siteId } }) => Response.json({ site: await getSite(actor, siteId) }),
});

/** PATCH /api/sites/:siteId: rename or edit the address and client. */
export const PATCH = defineRoute({
  action: 'boards.edit',
  params,
  body: siteInputSchema.partial().strict(),
  handler: async ({ actor, params: { siteId }, body }) =>
    Response.json({ site: await updateSite(actor, siteId, body) }),
});

/**
 * DELETE /api/sites/:siteId: archives the site (sites are never deleted); one holding an
 * issued board only by an admin (lib/boards/record-rules.ts).
 */
export const DELETE = defineRoute({
  action: 'boards.discard',
  params,
  handler: async ({ actor, params: { siteId } }) => Response.json({ site: await archiveSite(actor, siteId) }),
});
