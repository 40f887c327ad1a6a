import { apiFetch } from '@/lib/api/client';
import type { SiteSummary } from '@/lib/dal/sites';
import type { SiteInput } from '@/lib/sites/schemas';

/** Cache keys for sites; everything under `['sites']` is refreshed after a site changes. */
export const siteKeys = {
  all: ['sites'] as const,
  list: () => ['sites', 'list'] as const,
  detail: (siteId: string) => ['sites', 'detail', siteId] as const,
};

/** GET /api/sites */
export async function fetchSites(): Promise<SiteSummary[]> {
  const { sites } = await apiFetch<{ sites: SiteSummary[] }>('/api/sites');
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

/** DELETE /api/sites/:siteId (the site and its boards) */
export async function removeSite(siteId: string): Promise<void> {
  await apiFetch<void>(`/api/sites/${encodeURIComponent(siteId)}`, { method: 'DELETE' });
}
