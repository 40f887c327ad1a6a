import { z } from 'zod';

import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { deleteAttachment, openAttachment } from '@/lib/dal/attachments';
import { photoHeaders } from '@/lib/storage/photo-headers';

type Params = { attachmentId: string };
const paramsSchema = z.object({ attachmentId: z.uuid() });

/** GET /api/attachments/:id: the photo, to members of its organisation only (404 otherwise). */
export const GET = route<Params>(async (_req, params) => {
  const { attachmentId } = parseParams(params, paramsSchema);
  const actor = await requireActor('boards.read');
  const file = await openAttachment(actor, attachmentId, 'original');
  return new Response(file.body, { headers: photoHeaders(file) });
});

/**
 * DELETE /api/attachments/:id: removes a photo (those who may take them); the photo of a board
 * that was ever issued is withdrawn and kept.
 */
export const DELETE = route<Params>(async (_req, params) => {
  const { attachmentId } = parseParams(params, paramsSchema);
  const actor = await requireActor('walk.record');
  return Response.json(await deleteAttachment(actor, attachmentId));
});
