import { apiFetch } from '@/lib/api/client';
import type { AttachmentDto } from '@/lib/boards/walk-types';
import type { WalkData, WalkProgress } from '@/lib/boards/walk-types';
import type { BoardStatus } from '@/lib/domain';

import type { LabelInput } from '../types/schemas';

const base = (boardId: string) => `/api/boards/${encodeURIComponent(boardId)}`;

/** Cache key of a board's walk. */
export const walkKey = (boardId: string) => ['boards', boardId, 'walk'] as const;

/** GET /api/boards/:id/ways/walk */
export async function fetchWalk(boardId: string): Promise<WalkData> {
  const { walk } = await apiFetch<{ walk: WalkData }>(`${base(boardId)}/ways/walk`);
  return walk;
}

/** POST /api/boards/:id/ways/:wayId/label */
export function postLabel(boardId: string, wayId: string, input: LabelInput) {
  return apiFetch<{ boardStatus: BoardStatus; progress: WalkProgress }>(
    `${base(boardId)}/ways/${encodeURIComponent(wayId)}/label`,
    { method: 'POST', body: input },
  );
}

/** POST /api/boards/:id/attachments (multipart) */
export async function uploadPhoto(boardId: string, file: File, wayId: string | null): Promise<AttachmentDto> {
  const form = new FormData();
  form.append('file', file);
  if (wayId) form.append('wayId', wayId);
  const { attachment } = await apiFetch<{ attachment: AttachmentDto }>(`${base(boardId)}/attachments`, {
    method: 'POST',
    body: form,
  });
  return attachment;
}
