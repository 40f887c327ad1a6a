import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';
import { updateMember } from '@/lib/dal/members';
import { memberUpdateSchema } from '@/lib/members/schemas';

/** PATCH /api/members/:userId: change a role, deactivate or reactivate (admins). */
export const PATCH = defineRoute({
  action: 'members.manage',
  params: z.object({ userId: z.uuid() }),
  body: memberUpdateSchema,
  handler: async ({ actor, params: { userId }, body }) =>
    Response.json({ member: await updateMember(actor, userId, body) }),
});
