import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { submitBoard } from '@/lib/dal/board-status';

/**
 * POST /api/boards/:boardId/submit: send a draft board for review. 422 with the failing ways
 * when any way fails; 409 when the board is not a draft or the version is stale.
 */
export const POST = defineRoute({
  action: 'boards.submit',
  params: idParamsSchema,
  // Optional: `version` pins the board to the version the designer saw
  body: z
    .object({ version: z.number().int().min(1).optional() })
    .strict()
    .optional(),
  // Ownership, sizing, status, audit and mail, in the DAL
  handler: async ({ actor, params: { boardId }, body }) =>
    Response.json({ board: await submitBoard(actor, boardId, body?.version) }),
});
