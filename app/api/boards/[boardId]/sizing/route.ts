import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { boardSettingsSchema, idParamsSchema, wayInputSchema } from '@/lib/boards/schemas';
import { sizeDesign } from '@/lib/boards/size-design';
import { readStoredSizing } from '@/lib/dal/board-repository';
import { draftTreeContext } from '@/lib/dal/site-supply';
import { withTreeContext } from '@/lib/sites/tree-context';
import { badRequest } from '@/lib/errors';

/** The body is optional: empty sizes the stored board; `draft` sizes unsaved edits. */
const bodySchema = z
  .object({
    draft: z
      .object({ settings: boardSettingsSchema, ways: z.array(wayInputSchema).max(400) })
      .strict()
      .optional(),
  })
  .strict()
  .optional();

/** POST /api/boards/:boardId/sizing: every way of the board sized, and the board summary. */
export const POST = defineRoute({
  action: 'sizing.run',
  params: idParamsSchema,
  body: bodySchema,
  handler: async ({ actor, params: { boardId }, body }) => {
    // The stored board: its sizing is stored with it (see `readStoredSizing`)
    if (!body?.draft) {
      const stored = await readStoredSizing(actor, boardId);
      if (stored.json === null) throw badRequest(stored.issues);
      return new Response(stored.json, { headers: { 'content-type': 'application/json' } });
    }
    // A draft: ownership, then the board-level rules (duplicate ids, circuits on devices
    // that feed none) as field issues
    // A board of a site's tree is sized with what is carried to it (lib/dal/site-supply.ts)
    const draft = withTreeContext(body.draft, await draftTreeContext(actor, boardId));
    const { sizing, issues } = sizeDesign({ ...draft.settings, ways: draft.ways });
    if (!sizing) throw badRequest(issues);
    return Response.json(sizing);
  },
});
