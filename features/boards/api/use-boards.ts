'use client';

import { useQuery } from '@tanstack/react-query';

import { boardKeys, fetchBoards, fetchSiteOptions } from './boards-api';

/** The organisation's boards, or one site's: the live ones, or the archived ones. */
export function useBoards(siteId?: string, archived = false) {
  return useQuery({ queryKey: boardKeys.list(siteId, archived), queryFn: () => fetchBoards(siteId, archived) });
}

/** The sites a new board can go on. */
export function useSiteOptions(enabled = true) {
  return useQuery({ queryKey: boardKeys.siteOptions(), queryFn: fetchSiteOptions, enabled });
}
