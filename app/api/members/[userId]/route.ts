import { z } from 'zod';

import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { updateMember } from '@/lib/dal/members';
import { memberUpdateSchema } from '@/lib/members/schemas';

const paramsSchema = z.object({ userId: z.uuid() });

/** PATCH /api/members/:userId: change a role, deactivate or reactivate (admins). */
export const PATCH = route<{ userId: string }>(async (req, params) => {
  const { userId } = parseParams(params, paramsSchema);
  const actor = await requireActor('members.manage');
  const input = await parseBody(req, memberUpdateSchema);
  return Response.json({ member: await updateMember(actor, userId, input) });
});
