import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { AUDIT_PAGE_MAX, listAudit } from '@/lib/dal/audit';

/** GET /api/boards/:boardId/audit[?before=&limit=]: who changed what on the board, newest first. */
export const GET = defineRoute({
  action: 'boards.read',
  params: idParamsSchema,
  // The page cursor and size
  query: z
    .object({
      before: z
        .string()
        .regex(/^[1-9][0-9]{0,17}$/, 'Use the id of an audit event.')
        .optional(),
      limit: z.coerce.number().int().min(1).max(AUDIT_PAGE_MAX).optional(),
    })
    .strict(),
  // Ownership and the page, in the DAL
  handler: async ({ actor, params: { boardId }, query }) => Response.json(await listAudit(actor, boardId, query)),
});
