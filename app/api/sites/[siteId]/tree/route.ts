import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { HttpError } from '@/lib/errors';

const params = z.object({ siteId: z.uuid() });

/** GET /api/sites/:siteId/tree: the site's supply tree (lib/sites/tree-types.ts SiteTreeDto). */
export const GET = defineRoute({
  action: 'boards.read',
  params,
  handler: async () => {
    throw new HttpError(501, 'Not built yet.');
  },
});
