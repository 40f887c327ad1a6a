import { withStripTexts } from '@/features/schedule/utils/strip-texts';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { getWalk, labelProblems } from '@/lib/dal/label-walk';

/**
 * GET /api/boards/:boardId/ways/walk: the label walk (every device in rail order with its
 * result, what its printed strip reads when shortened, and photos; the progress) and the labels
 * found wrong or missing.
 */
export const GET = defineRoute({
  action: 'boards.read',
  params: idParamsSchema,
  handler: async ({ actor, params: { boardId } }) => {
    const walk = await withStripTexts(await getWalk(actor, boardId));
    return Response.json({ walk, problems: labelProblems(walk) });
  },
});
