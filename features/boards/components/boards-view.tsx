'use client';

import { LayoutGrid, Plus } from 'lucide-react';
import { useCallback, useState } from 'react';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { can } from '@/lib/auth/permissions';
import type { BoardSummary } from '@/lib/boards/types';
import type { Role } from '@/lib/domain';
import { errorMessage } from '@/lib/api/client';

import { feedChangesOf } from '../api/boards-api';
import { useDeleteBoard, useRestoreBoard, useUndoDeleteBoard } from '../api/use-board-mutations';
import { useBoards, useSiteOptions } from '../api/use-boards';
import { BoardCreateDialog } from './board-create-dialog';
import { BoardRenameDialog } from './board-rename-dialog';
import { BoardsTable } from './boards-table';
import { DeleteBoardDialog, type RemovalQuestion } from './delete-board-dialog';

type BoardsViewProps = {
  role: Role;
  /** Shows one site's boards (on the site page) instead of the organisation's. */
  siteId?: string;
};

/** The boards list with its loading, empty and error states, and the board dialogs. */
export function BoardsView({ role, siteId }: BoardsViewProps) {
  const canEdit = can(role, 'boards.edit');
  const canArchive = can(role, 'records.archive');
  const [showArchived, setShowArchived] = useState(false);
  const boards = useBoards(siteId, showArchived);
  const remove = useDeleteBoard();
  const undo = useUndoDeleteBoard();
  const restore = useRestoreBoard();
  const [creating, setCreating] = useState(false);
  const siteOptions = useSiteOptions(canEdit && creating);
  const [renaming, setRenaming] = useState<BoardSummary | null>(null);
  const [deleting, setDeleting] = useState<RemovalQuestion | null>(null);
  const onRename = useCallback((board: BoardSummary) => setRenaming(board), []);
  // Archived rows: restore (admins). Issued boards: archive with a confirmation (admins).
  // Never-issued boards: delete at once, with undo in the toast.
  const onDelete = useCallback(
    (board: BoardSummary) => {
      if (board.archivedAt) {
        restore.mutate(board.id, {
          onSuccess: () => toast.success(`Restored ${board.name}.`),
          onError: (err) => toast.error(errorMessage(err)),
        });
      } else if (board.everIssued) {
        setDeleting({ board, feedChanges: null });
      } else {
        remove.mutate(
          { boardId: board.id },
          {
            onSuccess: () =>
              toast.success(`Deleted ${board.name}.`, {
                duration: 10_000,
                action: {
                  label: 'Undo',
                  onClick: () =>
                    undo.mutate(board.id, {
                      onSuccess: () => toast.success(`${board.name} is back.`),
                      onError: (err) => toast.error(errorMessage(err)),
                    }),
                },
              }),
            // Other boards are fed from its ways: ask, naming them, before it goes
            onError: (err) => {
              const feedChanges = feedChangesOf(err);
              if (feedChanges) setDeleting({ board, feedChanges });
              else toast.error(errorMessage(err));
            },
          },
        );
      }
    },
    [remove, undo, restore],
  );
  const removeLabelOf = useCallback(
    (board: BoardSummary) =>
      board.archivedAt
        ? canArchive
          ? 'Restore'
          : null
        : board.everIssued
          ? canArchive
            ? 'Archive'
            : null
          : 'Delete',
    [canArchive],
  );

  const createButton = canEdit ? (
    <Button onClick={() => setCreating(true)}>
      <Plus aria-hidden className="h-4 w-4" />
      New board
    </Button>
  ) : null;

  let body: React.ReactNode;
  if (boards.isError) {
    body = (
      <ErrorState
        title="The boards could not be loaded"
        message={boards.error.message}
        onRetry={() => void boards.refetch()}
        retrying={boards.isFetching}
      />
    );
  } else if (boards.isSuccess && boards.data.length === 0) {
    body = (
      <EmptyState
        icon={<LayoutGrid aria-hidden className="h-8 w-8" />}
        title={showArchived ? 'No archived boards' : siteId ? 'No boards on this site yet' : 'No boards yet'}
        action={showArchived ? null : createButton}
      >
        {showArchived
          ? 'Archived boards, and the boards of archived sites, are listed here.'
          : canEdit
            ? 'Start a board with its supply and enclosure, then arrange its ways in the editor.'
            : 'When a designer starts a board it appears here.'}
      </EmptyState>
    );
  } else {
    body = (
      <BoardsTable
        boards={boards.data ?? []}
        loading={boards.isPending}
        canEdit={canEdit}
        singleSite={Boolean(siteId)}
        onRename={onRename}
        onDelete={onDelete}
        removeLabelOf={removeLabelOf}
      />
    );
  }

  const archivedToggle = (
    <label className="inline-flex items-center gap-2 text-sm text-ink-soft">
      <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
      Show archived
    </label>
  );
  const actions = (
    <>
      {archivedToggle}
      {boards.isSuccess && boards.data.length > 0 && !showArchived ? createButton : null}
    </>
  );
  return (
    <section aria-labelledby={siteId ? 'site-boards-heading' : undefined}>
      {siteId ? (
        <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
          <h2 id="site-boards-heading" className="text-lg font-semibold text-ink">
            Boards on this site
          </h2>
          {actions}
        </div>
      ) : (
        <PageHeader
          title="Boards"
          description="Every board of the organisation, from first draft to labels matched on site."
          actions={actions}
        />
      )}
      {body}
      {canEdit ? (
        <>
          <BoardCreateDialog
            open={creating}
            onClose={() => setCreating(false)}
            sites={siteOptions.data ?? []}
            sitesLoading={siteOptions.isPending}
            sitesError={siteOptions.isError ? siteOptions.error.message : null}
            onRetrySites={() => void siteOptions.refetch()}
            siteId={siteId}
          />
          <BoardRenameDialog board={renaming} onClose={() => setRenaming(null)} />
          <DeleteBoardDialog question={deleting} onClose={() => setDeleting(null)} />
        </>
      ) : null}
    </section>
  );
}
