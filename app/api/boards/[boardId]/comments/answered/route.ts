import { answerCommentsSchema } from '@/features/review/types/schemas';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { answerComments } from '@/lib/dal/comments';

/** POST /api/boards/:boardId/comments/answered: the designer marks review comments answered. */
export const POST = defineRoute({
  action: 'comments.answer',
  params: idParamsSchema,
  body: answerCommentsSchema,
  // Mark them (ownership checked in the DAL)
  handler: async ({ actor, params: { boardId }, body }) =>
    Response.json(await answerComments(actor, boardId, body.commentIds)),
});
