import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { undeleteBoard } from '@/lib/dal/boards';

/** POST /api/boards/:boardId/undo-delete: a deleted draft board comes back as it was. */
export const POST = defineRoute({
  action: 'boards.discard',
  params: idParamsSchema,
  // Undo (ownership and state checked in the DAL)
  handler: async ({ actor, params: { boardId } }) => Response.json({ board: await undeleteBoard(actor, boardId) }),
});
