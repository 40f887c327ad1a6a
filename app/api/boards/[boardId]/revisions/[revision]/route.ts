import { z } from 'zod';

import { revisionRefSchema } from '@/features/review/types/schemas';
import { defineRoute } from '@/lib/api/handler';
import { getRevision, getRevisionDiff } from '@/lib/dal/revisions';

/**
 * GET /api/boards/:boardId/revisions/:revision — one issued revision (or `current`, the live
 * board) with its frozen sizing; with `?from=N|current`, also what changed from N to it.
 */
export const GET = defineRoute({
  action: 'boards.read',
  params: z.object({ boardId: z.uuid(), revision: revisionRefSchema }),
  query: z.object({ from: revisionRefSchema.optional() }),
  handler: async ({ actor, params: { boardId, revision }, query: { from } }) => {
    // The revision, and the diff when asked
    const state = await getRevision(actor, boardId, revision);
    const diff = from === undefined ? null : await getRevisionDiff(actor, boardId, from, revision);
    return Response.json({ revision: state, diff });
  },
});
