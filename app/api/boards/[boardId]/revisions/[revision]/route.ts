import { z } from 'zod';

import { revisionRefSchema } from '@/features/review/types/schemas';
import { fieldIssues, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { badRequest } from '@/lib/errors';
import { getRevision, getRevisionDiff } from '@/lib/dal/revisions';

const paramsSchema = z.object({ boardId: z.uuid(), revision: revisionRefSchema });

/**
 * GET /api/boards/:boardId/revisions/:revision — one issued revision (or `current`, the live
 * board) with its frozen sizing; with `?from=N|current`, also what changed from N to it.
 */
export const GET = route<{ boardId: string; revision: string }>(async (req, params) => {
  // Params and query
  const { boardId, revision } = parseParams(params, paramsSchema);
  const fromText = new URL(req.url).searchParams.get('from');
  const from = fromText === null ? null : revisionRefSchema.safeParse(fromText);
  if (from && !from.success) {
    throw badRequest(fieldIssues(from.error).map((i) => ({ ...i, path: 'from' })));
  }
  // Session
  const actor = await requireActor('boards.read');
  // The revision, and the diff when asked
  const state = await getRevision(actor, boardId, revision);
  const diff = from?.success ? await getRevisionDiff(actor, boardId, from.data, revision) : null;
  return Response.json({ revision: state, diff });
});
