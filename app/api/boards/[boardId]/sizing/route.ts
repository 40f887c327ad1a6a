import { z } from 'zod';

import { defineRoute, fieldIssues } from '@/lib/api/handler';
import { boardSettingsSchema, idParamsSchema, wayInputSchema } from '@/lib/boards/schemas';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import { storedBoardSizing } from '@/lib/dal/board-sizing';
import { requireBoard } from '@/lib/dal/boards';
import { badRequest } from '@/lib/errors';
import { boardInputSchema, sizeBoard } from '@/lib/sizing';

/** The body is optional: empty sizes the stored board; `draft` sizes unsaved edits. */
const bodySchema = z
  .object({
    draft: z
      .object({ settings: boardSettingsSchema, ways: z.array(wayInputSchema).max(400) })
      .strict()
      .optional(),
  })
  .strict()
  .optional();

/** POST /api/boards/:boardId/sizing: every way of the board sized, and the board summary. */
export const POST = defineRoute({
  action: 'sizing.run',
  params: idParamsSchema,
  body: bodySchema,
  handler: async ({ actor, params: { boardId }, body }) => {
    // The stored board: sized once per stored state (see `storedBoardSizing`)
    if (!body?.draft) {
      const stored = await storedBoardSizing(actor, boardId);
      if (!stored.sizing) throw badRequest(stored.issues);
      return new Response(stored.body, { headers: { 'content-type': 'application/json' } });
    }
    // A draft: ownership, then the board-level rules (duplicate ids, circuits on devices
    // that feed none) as field issues
    await requireBoard(actor, boardId);
    const checked = boardInputSchema.safeParse(boardSizingInput(body.draft.settings, body.draft.ways));
    if (!checked.success) throw badRequest(fieldIssues(checked.error));
    return Response.json(sizeBoard(checked.data));
  },
});
