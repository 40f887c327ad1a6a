import { defineRoute } from '@/lib/api/handler';
import { inviteMember, listMembers } from '@/lib/dal/members';
import { inviteInputSchema } from '@/lib/members/schemas';

/** GET /api/members: members and open invitations (admins). */
export const GET = defineRoute({
  action: 'members.manage',
  scope: 'list',
  handler: async ({ actor }) => Response.json({ members: await listMembers(actor) }),
});

/** POST /api/members: invite someone by e-mail with a role (admins). */
export const POST = defineRoute({
  action: 'members.manage',
  scope: 'list',
  body: inviteInputSchema,
  handler: async ({ actor, body }) => Response.json({ invitation: await inviteMember(actor, body) }, { status: 201 }),
});
