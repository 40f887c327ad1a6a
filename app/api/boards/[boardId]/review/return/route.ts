import { returnInputSchema } from '@/features/review/types/schemas';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { returnBoard } from '@/lib/dal/issue-and-return';

/** POST /api/boards/:boardId/review/return: back to draft with comments; the designers are e-mailed. */
export const POST = defineRoute({
  action: 'boards.review',
  params: idParamsSchema,
  body: returnInputSchema,
  // Return (ownership, stage and comments checked in the DAL)
  handler: async ({ actor, params: { boardId }, body }) => Response.json(await returnBoard(actor, boardId, body)),
});
