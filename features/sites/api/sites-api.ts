import { apiFetch } from '@/lib/api/client';
import type { SiteSummary } from '@/lib/sites/types';
import type { SiteInput } from '@/lib/sites/schemas';

/** Cache keys for sites; everything under `['sites']` is refreshed after a site changes. */
export const siteKeys = {
  all: ['sites'] as const,
  list: (archived = false) => ['sites', 'list', archived ? 'archived' : 'live'] as const,
  detail: (siteId: string) => ['sites', 'detail', siteId] as const,
};

/** GET /api/sites[?archived=1] */
export async function fetchSites(archived = false): Promise<SiteSummary[]> {
  const { sites } = await apiFetch<{ sites: SiteSummary[] }>(`/api/sites${archived ? '?archived=1' : ''}`);
  return sites;
}

/** GET /api/sites/:siteId */
export async function fetchSite(siteId: string): Promise<SiteSummary> {
  const url = `/api/sites/${encodeURIComponent(siteId)}`;
  const { site } = await apiFetch<{ site: SiteSummary }>(url);
  return site;
}

/** POST /api/sites */
export async function postSite(input: SiteInput): Promise<SiteSummary> {
  const { site } = await apiFetch<{ site: SiteSummary }>('/api/sites', {
    method: 'POST',
    body: input,
  });
  return site;
}

/** PATCH /api/sites/:siteId */
export async function patchSite(siteId: string, input: Partial<SiteInput>): Promise<SiteSummary> {
  const url = `/api/sites/${encodeURIComponent(siteId)}`;
  const { site } = await apiFetch<{ site: SiteSummary }>(url, {
    method: 'PATCH',
    body: input,
  });
  return site;
}

/** DELETE /api/sites/:siteId: archives the site with its boards (nothing is deleted) */
export async function removeSite(siteId: string): Promise<void> {
  await apiFetch<void>(`/api/sites/${encodeURIComponent(siteId)}`, { method: 'DELETE' });
}

/** POST /api/sites/:siteId/restore (admins) */
export async function restoreSite(siteId: string): Promise<SiteSummary> {
  const { site } = await apiFetch<{ site: SiteSummary }>(`/api/sites/${encodeURIComponent(siteId)}/restore`, {
    method: 'POST',
  });
  return site;
}
