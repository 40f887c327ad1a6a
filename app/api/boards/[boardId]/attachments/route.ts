import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { addAttachment, listAttachments } from '@/lib/dal/attachments';
import { MAX_PHOTO_BYTES, tooLarge } from '@/lib/storage/photo-image';
import { badRequest } from '@/lib/errors';

/** Room for the multipart framing around a photo at the limit. */
const FRAMING_BYTES = 64 * 1024;

/** GET /api/boards/:boardId/attachments: the board's photos. */
export const GET = defineRoute({
  action: 'boards.read',
  params: idParamsSchema,
  handler: async ({ actor, params: { boardId } }) =>
    Response.json({ attachments: await listAttachments(actor, boardId) }),
});

/**
 * POST /api/boards/:boardId/attachments (multipart/form-data: `file`, optional `wayId`):
 * a photo of the built board or of one way. Images only, sniffed from the bytes, ≤ 10 MB.
 */
export const POST = defineRoute({
  action: 'walk.record',
  params: idParamsSchema,
  body: 'multipart',
  handler: async ({ req, actor, params: { boardId } }) => {
    // Refuse an oversized body before reading it, when its length is declared
    const declared = Number(req.headers.get('content-length') ?? 0);
    if (declared > MAX_PHOTO_BYTES + FRAMING_BYTES) throw tooLarge(declared);
    // The form: a file in `file`, and optionally the way it shows
    if (!(req.headers.get('content-type') ?? '').startsWith('multipart/form-data')) {
      throw badRequest([{ path: 'file', message: 'Send the photo as multipart/form-data in a field named "file".' }]);
    }
    let form: FormData;
    try {
      form = await req.formData();
    } catch {
      throw badRequest([{ path: 'file', message: 'The upload could not be read; try again.' }]);
    }
    const file = form.get('file');
    if (!(file instanceof File)) {
      throw badRequest([{ path: 'file', message: 'Attach a photo in the field named "file".' }]);
    }
    if (file.size > MAX_PHOTO_BYTES) throw tooLarge(file.size);
    const wayText = form.get('wayId');
    const wayId = typeof wayText === 'string' && wayText ? wayText : null;
    if (wayId && !z.uuid().safeParse(wayId).success) {
      throw badRequest([{ path: 'wayId', message: 'That way is not on this board.' }]);
    }
    // Store (type from the bytes, thumbnail and ownership in the DAL)
    const bytes = new Uint8Array(await file.arrayBuffer());
    const attachment = await addAttachment(actor, boardId, { bytes, fileName: file.name || 'photo', wayId });
    return Response.json({ attachment }, { status: 201 });
  },
});
