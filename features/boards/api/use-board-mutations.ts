'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';

import type { BoardCreateInput } from '@/lib/boards/schemas';

import {
  boardKeys,
  patchBoard,
  postBoard,
  removeBoard,
  restoreBoard,
  undoDeleteBoard,
  type BoardRename,
} from './boards-api';

/** Refreshes board lists and the sites' board counts. */
function useRefreshLists() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: boardKeys.all }),
      queryClient.invalidateQueries({ queryKey: ['sites'] }),
    ]);
}

/** Creates an empty board on a site. */
export function useCreateBoard() {
  const refresh = useRefreshLists();
  return useMutation({
    mutationFn: (input: BoardCreateInput) => postBoard(input),
    onSuccess: () => refresh(),
  });
}

/** Renames or relocates a board. */
export function useRenameBoard() {
  const refresh = useRefreshLists();
  return useMutation({
    mutationFn: ({ boardId, input }: { boardId: string; input: BoardRename }) => patchBoard(boardId, input),
    onSuccess: () => refresh(),
  });
}

/**
 * Deletes a never-issued board (undoable), or archives an issued one (admins); a board that feeds
 * others is refused (`feedChangesOf`) until sent again with `confirmFeedChanges`.
 */
export function useDeleteBoard() {
  const refresh = useRefreshLists();
  return useMutation({
    mutationFn: ({ boardId, confirmFeedChanges }: { boardId: string; confirmFeedChanges?: boolean }) =>
      removeBoard(boardId, confirmFeedChanges),
    onSuccess: () => refresh(),
  });
}

/** Undoes the delete of a draft board. */
export function useUndoDeleteBoard() {
  const refresh = useRefreshLists();
  return useMutation({ mutationFn: (boardId: string) => undoDeleteBoard(boardId), onSuccess: () => refresh() });
}

/** Brings an archived board back (admins). */
export function useRestoreBoard() {
  const refresh = useRefreshLists();
  return useMutation({ mutationFn: (boardId: string) => restoreBoard(boardId), onSuccess: () => refresh() });
}
