'use client';

import { useState } from 'react';
import { toast } from 'sonner';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { errorMessage } from '@/lib/api/client';
import type { BoardSummary } from '@/lib/boards/types';

import { useDeleteBoard } from '../api/use-board-mutations';

/** Asks before deleting a board with its ways and revisions. */
export function DeleteBoardDialog({
  board,
  onClose,
}: {
  board: BoardSummary | null;
  onClose: () => void;
}) {
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
      toast.success(`Deleted ${board.name}.`);
      close();
    } catch (err) {
      setError(errorMessage(err));
    }
  }

  return (
    <ConfirmDialog
      open={board !== null}
      title="Delete this board?"
      confirmLabel="Delete board"
      pending={remove.isPending}
      error={error}
      onConfirm={confirm}
      onClose={close}
    >
      <p>
        <strong>{board?.name}</strong>
        {board?.siteName ? ` on ${board.siteName}` : ''} will be deleted with its{' '}
        {board?.wayCount === 1 ? 'way' : `${board?.wayCount ?? 0} ways`} and every revision,
        including issued ones. This cannot be undone.
      </p>
    </ConfirmDialog>
  );
}
