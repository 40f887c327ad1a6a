import { defineRoute } from '@/lib/api/handler';
import { getOrganisationSettings, updateOrganisationSettings } from '@/lib/dal/organisation';
import { organisationSettingsSchema } from '@/lib/organisation/schemas';

/** GET /api/organisation: the organisation's settings (admins). */
export const GET = defineRoute({
  action: 'organisation.manage',
  scope: 'list',
  handler: async ({ actor }) => Response.json({ organisation: await getOrganisationSettings(actor) }),
});

/** PATCH /api/organisation: change a setting, e.g. whether a designer may issue their own design (admins). */
export const PATCH = defineRoute({
  action: 'organisation.manage',
  scope: 'list',
  body: organisationSettingsSchema,
  handler: async ({ actor, body }) => Response.json({ organisation: await updateOrganisationSettings(actor, body) }),
});
