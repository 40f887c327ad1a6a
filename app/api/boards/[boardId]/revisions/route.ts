import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { boardStage, listRevisions } from '@/lib/dal/revisions';

/** GET /api/boards/:boardId/revisions: the issued revisions, newest first, and the current stage. */
export const GET = defineRoute({
  action: 'boards.read',
  params: idParamsSchema,
  handler: async ({ actor, params: { boardId } }) => {
    const [revisions, current] = await Promise.all([listRevisions(actor, boardId), boardStage(actor, boardId)]);
    return Response.json({ revisions, current: { revision: current.revision, status: current.status } });
  },
});
