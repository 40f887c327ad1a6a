import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { boardStage, listRevisions } from '@/lib/dal/revisions';

/** GET /api/boards/:boardId/revisions: the issued revisions, newest first, and the current stage. */
export const GET = route<{ boardId: string }>(async (_req, params) => {
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.read');
  const [revisions, current] = await Promise.all([listRevisions(actor, boardId), boardStage(actor, boardId)]);
  return Response.json({ revisions, current: { revision: current.revision, status: current.status } });
});
