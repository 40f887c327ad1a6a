import { ApiError, apiFetch } from '@/lib/api/client';
import type { BoardCreateInput } from '@/lib/boards/schemas';
import type { BoardDto, BoardSummary } from '@/lib/boards/types';
import type { FeedChange } from '@/lib/sites/tree-types';

/** A site as the board dialogs need it: enough to pick one. */
export type SiteOption = { id: string; name: string };

/** What a rename may change. */
export type BoardRename = { name?: string; location?: string };

/** Cache keys for boards; everything under `['boards']` is refreshed after a board changes. */
export const boardKeys = {
  all: ['boards'] as const,
  list: (siteId?: string, archived = false) =>
    ['boards', 'list', siteId ?? 'all', archived ? 'archived' : 'live'] as const,
  // Kept under the sites prefix so a site change refreshes the choices too
  siteOptions: () => ['sites', 'options'] as const,
};

/** GET /api/boards[?siteId=][&archived=1] */
export async function fetchBoards(siteId?: string, archived = false): Promise<BoardSummary[]> {
  const params = new URLSearchParams();
  if (siteId) params.set('siteId', siteId);
  if (archived) params.set('archived', '1');
  const query = params.size ? `?${params}` : '';
  const { boards } = await apiFetch<{ boards: BoardSummary[] }>(`/api/boards${query}`);
  return boards;
}

/** GET /api/sites, reduced to the choices for a site picker. */
export async function fetchSiteOptions(): Promise<SiteOption[]> {
  const { sites } = await apiFetch<{ sites: SiteOption[] }>('/api/sites');
  return sites.map(({ id, name }) => ({ id, name }));
}

/** POST /api/boards */
export async function postBoard(input: BoardCreateInput): Promise<BoardDto> {
  const { board } = await apiFetch<{ board: BoardDto }>('/api/boards', {
    method: 'POST',
    body: input,
  });
  return board;
}

/** PATCH /api/boards/:boardId (name and location only) */
export async function patchBoard(boardId: string, input: BoardRename): Promise<BoardDto> {
  const url = `/api/boards/${encodeURIComponent(boardId)}`;
  const { board } = await apiFetch<{ board: BoardDto }>(url, {
    method: 'PATCH',
    body: input,
  });
  return board;
}

/** What removing a board answers: deleted or archived, and the boards now fed from the origin. */
export type RemovalAnswer = { effect: 'deleted' | 'archived'; feedChanges?: FeedChange[] };

/**
 * DELETE /api/boards/:boardId: a never-issued board is deleted (undoable), an issued one archived
 * (admins). A board that feeds others is refused (409 with `feedChanges`) unless confirmed.
 */
export function removeBoard(boardId: string, confirmFeedChanges = false): Promise<RemovalAnswer> {
  const query = confirmFeedChanges ? '?confirmFeedChanges=1' : '';
  return apiFetch<RemovalAnswer>(`/api/boards/${encodeURIComponent(boardId)}${query}`, { method: 'DELETE' });
}

/** The boards a refused removal would take the supply from (a 409 naming them), or null. */
export function feedChangesOf(error: unknown): FeedChange[] | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const changes = (error.body as { feedChanges?: unknown } | undefined)?.feedChanges;
  return Array.isArray(changes) && changes.length ? (changes as FeedChange[]) : null;
}

/** POST /api/boards/:boardId/undo-delete */
export async function undoDeleteBoard(boardId: string): Promise<void> {
  await apiFetch(`/api/boards/${encodeURIComponent(boardId)}/undo-delete`, { method: 'POST' });
}

/** POST /api/boards/:boardId/restore (admins) */
export async function restoreBoard(boardId: string): Promise<void> {
  await apiFetch(`/api/boards/${encodeURIComponent(boardId)}/restore`, { method: 'POST' });
}
