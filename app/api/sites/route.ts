import { parseBody, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { createSite, listSites, siteInputSchema } from '@/lib/dal/sites';

/** GET /api/sites: the organisation's sites. */
export const GET = route(async () => {
  // Session and role
  const actor = await requireActor('boards.read');
  // Read, scoped to the organisation
  return Response.json({ sites: await listSites(actor) });
});

/** POST /api/sites: a new site. */
export const POST = route(async (req) => {
  const actor = await requireActor('boards.edit');
  const input = await parseBody(req, siteInputSchema);
  return Response.json({ site: await createSite(actor, input) }, { status: 201 });
});
