import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { can } from '@/lib/auth/permissions';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { forbidden, notFound } from '@/lib/errors';
import type { OrganisationSettings, OrganisationSettingsInput } from '@/lib/organisation/schemas';
import { Organisation } from '@/models';

/** The caller's organisation's settings. */
export async function getOrganisationSettings(actor: Actor): Promise<OrganisationSettings> {
  const org = await Organisation.findByPk(actor.organisationId);
  if (!org) throw notFound('The organisation');
  return { name: org.name, allowSelfIssue: org.allowSelfIssue };
}

/** Changes the caller's organisation's settings (admins), audited. */
export async function updateOrganisationSettings(
  actor: Actor,
  input: OrganisationSettingsInput,
): Promise<OrganisationSettings> {
  if (!can(actor.role, 'organisation.manage')) throw forbidden('change the organisation’s settings');
  await db().transaction(async (transaction) => {
    const org = await Organisation.findByPk(actor.organisationId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!org) throw notFound('The organisation');
    const allowSelfIssue = { from: org.allowSelfIssue, to: input.allowSelfIssue };
    await org.update({ allowSelfIssue: input.allowSelfIssue }, { transaction });
    await audit(actor, 'organisation.changed', { allowSelfIssue }, { transaction });
  });
  return getOrganisationSettings(actor);
}
