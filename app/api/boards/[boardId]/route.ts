import { defineRoute } from '@/lib/api/handler';
import { boardRenameSchema, boardSaveSchema, idParamsSchema } from '@/lib/boards/schemas';
import { readBoard } from '@/lib/dal/board-repository';
import { removeBoard, renameBoard, saveBoard } from '@/lib/dal/boards';
import { removalQuerySchema } from '@/lib/sites/tree-types';

/** GET /api/boards/:boardId: the board with its ways. */
export const GET = defineRoute({
  action: 'boards.read',
  params: idParamsSchema,
  handler: async ({ actor, params: { boardId } }) => Response.json({ board: await readBoard(actor, boardId) }),
});

/**
 * PUT /api/boards/:boardId: save the whole board (settings and ways) at a known version.
 * Answers `{ board, ripple }`: every board of the site is re-sized with it; 409 naming the
 * boards whose feeding way the save takes away, unless `confirmFeedChanges`.
 */
export const PUT = defineRoute({
  action: 'boards.edit',
  params: idParamsSchema,
  body: boardSaveSchema,
  handler: async ({ actor, params: { boardId }, body }) => {
    // The board, and what the save did to the rest of its site (lib/sites/tree-types.ts SiteRipple)
    const out = { ripple: null };
    const board = await saveBoard(actor, boardId, body, out);
    return Response.json({ board, ripple: out.ripple });
  },
});

/** PATCH /api/boards/:boardId: rename or relocate. */
export const PATCH = defineRoute({
  action: 'boards.edit',
  params: idParamsSchema,
  body: boardRenameSchema,
  handler: async ({ actor, params: { boardId }, body }) =>
    Response.json({ board: await renameBoard(actor, boardId, body) }),
});

/**
 * DELETE /api/boards/:boardId: a board never issued is deleted (undo: POST …/undo-delete);
 * a board ever issued is archived, by an admin only (lib/boards/record-rules.ts). A board that
 * feeds other boards answers 409 `feedChanges` unless `?confirmFeedChanges=1` (lib/sites/tree-types.ts);
 * confirmed, the answer lists them as `feedChanges`.
 */
export const DELETE = defineRoute({
  action: 'boards.discard',
  params: idParamsSchema,
  query: removalQuerySchema,
  // Remove (ownership, the record rules and the boards it feeds checked in the DAL)
  handler: async ({ actor, params: { boardId }, query }) => {
    const { effect, feedChanges } = await removeBoard(actor, boardId, { confirmFeedChanges: query.confirmFeedChanges });
    // The boards now fed from the origin, when there are any
    return Response.json({ effect, ...(feedChanges.length ? { feedChanges } : {}) });
  },
});
