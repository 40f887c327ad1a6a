'use client';

import { useQuery } from '@tanstack/react-query';

import { apiFetch } from '@/lib/api/client';

import { caughtMessageSchema, outboxRowSchema, type Mailbox } from '../types/mailbox';

/**
 * GET /api/dev/mailbox. The catcher's messages come from a separate process, so each one is
 * checked and any that does not fit is counted rather than breaking the page.
 */
export async function fetchMailbox(): Promise<Mailbox> {
  const raw = await apiFetch<{ outbox: unknown[]; caught: unknown[] | null }>('/api/dev/mailbox');
  let skipped = 0;
  const outbox = (raw.outbox ?? []).flatMap((row) => {
    const parsed = outboxRowSchema.safeParse(row);
    if (!parsed.success) skipped += 1;
    return parsed.success ? [parsed.data] : [];
  });
  const caught = raw.caught
    ? raw.caught.flatMap((m) => {
        const parsed = caughtMessageSchema.safeParse(m);
        if (!parsed.success) skipped += 1;
        return parsed.success ? [parsed.data] : [];
      })
    : null;
  return { outbox, caught, skipped };
}

/** The development outbox, refreshed every few seconds so retries can be watched. */
export function useMailbox() {
  return useQuery({
    queryKey: ['mailbox'],
    queryFn: fetchMailbox,
    refetchInterval: 5_000,
  });
}
