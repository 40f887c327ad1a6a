import { parseBody, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { getOrganisationSettings, updateOrganisationSettings } from '@/lib/dal/organisation';
import { organisationSettingsSchema } from '@/lib/organisation/schemas';

/** GET /api/organisation: the organisation's settings (admins). */
export const GET = route(async () => {
  // Session and role
  const actor = await requireActor('organisation.manage');
  return Response.json({ organisation: await getOrganisationSettings(actor) });
});

/** PATCH /api/organisation: change a setting, e.g. whether a designer may issue their own design (admins). */
export const PATCH = route(async (req) => {
  // Session and role, then the body
  const actor = await requireActor('organisation.manage');
  const input = await parseBody(req, organisationSettingsSchema);
  return Response.json({ organisation: await updateOrganisationSettings(actor, input) });
});
