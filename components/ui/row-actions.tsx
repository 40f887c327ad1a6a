import { Archive, Pencil, Trash2 } from 'lucide-react';

import { Button } from '@/components/ui/button';

type RowActionsProps = {
  /** What the row is called, for the buttons' accessible names. */
  name: string;
  /** The word on the first button ("Rename", "Edit"). */
  editLabel: string;
  onEdit: () => void;
  onDelete: () => void;
  /** The word on the second button (default "Delete"); null hides it. */
  deleteLabel?: string | null;
};

/** The edit and delete buttons at the end of a list row. */
export function RowActions({ name, editLabel, onEdit, onDelete, deleteLabel = 'Delete' }: RowActionsProps) {
  return (
    <div className="flex justify-end gap-1">
      <Button variant="quiet" size="sm" onClick={onEdit} aria-label={`${editLabel} ${name}`}>
        <Pencil aria-hidden className="h-4 w-4" />
        {editLabel}
      </Button>
      {deleteLabel === null ? null : (
        <Button
          variant="quiet"
          size="sm"
          onClick={onDelete}
          aria-label={`${deleteLabel} ${name}`}
          className="hover:text-verdict-fail"
        >
          {deleteLabel === 'Delete' ? (
            <Trash2 aria-hidden className="h-4 w-4" />
          ) : (
            <Archive aria-hidden className="h-4 w-4" />
          )}
          {deleteLabel}
        </Button>
      )}
    </div>
  );
}
