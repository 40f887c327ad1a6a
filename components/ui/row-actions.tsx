import { Pencil, Trash2 } from 'lucide-react';

import { Button } from '@/components/ui/button';

type RowActionsProps = {
  /** What the row is called, for the buttons' accessible names. */
  name: string;
  /** The word on the first button ("Rename", "Edit"). */
  editLabel: string;
  onEdit: () => void;
  onDelete: () => void;
};

/** The edit and delete buttons at the end of a list row. */
export function RowActions({ name, editLabel, onEdit, onDelete }: RowActionsProps) {
  return (
    <div className="flex justify-end gap-1">
      <Button variant="quiet" size="sm" onClick={onEdit} aria-label={`${editLabel} ${name}`}>
        <Pencil aria-hidden className="h-4 w-4" />
        {editLabel}
      </Button>
      <Button
        variant="quiet"
        size="sm"
        onClick={onDelete}
        aria-label={`Delete ${name}`}
        className="hover:text-verdict-fail"
      >
        <Trash2 aria-hidden className="h-4 w-4" />
        Delete
      </Button>
    </div>
  );
}
