import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { getReview } from '@/lib/dal/review-page';

/** GET /api/boards/:boardId/review: the board with every way's sizing, comments and revisions. */
export const GET = route<{ boardId: string }>(async (_req, params) => {
  // Params, then session
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.read');
  // Ownership is checked by the DAL
  return Response.json(await getReview(actor, boardId));
});
