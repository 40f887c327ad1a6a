import { apiFetch, ApiError } from '@/lib/api/client';
import type { FailingWay } from '@/lib/boards/review-types';
import type { BoardDto } from '@/lib/boards/types';
import type { FeedChange } from '@/lib/sites/tree-types';
import type { BoardResult } from '@/lib/sizing';

import type { DraftSnapshot } from '../types/draft';

/** The board with its ways, as stored. */
export async function fetchBoard(boardId: string): Promise<BoardDto> {
  const { board } = await apiFetch<{ board: BoardDto }>(`/api/boards/${boardId}`);
  return board;
}

/** Sizes the unsaved draft. */
export function sizeDraft(boardId: string, draft: DraftSnapshot, signal?: AbortSignal): Promise<BoardResult> {
  return apiFetch<BoardResult>(`/api/boards/${boardId}/sizing`, {
    method: 'POST',
    body: { draft: { settings: draft.settings, ways: draft.ways } },
    signal,
  });
}

/** A field of a refusal's body beyond its message (the stored version, the failing ways). */
const bodyField = (err: ApiError, name: string): unknown => (err.body as Record<string, unknown> | undefined)?.[name];

/**
 * How a save ended, as the save store's phase: saved, someone else saved first (with their
 * version), the save would take a feeding way from other boards (asked first: they would be fed
 * from the origin), or refused.
 */
type SaveOutcome =
  | { phase: 'saved'; board: BoardDto }
  | { phase: 'conflict'; theirVersion: number; message: string }
  | { phase: 'feeds'; feedChanges: FeedChange[]; message: string }
  | { phase: 'locked'; message: string };

/**
 * Saves the draft on top of `version`; `confirmFeedChanges`: the designer agreed that boards fed
 * from ways this save removes go back to the origin. Network and validation failures reject with ApiError.
 */
export async function saveDraft(
  boardId: string,
  version: number,
  draft: DraftSnapshot,
  confirmFeedChanges = false,
): Promise<SaveOutcome> {
  try {
    const body = {
      version,
      settings: draft.settings,
      ways: draft.ways,
      ...(confirmFeedChanges ? { confirmFeedChanges } : {}),
    };
    const { board } = await apiFetch<{ board: BoardDto }>(`/api/boards/${boardId}`, { method: 'PUT', body });
    return { phase: 'saved', board };
  } catch (err) {
    if (!(err instanceof ApiError)) throw err;
    const theirVersion = bodyField(err, 'currentVersion');
    if (err.status === 409 && typeof theirVersion === 'number')
      return { phase: 'conflict', theirVersion, message: err.message };
    const feedChanges = bodyField(err, 'feedChanges');
    if (err.status === 409 && Array.isArray(feedChanges))
      return { phase: 'feeds', feedChanges: feedChanges as FeedChange[], message: err.message };
    if (err.status === 409 || err.status === 403) return { phase: 'locked', message: err.message };
    throw err;
  }
}

/** How sending for review ended. */
type SubmitOutcome =
  | { kind: 'sent'; board: BoardDto }
  | { kind: 'refused'; message: string; failing: FailingWay[] }
  | { kind: 'conflict'; message: string };

/** Sends the stored board for review at `version`. */
export async function submitForReview(boardId: string, version: number): Promise<SubmitOutcome> {
  try {
    const { board } = await apiFetch<{ board: BoardDto }>(`/api/boards/${boardId}/submit`, {
      method: 'POST',
      body: { version },
    });
    return { kind: 'sent', board };
  } catch (err) {
    if (!(err instanceof ApiError)) throw err;
    if (err.status === 422)
      return { kind: 'refused', message: err.message, failing: (bodyField(err, 'failing') as FailingWay[]) ?? [] };
    if (err.status === 409) return { kind: 'conflict', message: err.message };
    throw err;
  }
}

/** POST /api/boards/:id/comments/answered: the designer has dealt with these review comments. */
export function markCommentsAnswered(boardId: string, commentIds: string[]) {
  return apiFetch<{ answered: number }>(`/api/boards/${encodeURIComponent(boardId)}/comments/answered`, {
    method: 'POST',
    body: { commentIds },
  });
}
