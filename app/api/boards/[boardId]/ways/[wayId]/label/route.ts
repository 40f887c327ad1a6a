import { z } from 'zod';

import { labelInputSchema } from '@/features/label-walk/types/schemas';
import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { recordLabel } from '@/lib/dal/label-walk';

const paramsSchema = z.object({ boardId: z.uuid(), wayId: z.uuid() });

/**
 * POST /api/boards/:boardId/ways/:wayId/label {status, note?}: what the walker found at
 * one way. Saved at once; the board's stage becomes labels-matched when every label matches.
 */
export const POST = route<{ boardId: string; wayId: string }>(async (req, params) => {
  // Params, then session and role
  const { boardId, wayId } = parseParams(params, paramsSchema);
  const actor = await requireActor('walk.record');
  // Body
  const input = await parseBody(req, labelInputSchema);
  // Record (ownership, the way and the board's stage in the DAL)
  return Response.json(await recordLabel(actor, boardId, wayId, input));
});
