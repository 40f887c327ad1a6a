'use client';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { fedFromWords } from '@/lib/names';
import type { FeedChange } from '@/lib/sites/tree-types';

type FeedChangeDialogProps = { feedChanges: FeedChange[] | null; onConfirm: () => void; onHold: () => void };

/** Asked before a save that takes away a way feeding other boards: confirmed, they are fed from the origin. */
export function FeedChangeDialog({ feedChanges, onConfirm, onHold }: FeedChangeDialogProps) {
  return (
    <ConfirmDialog
      open={!!feedChanges?.length}
      danger={false}
      title="Other boards are fed from this board"
      description="This save takes away the way that feeds them."
      cancelLabel="Keep editing"
      confirmLabel="Save and feed from the origin"
      onClose={onHold}
      onConfirm={onConfirm}
    >
      <ul className="space-y-1">
        {(feedChanges ?? []).map((c) => (
          <li key={c.boardId}>
            <strong>{c.name}</strong>: fed now from {fedFromWords(c.from)}
          </li>
        ))}
      </ul>
      <p className="mt-3 text-ink-soft">
        If you save, {feedChanges?.length === 1 ? 'this board is' : 'these boards are'} fed from the origin (the supply
        intake) and sized again with its values until linked to another way. Undo the change instead to keep the feed.
      </p>
    </ConfirmDialog>
  );
}
