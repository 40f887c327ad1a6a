import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { HttpError } from '@/lib/errors';
import { boardFeedInputSchema } from '@/lib/sites/tree-types';

/**
 * PUT /api/boards/:boardId/feed {version?, feed, confirmFeedChanges?}: where the board is fed
 * from (the origin, or a way of another board of its site). Answers `{ board, ripple }`; 409
 * naming the boards that change unless confirmed; 422 for a cycle or a way that cannot feed.
 */
export const PUT = defineRoute({
  action: 'boards.edit',
  params: idParamsSchema,
  body: boardFeedInputSchema,
  handler: async () => {
    throw new HttpError(501, 'Not built yet.');
  },
});
