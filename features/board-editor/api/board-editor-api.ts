import { apiFetch, ApiError } from '@/lib/api/client';
import type { BoardDto } from '@/lib/boards/types';
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

// A call whose error bodies carry more than a message (the stored version, the failing ways).
async function call(url: string, method: string, body: unknown): Promise<{ status: number; json: Record<string, unknown> }> {
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      credentials: 'same-origin',
      headers: { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'Could not reach Boardwright. Your changes are kept in this browser; try again.');
  }
  let json: Record<string, unknown> = {};
  try {
    json = (await response.json()) as Record<string, unknown>;
  } catch {
    json = {};
  }
  return { status: response.status, json };
}

function failure(status: number, json: Record<string, unknown>): ApiError {
  const message = typeof json.error === 'string' ? json.error : 'Something went wrong on our side.';
  const issues = Array.isArray(json.issues) ? (json.issues as { path: string; message: string }[]) : [];
  return new ApiError(status, message, issues);
}

/** How a save ended: saved, someone else saved first (with their version), or refused. */
export type SaveOutcome =
  | { kind: 'saved'; board: BoardDto }
  | { kind: 'conflict'; theirVersion: number; message: string }
  | { kind: 'locked'; message: string };

/** Saves the draft on top of `version`. Network and validation failures reject with ApiError. */
export async function saveDraft(boardId: string, version: number, draft: DraftSnapshot): Promise<SaveOutcome> {
  const { status, json } = await call(`/api/boards/${boardId}`, 'PUT', {
    version,
    settings: draft.settings,
    ways: draft.ways.map(({ id, rail, position, device, circuit }) => ({ id, rail, position, device, circuit })),
  });
  if (status === 200) return { kind: 'saved', board: json.board as BoardDto };
  const message = typeof json.error === 'string' ? json.error : 'The board could not be saved.';
  if (status === 409 && typeof json.currentVersion === 'number') {
    return { kind: 'conflict', theirVersion: json.currentVersion, message };
  }
  if (status === 409 || status === 403) return { kind: 'locked', message };
  throw failure(status, json);
}

/** One failing way in a refusal to send for review. */
export type RefusedWay = { wayId: string; label: string | null; serves: string; problems: string[] };

/** How sending for review ended. */
export type SubmitOutcome =
  | { kind: 'sent'; board: BoardDto }
  | { kind: 'refused'; message: string; failing: RefusedWay[] }
  | { kind: 'conflict'; message: string };

/** Sends the stored board for review at `version`. */
export async function submitForReview(boardId: string, version: number): Promise<SubmitOutcome> {
  const { status, json } = await call(`/api/boards/${boardId}/submit`, 'POST', { version });
  if (status === 200) return { kind: 'sent', board: json.board as BoardDto };
  const message = typeof json.error === 'string' ? json.error : 'The board could not be sent.';
  if (status === 422) return { kind: 'refused', message, failing: (json.failing as RefusedWay[]) ?? [] };
  if (status === 409) return { kind: 'conflict', message };
  throw failure(status, json);
}

/** POST /api/boards/:id/comments/answered: the designer has dealt with these review comments. */
export function markCommentsAnswered(boardId: string, commentIds: string[]) {
  return apiFetch<{ answered: number }>(`/api/boards/${encodeURIComponent(boardId)}/comments/answered`, {
    method: 'POST',
    body: { commentIds },
  });
}
