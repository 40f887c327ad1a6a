import { z } from 'zod';

/** What the walker found at one way. */
export const labelInputSchema = z
  .object({
    status: z.enum(['matches', 'wrong', 'missing'], { error: 'Choose matches, wrong or missing.' }),
    note: z.string().trim().max(500, 'Keep the note under 500 characters.').optional(),
    /** The walker saw that this takes a fully confirmed board back to issued. */
    confirmStateChange: z.boolean().optional(),
  })
  .strict();
export type LabelInput = z.infer<typeof labelInputSchema>;
