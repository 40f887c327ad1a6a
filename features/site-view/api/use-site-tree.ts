'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { PendingFeed } from '../utils/repoint';
import { fetchSiteTree, putBoardFeed, siteTreeKey } from './site-tree-api';

/** The site's supply tree, sized, as the site view shows it. */
export function useSiteTree(siteId: string) {
  return useQuery({ queryKey: siteTreeKey(siteId), queryFn: () => fetchSiteTree(siteId) });
}

/** Feeds a board from the origin or another board's way; the tree is read again afterwards. */
export function useSetFeed(siteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (pending: PendingFeed) => putBoardFeed(pending.boardId, pending.feed),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: siteTreeKey(siteId) }),
        queryClient.invalidateQueries({ queryKey: ['boards'] }),
      ]),
  });
}
