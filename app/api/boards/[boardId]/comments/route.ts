import { commentInputSchema } from '@/features/review/types/schemas';
import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { addComment, listComments } from '@/lib/dal/comments';

type Params = { boardId: string };

/** GET /api/boards/:boardId/comments: every comment on the board and its ways, oldest first. */
export const GET = route<Params>(async (_req, params) => {
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.read');
  return Response.json({ comments: await listComments(actor, boardId) });
});

/** POST /api/boards/:boardId/comments: a comment on the board or on one way (reviewers and designers). */
export const POST = route<Params>(async (req, params) => {
  // Params, then session (who may comment is checked in the DAL)
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.read');
  // Body
  const input = await parseBody(req, commentInputSchema);
  // Store
  return Response.json({ comment: await addComment(actor, boardId, input) }, { status: 201 });
});
