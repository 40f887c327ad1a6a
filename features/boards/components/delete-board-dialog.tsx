'use client';

import { useState } from 'react';
import { toast } from 'sonner';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { errorMessage } from '@/lib/api/client';
import type { BoardSummary } from '@/lib/boards/types';

import { useDeleteBoard } from '../api/use-board-mutations';

/**
 * Asks before archiving a board that was issued (admins): it leaves the lists and becomes
 * read-only, and everything is kept. (A never-issued board is deleted at once, with undo.)
 */
export function DeleteBoardDialog({ board, onClose }: { board: BoardSummary | null; onClose: () => void }) {
  const remove = useDeleteBoard();
  const [error, setError] = useState<string | null>(null);

  function close() {
    setError(null);
    onClose();
  }

  async function confirm() {
    if (!board) return;
    setError(null);
    try {
      await remove.mutateAsync(board.id);
      toast.success(`Archived ${board.name}. Find it under “Show archived”.`);
      close();
    } catch (err) {
      setError(errorMessage(err));
    }
  }

  return (
    <ConfirmDialog
      open={board !== null}
      title="Archive this board?"
      confirmLabel="Archive board"
      pending={remove.isPending}
      error={error}
      danger={false}
      onConfirm={confirm}
      onClose={close}
    >
      <p>
        <strong>{board?.name}</strong>
        {board?.siteName ? ` on ${board.siteName}` : ''} has been issued, so it is kept: it leaves the lists and becomes
        read-only, and its revisions, schedules, comments, label checks and photos stay readable. An admin can restore
        it.
      </p>
    </ConfirmDialog>
  );
}
