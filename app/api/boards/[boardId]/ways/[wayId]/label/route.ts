import { z } from 'zod';

import { labelInputSchema } from '@/features/label-walk/types/schemas';
import { defineRoute } from '@/lib/api/handler';
import { recordLabel } from '@/lib/dal/label-walk';

/**
 * POST /api/boards/:boardId/ways/:wayId/label {status, note?}: what the walker found at
 * one way. Saved at once; the board's stage becomes labels-matched when every label matches.
 */
export const POST = defineRoute({
  action: 'walk.record',
  params: z.object({ boardId: z.uuid(), wayId: z.uuid() }),
  body: labelInputSchema,
  // Record (ownership, the way and the board's stage in the DAL)
  handler: async ({ actor, params: { boardId, wayId }, body }) =>
    Response.json(await recordLabel(actor, boardId, wayId, body)),
});
