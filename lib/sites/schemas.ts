import { z } from 'zod';

// Kept apart from the data access layer (which is server-only) so that the site form
// in the browser and the route handlers validate with the very same schema.
export const siteInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Give the site a name.').max(160),
    address: z.string().trim().max(300).default(''),
    client: z.string().trim().max(160).default(''),
  })
  .strict();
export type SiteInput = z.infer<typeof siteInputSchema>;
