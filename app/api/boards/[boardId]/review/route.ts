import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { getReview } from '@/lib/dal/review-page';

/** GET /api/boards/:boardId/review: the board with every way's sizing, comments and revisions. */
export const GET = defineRoute({
  action: 'boards.read',
  params: idParamsSchema,
  // Ownership is checked by the DAL
  handler: async ({ actor, params: { boardId } }) => Response.json(await getReview(actor, boardId)),
});
