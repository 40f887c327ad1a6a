import { z } from 'zod';

import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { archiveSite, getSite, siteInputSchema, updateSite } from '@/lib/dal/sites';

const paramsSchema = z.object({ siteId: z.uuid() });

/** GET /api/sites/:siteId */
export const GET = route<{ siteId: string }>(async (_req, params) => {
  const { siteId } = parseParams(params, paramsSchema);
  const actor = await requireActor('boards.read');
  return Response.json({ site: await getSite(actor, siteId) });
});

/** PATCH /api/sites/:siteId: rename or edit the address and client. */
export const PATCH = route<{ siteId: string }>(async (req, params) => {
  const { siteId } = parseParams(params, paramsSchema);
  const actor = await requireActor('boards.edit');
  const input = await parseBody(req, siteInputSchema.partial().strict());
  return Response.json({ site: await updateSite(actor, siteId, input) });
});

/**
 * DELETE /api/sites/:siteId: archives the site (sites are never deleted); one holding an
 * issued board only by an admin (lib/boards/record-rules.ts).
 */
export const DELETE = route<{ siteId: string }>(async (_req, params) => {
  const { siteId } = parseParams(params, paramsSchema);
  const actor = await requireActor('boards.discard');
  return Response.json({ site: await archiveSite(actor, siteId) });
});
