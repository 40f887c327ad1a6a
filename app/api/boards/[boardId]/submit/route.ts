import { z } from 'zod';

import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { submitBoard } from '@/lib/dal/board-status';

/** The body is optional: `version` pins the board to the version the designer saw. */
const submitBodySchema = z
  .object({ version: z.number().int().min(1).optional() })
  .strict()
  .optional();

/**
 * POST /api/boards/:boardId/submit: send a draft board for review. 422 with the failing ways
 * when any way fails; 409 when the board is not a draft or the version is stale.
 */
export const POST = route<{ boardId: string }>(async (req, params) => {
  // Params and session (role)
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.submit');
  // Body
  const body = await parseBody(req, submitBodySchema);
  // Ownership, sizing, status, audit and mail, in the DAL
  const board = await submitBoard(actor, boardId, body?.version);
  return Response.json({ board });
});
