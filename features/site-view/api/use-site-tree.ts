'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';

import { siteTreeKey } from '@/components/site-diagram/site-tree-query';
import type { SiteOriginInput } from '@/lib/sites/tree-types';

import type { PendingFeed } from '../utils/repoint';
import { putBoardFeed, putSiteOrigin } from './site-tree-api';

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

/** Sets the site's origin: the answer is the tree re-sized with it, kept as the tree read. */
export function useSetOrigin(siteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (origin: SiteOriginInput) => putSiteOrigin(siteId, origin),
    onSuccess: async ({ tree }) => {
      queryClient.setQueryData(siteTreeKey(siteId), tree);
      await queryClient.invalidateQueries({ queryKey: ['boards'] });
    },
  });
}
