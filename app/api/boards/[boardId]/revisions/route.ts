import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { listRevisions } from '@/lib/dal/revisions';

/** GET /api/boards/:boardId/revisions: the issued revisions, newest first, and the current stage. */
export const GET = defineRoute({
  action: 'boards.read',
  params: idParamsSchema,
  handler: async ({ actor, params: { boardId } }) => Response.json(await listRevisions(actor, boardId)),
});
