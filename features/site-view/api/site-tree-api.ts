import { apiFetch } from '@/lib/api/client';
import type { FeedChoice } from '@/components/site-diagram/tree-model';
import type {
  BoardSaveAnswer,
  SiteOriginInput,
  SitePackEmailInput,
  SiteRipple,
  SiteTreeDto,
} from '@/lib/sites/tree-types';

/**
 * PUT /api/boards/:boardId/feed, confirmed: the screen has already asked, naming every board
 * that changes. A loop or a way that cannot feed a board is refused (422) with the server's words.
 */
export async function putBoardFeed(boardId: string, feed: FeedChoice, version?: number): Promise<BoardSaveAnswer> {
  return apiFetch<BoardSaveAnswer>(`/api/boards/${encodeURIComponent(boardId)}/feed`, {
    method: 'PUT',
    body: { feed, confirmFeedChanges: true, ...(version ? { version } : {}) },
  });
}

/** POST /api/sites/:siteId/pack/email: the site pack queued in the outbox for `to`. */
export async function postSitePackEmail(
  siteId: string,
  input: SitePackEmailInput,
): Promise<{ mail: { id: string; to: string } }> {
  return apiFetch(`/api/sites/${encodeURIComponent(siteId)}/pack/email`, { method: 'POST', body: input });
}

/** PUT /api/sites/:siteId/origin: the site's origin set and every board re-sized with it. */
export async function putSiteOrigin(
  siteId: string,
  origin: SiteOriginInput,
): Promise<{ tree: SiteTreeDto; ripple: SiteRipple }> {
  return apiFetch(`/api/sites/${encodeURIComponent(siteId)}/origin`, { method: 'PUT', body: origin });
}
