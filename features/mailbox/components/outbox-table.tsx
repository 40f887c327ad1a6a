'use client';

import type { ColumnDef } from '@tanstack/react-table';
import { CircleAlert, CircleCheck, Clock } from 'lucide-react';

import { byText, DataTable, useSortableTable } from '@/components/ui/data-table';
import { When } from '@/components/ui/when';
import { cn } from '@/lib/cn';

import type { OutboxRow } from '../types/mailbox';

const statusLook = {
  queued: { word: 'Waiting', icon: Clock, tone: 'text-verdict-near' },
  sent: { word: 'Sent', icon: CircleCheck, tone: 'text-verdict-pass' },
  failed: { word: 'Gave up', icon: CircleAlert, tone: 'text-verdict-fail' },
} as const;

const columns: ColumnDef<OutboxRow>[] = [
  {
    id: 'createdAt',
    accessorKey: 'createdAt',
    header: 'Queued',
    sortDescFirst: true,
    meta: { className: 'whitespace-nowrap' },
    cell: ({ row }) => (
      <span className="text-sm text-ink-soft">
        <When iso={row.original.createdAt} />
      </span>
    ),
  },
  { id: 'to', accessorKey: 'toAddress', header: 'To', sortingFn: byText, meta: { card: 'sub' } },
  { id: 'subject', accessorKey: 'subject', header: 'Subject', sortingFn: byText, meta: { card: 'title' } },
  {
    id: 'status',
    accessorFn: (row) => statusLook[row.status].word,
    header: 'Status',
    meta: { card: 'badge', className: 'whitespace-nowrap' },
    cell: ({ row: { original: row } }) => {
      const look = statusLook[row.status];
      const Icon = look.icon;
      return (
        <>
          <span className={cn('inline-flex items-center gap-1.5 text-sm font-medium', look.tone)}>
            <Icon aria-hidden className="h-4 w-4" />
            {look.word}
          </span>
          {row.sentAt ? (
            <span className="block text-xs text-ink-faint">
              <When iso={row.sentAt} />
            </span>
          ) : null}
        </>
      );
    },
  },
  { id: 'attempts', accessorKey: 'attempts', header: 'Attempts', sortDescFirst: true, meta: { align: 'right' } },
  {
    id: 'lastError',
    accessorKey: 'lastError',
    header: 'Last error',
    enableSorting: false,
    meta: { className: 'max-w-[24rem] text-xs text-ink-soft' },
    cell: ({ row }) =>
      row.original.lastError ? (
        <span className="line-clamp-3 font-mono break-words">{row.original.lastError}</span>
      ) : (
        <span className="text-ink-faint">—</span>
      ),
  },
];

/** Every message the app has queued: where it went, whether it left, and why not; a card per message on a phone. */
export function OutboxTable({ rows }: { rows: OutboxRow[] }) {
  const table = useSortableTable(rows, columns);
  if (!rows.length) {
    return <p className="text-sm text-ink-soft">Nothing has been queued yet.</p>;
  }
  return <DataTable table={table} caption="Outbox" phoneCards />;
}
