import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { boardRenameSchema, boardSaveSchema, idParamsSchema } from '@/lib/boards/schemas';
import { getBoard, removeBoard, renameBoard, saveBoard } from '@/lib/dal/boards';

type Params = { boardId: string };

/** GET /api/boards/:boardId: the board with its ways. */
export const GET = route<Params>(async (_req, params) => {
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.read');
  return Response.json({ board: await getBoard(actor, boardId) });
});

/** PUT /api/boards/:boardId: save the whole board (settings and ways) at a known version. */
export const PUT = route<Params>(async (req, params) => {
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.edit');
  const input = await parseBody(req, boardSaveSchema);
  return Response.json({ board: await saveBoard(actor, boardId, input) });
});

/** PATCH /api/boards/:boardId: rename or relocate. */
export const PATCH = route<Params>(async (req, params) => {
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.edit');
  const input = await parseBody(req, boardRenameSchema);
  return Response.json({ board: await renameBoard(actor, boardId, input) });
});

/**
 * DELETE /api/boards/:boardId: a board never issued is deleted (undo: POST …/undo-delete);
 * a board ever issued is archived, by an admin only (lib/boards/record-rules.ts).
 */
export const DELETE = route<Params>(async (_req, params) => {
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('boards.discard');
  return Response.json(await removeBoard(actor, boardId));
});
