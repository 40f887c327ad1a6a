import { defineRoute } from '@/lib/api/handler';
import { createSite, listSites } from '@/lib/dal/sites';
import { siteInputSchema } from '@/lib/sites/schemas';

/** GET /api/sites[?archived=1]: the organisation's live sites, or its archived ones. */
export const GET = defineRoute({
  action: 'boards.read',
  scope: 'list',
  handler: async ({ req, actor }) => {
    // Read, scoped to the organisation
    const archived = new URL(req.url).searchParams.get('archived') === '1';
    return Response.json({ sites: await listSites(actor, { archived }) });
  },
});

/** POST /api/sites: a new site. */
export const POST = defineRoute({
  action: 'boards.edit',
  scope: 'list',
  body: siteInputSchema,
  handler: async ({ actor, body }) => Response.json({ site: await createSite(actor, body) }, { status: 201 }),
});
