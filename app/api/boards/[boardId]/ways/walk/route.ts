import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { getWalk, labelProblems } from '@/lib/dal/label-walk';

/**
 * GET /api/boards/:boardId/ways/walk: the label walk (every device in rail order with its
 * result and photos, and the progress) and the labels found wrong or missing.
 */
export const GET = route<{ boardId: string }>(async (_req, params) => {
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.read');
  const [walk, problems] = await Promise.all([getWalk(actor, boardId), labelProblems(actor, boardId)]);
  return Response.json({ walk, problems });
});
