'use client';

import type { CellContext, ColumnDef } from '@tanstack/react-table';

import { RowActions } from '@/components/ui/row-actions';
import { When } from '@/components/ui/when';

/** A cell with the column's text, or a faint dash when there is none (optionally styled). */
export function textOrDash<T>(className?: string) {
  return function TextOrDash({ getValue }: CellContext<T, unknown>) {
    const text = getValue<string>();
    if (!text) return <span className="text-ink-faint">—</span>;
    return className ? <span className={className}>{text}</span> : text;
  };
}

/** "Last change": the row's `updatedAt`, newest first when sorted. */
export function lastChangeColumn<T extends { updatedAt: string }>(): ColumnDef<T> {
  return {
    id: 'updatedAt',
    accessorKey: 'updatedAt',
    header: 'Last change',
    sortDescFirst: true,
    cell: ({ row }) => <When iso={row.original.updatedAt} />,
  };
}

/** The edit and delete buttons at the end of each row. */
export function actionsColumn<T extends { name: string }>(
  editLabel: string,
  onEdit: (row: T) => void,
  onDelete: (row: T) => void,
  /** The word on the second button for a row ("Delete", "Archive", "Restore"); null hides it. */
  deleteLabelOf?: (row: T) => string | null,
): ColumnDef<T> {
  return {
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    enableSorting: false,
    meta: { align: 'right', card: 'actions' },
    cell: ({ row }) => (
      <RowActions
        name={row.original.name}
        editLabel={editLabel}
        onEdit={() => onEdit(row.original)}
        onDelete={() => onDelete(row.original)}
        deleteLabel={deleteLabelOf ? deleteLabelOf(row.original) : undefined}
      />
    ),
  };
}

/** How many rows a list shows: "3 sites", or "2 of 3 sites" while filtered. */
export function RowCount({
  shown,
  total,
  one,
  many,
  className = 'text-sm text-ink-soft',
}: {
  shown: number;
  total: number;
  one: string;
  many: string;
  className?: string;
}) {
  return (
    <p className={className} aria-live="polite">
      {shown === total ? `${total} ${total === 1 ? one : many}` : `${shown} of ${total} ${many}`}
    </p>
  );
}
