import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { archiveBoard } from '@/lib/dal/boards';
import { removalQuerySchema } from '@/lib/sites/tree-types';

/**
 * POST /api/boards/:boardId/archive: the board leaves the lists, read-only, kept whole (admins).
 * A board that feeds other boards answers 409 `feedChanges` unless `?confirmFeedChanges=1`;
 * confirmed, they are fed from the origin (then listed as `feedChanges` in the answer).
 */
export const POST = defineRoute({
  action: 'records.archive',
  params: idParamsSchema,
  query: removalQuerySchema,
  handler: async ({ actor, params: { boardId }, query }) => {
    // Archive (ownership and the boards it feeds checked in the DAL)
    const { feedChanges } = await archiveBoard(actor, boardId, { confirmFeedChanges: query.confirmFeedChanges });
    return Response.json({ archived: true, ...(feedChanges.length ? { feedChanges } : {}) });
  },
});
