import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { openAttachment } from '@/lib/dal/attachments';
import { photoHeaders } from '@/lib/storage/photo-headers';

/** GET /api/attachments/:id/thumb: the photo's thumbnail (JPEG), to members of its organisation only. */
export const GET = defineRoute({
  action: 'boards.read',
  params: z.object({ attachmentId: z.uuid() }),
  handler: async ({ actor, params: { attachmentId } }) => {
    const file = await openAttachment(actor, attachmentId, 'thumb');
    return new Response(file.body, { headers: photoHeaders(file) });
  },
});
