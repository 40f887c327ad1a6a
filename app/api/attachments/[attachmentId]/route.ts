import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { deleteAttachment, openAttachment } from '@/lib/dal/attachments';
import { photoHeaders } from '@/lib/storage/photo-headers';

const params = z.object({ attachmentId: z.uuid() });

/** GET /api/attachments/:id: the photo, to members of its organisation only (404 otherwise). */
export const GET = defineRoute({
  action: 'boards.read',
  params,
  handler: async ({ actor, params: { attachmentId } }) => {
    const file = await openAttachment(actor, attachmentId, 'original');
    return new Response(file.body, { headers: photoHeaders(file) });
  },
});

/**
 * DELETE /api/attachments/:id: removes a photo (those who may take them); the photo of a board
 * that was ever issued is withdrawn and kept.
 */
export const DELETE = defineRoute({
  action: 'walk.record',
  params,
  handler: async ({ actor, params: { attachmentId } }) => Response.json(await deleteAttachment(actor, attachmentId)),
});
