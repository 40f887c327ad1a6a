'use client';

import { useQuery } from '@tanstack/react-query';

import type { SiteSummary } from '@/lib/sites/types';

import { fetchSite, fetchSites, siteKeys } from './sites-api';

/** The organisation's live sites, or its archived ones. */
export function useSites(archived = false) {
  return useQuery({ queryKey: siteKeys.list(archived), queryFn: () => fetchSites(archived) });
}

/** One site, starting from what the server page already read when given. */
export function useSite(siteId: string, initialData?: SiteSummary) {
  return useQuery({
    queryKey: siteKeys.detail(siteId),
    queryFn: () => fetchSite(siteId),
    initialData,
  });
}
