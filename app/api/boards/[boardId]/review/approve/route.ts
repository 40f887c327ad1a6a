import { approveInputSchema } from '@/features/review/types/schemas';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { approveBoard } from '@/lib/dal/issue-and-return';

/**
 * POST /api/boards/:boardId/review/approve: issue a board in review as the next revision,
 * freezing it and its sizing; the designers are e-mailed.
 */
export const POST = defineRoute({
  action: 'boards.review',
  params: idParamsSchema,
  body: approveInputSchema,
  // Issue (ownership and stage checked in the DAL)
  handler: async ({ actor, params: { boardId }, body }) => Response.json(await approveBoard(actor, boardId, body)),
});
