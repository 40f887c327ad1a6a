import { z } from 'zod';

import { fieldIssues, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { AUDIT_PAGE_MAX, listAudit } from '@/lib/dal/audit';
import { badRequest } from '@/lib/errors';

const querySchema = z
  .object({
    before: z.string().regex(/^[1-9][0-9]{0,17}$/, 'Use the id of an audit event.').optional(),
    limit: z.coerce.number().int().min(1).max(AUDIT_PAGE_MAX).optional(),
  })
  .strict();

/** GET /api/boards/:boardId/audit[?before=&limit=]: who changed what on the board, newest first. */
export const GET = route<{ boardId: string }>(async (req, params) => {
  // Params and session (role)
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.read');
  // Query: the page cursor and size
  const query = querySchema.safeParse(Object.fromEntries(new URL(req.url).searchParams));
  if (!query.success) throw badRequest(fieldIssues(query.error));
  // Ownership and the page, in the DAL
  return Response.json(await listAudit(actor, boardId, query.data));
});
