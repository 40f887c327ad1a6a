import { apiFetch } from '@/lib/api/client';
import type { ScheduleMail } from '@/lib/boards/review-types';

import type { ScheduleEmailInput } from '../types/schemas';

const base = (boardId: string) => `/api/boards/${encodeURIComponent(boardId)}/schedule/email`;

/** Cache key of a board's sent schedules. */
export const scheduleMailsKey = (boardId: string) => ['boards', boardId, 'schedule-mails'] as const;

/** POST /api/boards/:id/schedule/email */
export function postScheduleEmail(boardId: string, input: ScheduleEmailInput) {
  return apiFetch<{ mail: { id: string; status: string; to: string; revision: number } }>(base(boardId), {
    method: 'POST',
    body: input,
  });
}

/** GET /api/boards/:id/schedule/email */
export async function fetchScheduleMails(boardId: string): Promise<ScheduleMail[]> {
  const { mails } = await apiFetch<{ mails: ScheduleMail[] }>(base(boardId));
  return mails;
}
