import { parseBody, route } from '@/lib/api/handler';
import { acceptInvitation } from '@/lib/dal/members';
import { acceptInviteSchema } from '@/lib/members/schemas';

/** POST /api/invitations/accept: public; the one-time token is the credential. */
export const POST = route(async (req) => {
  const input = await parseBody(req, acceptInviteSchema);
  return Response.json(await acceptInvitation(input), { status: 201 });
});
