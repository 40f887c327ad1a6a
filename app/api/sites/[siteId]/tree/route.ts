import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { getSiteTree } from '@/lib/dal/site-supply';

const params = z.object({ siteId: z.uuid() });

/**
 * GET /api/sites/:siteId/tree: the site's supply tree (lib/sites/tree-types.ts SiteTreeDto): the
 * origin, each board with the values carried to it and its worst verdict, the sub-mains.
 */
export const GET = defineRoute({
  action: 'boards.read',
  params,
  handler: async ({ actor, params: { siteId } }) => Response.json({ tree: await getSiteTree(actor, siteId) }),
});
