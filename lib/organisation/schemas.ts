import { z } from 'zod';

/** The organisation's settings an admin may change. */
export const organisationSettingsSchema = z
  .object({
    allowSelfIssue: z.boolean('Say yes or no.'),
  })
  .strict();
export type OrganisationSettingsInput = z.infer<typeof organisationSettingsSchema>;

/** What the settings page shows. */
export type OrganisationSettings = { name: string; allowSelfIssue: boolean };
