import { z } from 'zod';

import { ROLES } from '@/lib/domain';

/** Password rules: at least 10 characters, with a letter and a digit (common practice). */
export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')
  .regex(/[A-Za-z]/, 'Include at least one letter.')
  .regex(/[0-9]/, 'Include at least one digit.');

export const inviteInputSchema = z
  .object({
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address.').max(254),
    name: z.string().trim().min(1, 'Enter the member’s name.').max(120),
    role: z.enum(ROLES),
  })
  .strict();
export type InviteInput = z.infer<typeof inviteInputSchema>;

export const memberUpdateSchema = z
  .object({ role: z.enum(ROLES).optional(), active: z.boolean().optional() })
  .strict()
  .refine((v) => v.role !== undefined || v.active !== undefined, {
    message: 'Send a role or an active flag.',
  });
export type MemberUpdate = z.infer<typeof memberUpdateSchema>;

export const acceptInviteSchema = z
  .object({
    token: z.string().min(20).max(200),
    password: passwordSchema,
  })
  .strict();
export type AcceptInviteInput = z.infer<typeof acceptInviteSchema>;
