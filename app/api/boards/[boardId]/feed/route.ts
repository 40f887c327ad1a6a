import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { setBoardFeed } from '@/lib/dal/site-supply';
import { boardFeedInputSchema } from '@/lib/sites/tree-types';

/**
 * PUT /api/boards/:boardId/feed {version?, feed, confirmFeedChanges?}: where the board is fed
 * from (the origin, or a way of another board of its site). Answers `{ board, ripple }`; 409
 * naming the boards that change unless confirmed; 422 for a loop or a way that cannot feed;
 * 404 for a board or way of another organisation.
 */
export const PUT = defineRoute({
  action: 'boards.edit',
  params: idParamsSchema,
  body: boardFeedInputSchema,
  handler: async ({ actor, params: { boardId }, body }) => Response.json(await setBoardFeed(actor, boardId, body)),
});
