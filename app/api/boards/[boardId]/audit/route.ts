import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { AUDIT_PAGE_MAX, listAudit } from '@/lib/dal/audit';

/** GET /api/boards/:boardId/audit[?before=&limit=&actions=]: who changed what on the board, newest first. */
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
      // Only these kinds of event, comma-separated ("board.supply-changed,review.approved")
      actions: z
        .string()
        .regex(/^[a-z]+\.[a-z-]+(,[a-z]+\.[a-z-]+){0,9}$/, 'Name up to ten kinds of event, separated by commas.')
        .transform((v) => v.split(','))
        .optional(),
    })
    .strict(),
  // Ownership and the page, in the DAL
  handler: async ({ actor, params: { boardId }, query }) => Response.json(await listAudit(actor, boardId, query)),
});
