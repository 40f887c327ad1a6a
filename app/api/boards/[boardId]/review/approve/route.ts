import { approveInputSchema } from '@/features/review/types/schemas';
import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { approveBoard } from '@/lib/dal/issue-and-return';

/**
 * POST /api/boards/:boardId/review/approve: issue a board in review as the next revision,
 * freezing it and its sizing; the designers are e-mailed.
 */
export const POST = route<{ boardId: string }>(async (req, params) => {
  // Params, then session and role
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.review');
  // Body
  const input = await parseBody(req, approveInputSchema);
  // Issue (ownership and stage checked in the DAL)
  return Response.json(await approveBoard(actor, boardId, input));
});
