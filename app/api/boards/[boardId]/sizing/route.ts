import { z } from 'zod';

import { fieldIssues, parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { boardSettingsSchema, idParamsSchema, wayInputSchema } from '@/lib/boards/schemas';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import { getBoard, requireBoard } from '@/lib/dal/boards';
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
export const POST = route<{ boardId: string }>(async (req, params) => {
  // Params and session
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('sizing.run');
  // Body (optional draft)
  const body = await parseBody(req, bodySchema);
  // Ownership, and the ways to size: the draft sent, or the stored board
  let input;
  if (body?.draft) {
    await requireBoard(actor, boardId);
    input = boardSizingInput(body.draft.settings, body.draft.ways);
  } else {
    const board = await getBoard(actor, boardId);
    input = boardSizingInput(board, board.ways);
  }
  // The board-level rules (duplicate ids, circuits on devices that feed none) as field issues
  const checked = boardInputSchema.safeParse(input);
  if (!checked.success) throw badRequest(fieldIssues(checked.error));
  return Response.json(sizeBoard(checked.data));
});
