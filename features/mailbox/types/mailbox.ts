import { z } from 'zod';

/** One outbox row as GET /api/dev/mailbox returns it. */
export const outboxRowSchema = z.object({
  id: z.string(),
  toAddress: z.string(),
  subject: z.string(),
  status: z.enum(['queued', 'sent', 'failed']),
  attempts: z.number(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type OutboxRow = z.infer<typeof outboxRowSchema>;

/** One message the local mail catcher received. */
export const caughtMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string().default(''),
  to: z.array(z.string()).default([]),
  subject: z.string().default(''),
  text: z.string().default(''),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string(), size: z.number() })).default([]),
});
export type CaughtMessage = z.infer<typeof caughtMessageSchema>;

/** The mailbox as the screen uses it; `caught` is null when no catcher answered. */
export type Mailbox = { outbox: OutboxRow[]; caught: CaughtMessage[] | null; skipped: number };
