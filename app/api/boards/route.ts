import { z } from 'zod';

import { parseBody, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { boardCreateSchema } from '@/lib/boards/schemas';
import { createBoard, listBoards } from '@/lib/dal/boards';
import { notFound } from '@/lib/errors';

/** GET /api/boards[?siteId=][&archived=1]: the organisation's live boards, or its archived ones. */
export const GET = route(async (req) => {
  const actor = await requireActor('boards.read');
  const query = new URL(req.url).searchParams;
  const siteId = query.get('siteId') ?? undefined;
  if (siteId && !z.uuid().safeParse(siteId).success) throw notFound('The site');
  return Response.json({ boards: await listBoards(actor, { siteId, archived: query.get('archived') === '1' }) });
});

/** POST /api/boards: a new, empty board on one of the organisation's sites. */
export const POST = route(async (req) => {
  const actor = await requireActor('boards.edit');
  const input = await parseBody(req, boardCreateSchema);
  return Response.json({ board: await createBoard(actor, input) }, { status: 201 });
});
