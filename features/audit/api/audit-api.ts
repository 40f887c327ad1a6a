import { apiFetch } from '@/lib/api/client';
import type { AuditPage } from '@/lib/audit-types';

/**
 * Cache keys of a board's audit trail. They sit under `['boards', boardId]`, so whatever
 * refreshes a board (`invalidateQueries({ queryKey: ['boards'] })`) refreshes its trail too.
 */
export const auditKeys = {
  board: (boardId: string) => ['boards', boardId, 'audit'] as const,
};

/** GET /api/boards/:boardId/audit[?before=] — one page of the trail, newest first. */
export function fetchAuditPage(boardId: string, before?: string | null): Promise<AuditPage> {
  const query = before ? `?before=${encodeURIComponent(before)}` : '';
  return apiFetch<AuditPage>(`/api/boards/${encodeURIComponent(boardId)}/audit${query}`);
}
