'use client';

import { useState } from 'react';
import { toast } from 'sonner';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { errorMessage } from '@/lib/api/client';
import type { BoardSummary } from '@/lib/boards/types';
import { fedFromWords } from '@/lib/names';
import type { FeedChange } from '@/lib/sites/tree-types';

import { feedChangesOf } from '../api/boards-api';
import { useDeleteBoard, useUndoDeleteBoard } from '../api/use-board-mutations';

/** A removal to ask about: the board, and the boards fed from its ways when the server named them. */
export type RemovalQuestion = { board: BoardSummary; feedChanges: FeedChange[] | null };

/**
 * Asks before archiving a board that was issued (admins): it leaves the lists and becomes
 * read-only, and everything is kept. (A never-issued board is deleted at once, with undo.) Either
 * one, when other boards are fed from its ways (the server named them), is asked here too: they
 * would be fed from the origin, so the dialog names them and the confirmation says so.
 */
export function DeleteBoardDialog({ question, onClose }: { question: RemovalQuestion | null; onClose: () => void }) {
  const remove = useDeleteBoard();
  const undo = useUndoDeleteBoard();
  const [error, setError] = useState<string | null>(null);
  // Feeds the server named on a first attempt from this dialog
  const [named, setNamed] = useState<FeedChange[] | null>(null);
  const board = question?.board ?? null;
  const feedChanges = question?.feedChanges ?? named;
  const archive = !!board?.everIssued;

  function close() {
    setError(null);
    setNamed(null);
    onClose();
  }

  async function confirm() {
    if (!board) return;
    setError(null);
    try {
      const answer = await remove.mutateAsync({ boardId: board.id, confirmFeedChanges: !!feedChanges });
      const moved = answer.feedChanges?.length
        ? ` ${answer.feedChanges.map((c) => c.name).join(', ')} now fed from the origin.`
        : '';
      if (answer.effect === 'archived') toast.success(`Archived ${board.name}. Find it under “Show archived”.${moved}`);
      else {
        // Undo brings the board back with the feeds it had (its own and the boards it fed), where
        // each way is still free and nobody linked the board elsewhere meanwhile
        toast.success(`Deleted ${board.name}.${moved}`, {
          duration: 10_000,
          action: {
            label: 'Undo',
            onClick: () =>
              undo.mutate(board.id, {
                onSuccess: () =>
                  toast.success(`${board.name} is back, with its feeds as they were where the ways are still free.`),
                onError: (e) => toast.error(errorMessage(e)),
              }),
          },
        });
      }
      close();
    } catch (err) {
      const changes = feedChangesOf(err);
      if (changes) setNamed(changes);
      else setError(errorMessage(err));
    }
  }

  return (
    <ConfirmDialog
      open={board !== null}
      title={archive ? 'Archive this board?' : 'Delete this board?'}
      confirmLabel={
        feedChanges
          ? archive
            ? 'Archive and feed from the origin'
            : 'Delete and feed from the origin'
          : archive
            ? 'Archive board'
            : 'Delete board'
      }
      pending={remove.isPending}
      error={error}
      danger={!archive}
      onConfirm={confirm}
      onClose={close}
    >
      {archive ? (
        <p>
          <strong>{board?.name}</strong>
          {board?.siteName ? ` on ${board.siteName}` : ''} has been issued, so it is kept: it leaves the lists and
          becomes read-only, and its revisions, schedules, comments, label checks and photos stay readable. An admin can
          restore it.
        </p>
      ) : (
        <p>
          <strong>{board?.name}</strong>
          {board?.siteName ? ` on ${board.siteName}` : ''} has never been issued, so it is deleted; you can undo it
          straight after.
        </p>
      )}
      {feedChanges ? (
        <div className="mt-3">
          <p>
            {feedChanges.length === 1 ? 'This board is' : 'These boards are'} fed from its ways, and would be fed from
            the origin (the supply intake) and sized again with its values until linked to another way:
          </p>
          <ul className="mt-2 space-y-1">
            {feedChanges.map((c) => (
              <li key={c.boardId}>
                <strong>{c.name}</strong>: fed now from {fedFromWords(c.from)}
              </li>
            ))}
          </ul>
          <p className="mt-2">
            {archive ? 'Restoring' : 'Undoing the delete of'} {board?.name} feeds them from it again, where nobody has
            linked them elsewhere meanwhile.
          </p>
        </div>
      ) : null}
    </ConfirmDialog>
  );
}
