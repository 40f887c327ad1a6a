'use client';

import { useQuery } from '@tanstack/react-query';

import { apiFetch } from '@/lib/api/client';
import type { SiteTreeDto } from '@/lib/sites/tree-types';

/** Cache key of a site's tree: one for every screen that shows it (site view, editor, review). */
export const siteTreeKey = (siteId: string) => ['sites', 'tree', siteId] as const;

/** GET /api/sites/:siteId/tree */
export async function fetchSiteTree(siteId: string): Promise<SiteTreeDto> {
  const { tree } = await apiFetch<{ tree: SiteTreeDto }>(`/api/sites/${encodeURIComponent(siteId)}/tree`);
  return tree;
}

/** The site's supply tree, sized (the server sizes it on every read). */
export function useSiteTree(siteId: string, opts: { enabled?: boolean } = {}) {
  return useQuery({ queryKey: siteTreeKey(siteId), queryFn: () => fetchSiteTree(siteId), enabled: opts.enabled });
}
