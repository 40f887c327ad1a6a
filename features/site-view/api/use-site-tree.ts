'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';

import { siteTreeKey } from '@/components/site-diagram/site-tree-query';

import type { PendingFeed } from '../utils/repoint';
import { putBoardFeed } from './site-tree-api';

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
