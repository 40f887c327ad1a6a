import { defineRoute } from '@/lib/api/handler';
import { acceptInvitation } from '@/lib/dal/members';
import { acceptInviteSchema } from '@/lib/members/schemas';

/** POST /api/invitations/accept: public; the one-time token is the credential. */
export const POST = defineRoute({
  action: 'public',
  publicBecause: 'the invited person has no account yet; the one-time token from the e-mail is the credential.',
  scope: 'none',
  body: acceptInviteSchema,
  handler: async ({ body }) => Response.json(await acceptInvitation(body), { status: 201 }),
});
