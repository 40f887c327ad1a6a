import { returnInputSchema } from '@/features/review/types/schemas';
import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { returnBoard } from '@/lib/dal/issue-and-return';

/** POST /api/boards/:boardId/review/return: back to draft with comments; the designers are e-mailed. */
export const POST = route<{ boardId: string }>(async (req, params) => {
  // Params, then session and role
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.review');
  // Body
  const input = await parseBody(req, returnInputSchema);
  // Return (ownership, stage and comments checked in the DAL)
  return Response.json(await returnBoard(actor, boardId, input));
});
