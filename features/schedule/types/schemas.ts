import { z } from 'zod';

/** The query of the schedule and label routes: which revision, and whether to download. */
export const printQuerySchema = z.object({
  revision: z.coerce
    .number({ error: 'The revision must be a number.' })
    .int('A revision is a whole number.')
    .min(1, 'Revisions start at 1.')
    .max(100000)
    .optional(),
  download: z.enum(['0', '1'], { error: 'download is 0 or 1.' }).optional(),
});
export type PrintQuery = z.infer<typeof printQuerySchema>;

/** Sending the schedule by e-mail. */
export const scheduleEmailSchema = z
  .object({
    to: z.email('Give a valid e-mail address.').max(254),
    revision: z.number().int().min(1, 'Revisions start at 1.').optional(),
    message: z.string().trim().max(2000, 'Keep the message under 2000 characters.').optional(),
  })
  .strict();
export type ScheduleEmailInput = z.infer<typeof scheduleEmailSchema>;
