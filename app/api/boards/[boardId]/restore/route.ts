import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { restoreBoard } from '@/lib/dal/boards';

/** POST /api/boards/:boardId/restore: an archived board comes back into the lists (admins). */
export const POST = defineRoute({
  action: 'records.archive',
  params: idParamsSchema,
  // Restore (ownership and state checked in the DAL)
  handler: async ({ actor, params: { boardId } }) => Response.json({ board: await restoreBoard(actor, boardId) }),
});
