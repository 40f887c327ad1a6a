import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { wayChecksOf } from '@/lib/boards/review-page-data';
import { readSizedBoard } from '@/lib/dal/board-repository';
import { badRequest, notFound } from '@/lib/errors';

/**
 * GET /api/boards/:boardId/sizing/ways/:wayId: one way's checks from the board's stored sizing
 * (each check met or not, its message and reference), for the review page, which loads them
 * when a way is opened rather than sending every way's checks with the page. A way without a
 * circuit has none.
 */
export const GET = defineRoute({
  action: 'boards.read',
  params: z.object({ boardId: z.uuid(), wayId: z.uuid() }),
  // The stored sizing (ownership in the DAL), then the way's checks
  handler: async ({ actor, params: { boardId, wayId } }) => {
    const { sizing, issues } = await readSizedBoard(actor, boardId);
    if (!sizing) throw badRequest(issues);
    const way = sizing.ways.find((w) => w.id === wayId);
    if (!way) throw notFound('The way');
    return Response.json({ checks: wayChecksOf(way.result) });
  },
});
