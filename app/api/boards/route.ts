import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { boardCreateSchema } from '@/lib/boards/schemas';
import { createBoard, listBoards } from '@/lib/dal/boards';
import { notFound } from '@/lib/errors';

/** GET /api/boards[?siteId=][&archived=1]: the organisation's live boards, or its archived ones. */
export const GET = defineRoute({
  action: 'boards.read',
  scope: 'list',
  handler: async ({ req, actor }) => {
    const query = new URL(req.url).searchParams;
    // A junk site id names no site of the organisation
    const siteId = query.get('siteId') ?? undefined;
    if (siteId && !z.uuid().safeParse(siteId).success) throw notFound('The site');
    return Response.json({ boards: await listBoards(actor, { siteId, archived: query.get('archived') === '1' }) });
  },
});

/** POST /api/boards: a new, empty board on one of the organisation's sites. */
export const POST = defineRoute({
  action: 'boards.edit',
  // The body names the site: another organisation's is 404
  scope: 'body',
  body: boardCreateSchema,
  handler: async ({ actor, body }) => Response.json({ board: await createBoard(actor, body) }, { status: 201 }),
});
