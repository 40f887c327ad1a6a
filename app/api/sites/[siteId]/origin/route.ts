import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { setSiteOrigin } from '@/lib/dal/site-supply';
import { siteOriginSchema } from '@/lib/sites/tree-types';

const params = z.object({ siteId: z.uuid() });

/**
 * PUT /api/sites/:siteId/origin: the site's supply intake; every board below is re-sized in
 * the same request. Answers `{ tree, ripple }` (lib/sites/tree-types.ts).
 */
export const PUT = defineRoute({
  action: 'boards.edit',
  params,
  body: siteOriginSchema,
  // The answer's JSON text as bytes (a string body is scanned for lone surrogates first)
  handler: async ({ actor, params: { siteId }, body }) =>
    new Response(Buffer.from(await setSiteOrigin(actor, siteId, body)), {
      headers: { 'content-type': 'application/json' },
    }),
});
