import { parseBody, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { inviteMember, listMembers } from '@/lib/dal/members';
import { inviteInputSchema } from '@/lib/members/schemas';

/** GET /api/members: members and open invitations (admins). */
export const GET = route(async () => {
  const actor = await requireActor('members.manage');
  return Response.json({ members: await listMembers(actor) });
});

/** POST /api/members: invite someone by e-mail with a role (admins). */
export const POST = route(async (req) => {
  const actor = await requireActor('members.manage');
  const input = await parseBody(req, inviteInputSchema);
  return Response.json({ invitation: await inviteMember(actor, input) }, { status: 201 });
});
