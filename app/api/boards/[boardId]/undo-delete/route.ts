import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { undeleteBoard } from '@/lib/dal/boards';

/** POST /api/boards/:boardId/undo-delete: a deleted draft board comes back as it was. */
export const POST = route<{ boardId: string }>(async (_req, params) => {
  // Params, then session and role
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.discard');
  // Undo (ownership and state checked in the DAL)
  return Response.json({ board: await undeleteBoard(actor, boardId) });
});
