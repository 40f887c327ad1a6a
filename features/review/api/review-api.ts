import { apiFetch } from '@/lib/api/client';
import type { WayChecks } from '@/lib/boards/review-page-data';
import type { RevisionDiff } from '@/lib/boards/revision-diff';
import type { CommentDto } from '@/lib/boards/review-types';
import type { RevisionSummary } from '@/lib/boards/review-types';
import type { BoardStatus } from '@/lib/domain';

import type { ApproveInput, CommentInput, ReturnInput } from '../types/schemas';

const base = (boardId: string) => `/api/boards/${encodeURIComponent(boardId)}`;

/** Cache keys of the review feature. */
export const reviewKeys = {
  revisions: (boardId: string) => ['boards', boardId, 'revisions'] as const,
  diff: (boardId: string, from: string, to: string) => ['boards', boardId, 'revisions', 'diff', from, to] as const,
  wayChecks: (boardId: string, wayId: string) => ['boards', boardId, 'sizing', 'ways', wayId] as const,
};

/** GET /api/boards/:id/sizing/ways/:wayId: one way's checks from the stored sizing */
export async function fetchWayChecks(boardId: string, wayId: string): Promise<WayChecks> {
  const { checks } = await apiFetch<{ checks: WayChecks }>(`${base(boardId)}/sizing/ways/${encodeURIComponent(wayId)}`);
  return checks;
}

/** POST /api/boards/:id/comments */
export async function postComment(boardId: string, input: CommentInput): Promise<CommentDto> {
  const { comment } = await apiFetch<{ comment: CommentDto }>(`${base(boardId)}/comments`, {
    method: 'POST',
    body: input,
  });
  return comment;
}

/** POST /api/boards/:id/review/approve */
export function postApprove(boardId: string, input: ApproveInput) {
  return apiFetch<{ revision: number; status: BoardStatus }>(`${base(boardId)}/review/approve`, {
    method: 'POST',
    body: input,
  });
}

/** POST /api/boards/:id/review/return */
export function postReturn(boardId: string, input: ReturnInput) {
  return apiFetch<{ revision: number; status: BoardStatus }>(`${base(boardId)}/review/return`, {
    method: 'POST',
    body: input,
  });
}

/** GET /api/boards/:id/revisions */
export function fetchRevisions(boardId: string) {
  return apiFetch<{ revisions: RevisionSummary[]; current: { revision: number; status: BoardStatus } }>(
    `${base(boardId)}/revisions`,
  );
}

/** GET /api/boards/:id/revisions/:to?from=:from — what changed from one state to another. */
export async function fetchDiff(boardId: string, from: string, to: string): Promise<RevisionDiff> {
  const res = await apiFetch<{ diff: { diff: RevisionDiff } }>(
    `${base(boardId)}/revisions/${encodeURIComponent(to)}?from=${encodeURIComponent(from)}`,
  );
  return res.diff.diff;
}
