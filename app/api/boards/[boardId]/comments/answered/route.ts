import { answerCommentsSchema } from '@/features/review/types/schemas';
import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { answerComments } from '@/lib/dal/comments';

/** POST /api/boards/:boardId/comments/answered: the designer marks review comments answered. */
export const POST = route<{ boardId: string }>(async (req, params) => {
  // Params, then session and role
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('comments.answer');
  // Body
  const { commentIds } = await parseBody(req, answerCommentsSchema);
  // Mark them (ownership checked in the DAL)
  return Response.json(await answerComments(actor, boardId, commentIds));
});
