import { z } from 'zod';

import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { openAttachment } from '@/lib/dal/attachments';
import { photoHeaders } from '@/lib/storage/photo-headers';

const paramsSchema = z.object({ attachmentId: z.uuid() });

/** GET /api/attachments/:id/thumb: the photo's thumbnail (JPEG), to members of its organisation only. */
export const GET = route<{ attachmentId: string }>(async (_req, params) => {
  const { attachmentId } = parseParams(params, paramsSchema);
  const actor = await requireActor('boards.read');
  const file = await openAttachment(actor, attachmentId, 'thumb');
  return new Response(file.body, { headers: photoHeaders(file) });
});
