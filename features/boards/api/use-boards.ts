'use client';

import { useQuery } from '@tanstack/react-query';

import { boardKeys, fetchBoards, fetchSiteOptions } from './boards-api';

/** The organisation's boards, or one site's. */
export function useBoards(siteId?: string) {
  return useQuery({ queryKey: boardKeys.list(siteId), queryFn: () => fetchBoards(siteId) });
}

/** The sites a new board can go on. */
export function useSiteOptions(enabled = true) {
  return useQuery({ queryKey: boardKeys.siteOptions(), queryFn: fetchSiteOptions, enabled });
}
