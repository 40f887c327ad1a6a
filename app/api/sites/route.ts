import { parseBody, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { createSite, listSites, siteInputSchema } from '@/lib/dal/sites';

/** GET /api/sites[?archived=1]: the organisation's live sites, or its archived ones. */
export const GET = route(async (req) => {
  // Session and role
  const actor = await requireActor('boards.read');
  // Read, scoped to the organisation
  const archived = new URL(req.url).searchParams.get('archived') === '1';
  return Response.json({ sites: await listSites(actor, { archived }) });
});

/** POST /api/sites: a new site. */
export const POST = route(async (req) => {
  const actor = await requireActor('boards.edit');
  const input = await parseBody(req, siteInputSchema);
  return Response.json({ site: await createSite(actor, input) }, { status: 201 });
});
