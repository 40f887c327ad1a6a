import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { archiveBoard } from '@/lib/dal/boards';

/** POST /api/boards/:boardId/archive: the board leaves the lists, read-only, kept whole (admins). */
export const POST = defineRoute({
  action: 'records.archive',
  params: idParamsSchema,
  handler: async ({ actor, params: { boardId } }) => {
    // Archive (ownership checked in the DAL)
    await archiveBoard(actor, boardId);
    return Response.json({ archived: true });
  },
});
