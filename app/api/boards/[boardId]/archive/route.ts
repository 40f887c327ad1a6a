import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { archiveBoard } from '@/lib/dal/boards';

/** POST /api/boards/:boardId/archive: the board leaves the lists, read-only, kept whole (admins). */
export const POST = route<{ boardId: string }>(async (_req, params) => {
  // Params, then session and role
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('records.archive');
  // Archive (ownership checked in the DAL)
  await archiveBoard(actor, boardId);
  return Response.json({ archived: true });
});
