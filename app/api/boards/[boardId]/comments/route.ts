import { commentInputSchema } from '@/features/review/types/schemas';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { addComment, listComments } from '@/lib/dal/comments';

/** GET /api/boards/:boardId/comments: every comment on the board and its ways, oldest first. */
export const GET = defineRoute({
  action: 'boards.read',
  params: idParamsSchema,
  handler: async ({ actor, params: { boardId } }) => Response.json({ comments: await listComments(actor, boardId) }),
});

/** POST /api/boards/:boardId/comments: a comment on the board or on one way (reviewers and designers). */
export const POST = defineRoute({
  action: 'boards.read',
  narrowedTo: {
    roles: ['admin', 'designer', 'inspector'],
    by: 'lib/dal/comments.ts addComment: reviewers, and the designers answering them',
  },
  params: idParamsSchema,
  body: commentInputSchema,
  handler: async ({ actor, params: { boardId }, body }) =>
    Response.json({ comment: await addComment(actor, boardId, body) }, { status: 201 }),
});
