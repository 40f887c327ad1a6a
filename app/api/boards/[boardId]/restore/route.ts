import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { restoreBoard } from '@/lib/dal/boards';

/** POST /api/boards/:boardId/restore: an archived board comes back into the lists (admins). */
export const POST = route<{ boardId: string }>(async (_req, params) => {
  // Params, then session and role
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('records.archive');
  // Restore (ownership and state checked in the DAL)
  return Response.json({ board: await restoreBoard(actor, boardId) });
});
