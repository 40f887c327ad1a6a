'use client';

import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type Row,
  type RowData,
  type SortingState,
  type Table,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import { Fragment, useState } from 'react';

import { cn } from '@/lib/cn';

declare module '@tanstack/react-table' {
  // Layout hints a column can carry to the shared table. The type parameters must match the
  // library's own declaration for the two to merge, though the hints use neither.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    align?: 'left' | 'right';
    /** Classes for both the header and the cells of the column. */
    className?: string;
    /**
     * Where the column goes on a phone's card (`phoneCards`): the card's title, its badge
     * (top right), a line under the title, its actions, or a named field (the default).
     */
    card?: 'title' | 'badge' | 'sub' | 'field' | 'actions';
  }
}

type DataTableProps<T> = {
  table: Table<T>;
  /** Read out by screen readers as the table's name. */
  caption: string;
  loading?: boolean;
  skeletonRows?: number;
  /** Shown in place of the rows when the filters leave none. */
  noMatch?: React.ReactNode;
  /** Below the `md` width, each row is drawn as a card (the columns' `meta.card`) instead of a wide table. */
  phoneCards?: boolean;
};

const sortWords = { asc: 'ascending', desc: 'descending' } as const;

const collator = new Intl.Collator('en-GB', { numeric: true, sensitivity: 'base' });

/**
 * Sorts text as people read it: case-blind, with numbers in order ("Unit 2" before "Unit 10",
 * "4 Mill Lane" before "Towpath").
 */
export function byText<T>(a: Row<T>, b: Row<T>, columnId: string): number {
  return collator.compare(String(a.getValue(columnId) ?? ''), String(b.getValue(columnId) ?? ''));
}

/** A table of `data` sortable by its columns, in the order given until a heading is pressed. */
export function useSortableTable<T>(data: T[], columns: ColumnDef<T>[]): Table<T> {
  const [sorting, setSorting] = useState<SortingState>([]);
  return useReactTable({
    data,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
}

/**
 * Draws a TanStack table the Boardwright way: roomy rows, sortable headers that say their
 * order (`aria-sort`), skeleton rows while loading and a line when filters match nothing.
 */
export function DataTable<T>({
  table,
  caption,
  loading,
  skeletonRows = 5,
  noMatch = 'Nothing matches these filters.',
  phoneCards,
}: DataTableProps<T>) {
  const columns = table.getVisibleLeafColumns();
  const rows = table.getRowModel().rows;
  return (
    <>
      {phoneCards ? <RowCards table={table} caption={caption} loading={loading} noMatch={noMatch} /> : null}
      {/* relative: screen-reader-only words in the table are placed inside this scrolling box (beside
          it, they widened a phone's page) */}
      <div
        className={cn(
          'relative overflow-x-auto rounded-card border border-line bg-paper-raised',
          phoneCards && 'hidden md:block',
        )}
      >
        <table className="w-full border-collapse text-sm" aria-busy={loading || undefined}>
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-paper-sunk/60">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} className="border-b border-line">
                {group.headers.map((header) => {
                  const { column } = header;
                  const meta = column.columnDef.meta;
                  const sorted = column.getIsSorted();
                  const label = header.isPlaceholder ? null : flexRender(column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={column.getCanSort() ? (sorted ? sortWords[sorted] : 'none') : undefined}
                      className={cn(
                        'h-11 px-4 text-xs font-semibold tracking-wide whitespace-nowrap text-ink-soft uppercase',
                        meta?.align === 'right' ? 'text-right' : 'text-left',
                        meta?.className,
                      )}
                    >
                      {column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={column.getToggleSortingHandler()}
                          className={cn(
                            'inline-flex items-center gap-1 rounded uppercase hover:text-ink',
                            sorted && 'text-ink',
                            meta?.align === 'right' && 'flex-row-reverse',
                          )}
                        >
                          {label}
                          {sorted === 'asc' ? (
                            <ArrowUp aria-hidden className="h-3.5 w-3.5" />
                          ) : sorted === 'desc' ? (
                            <ArrowDown aria-hidden className="h-3.5 w-3.5" />
                          ) : (
                            <ArrowUpDown aria-hidden className="h-3.5 w-3.5 opacity-40" />
                          )}
                        </button>
                      ) : (
                        label
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {loading
              ? Array.from({ length: skeletonRows }, (_, i) => (
                  <tr key={`skeleton-${i}`} data-testid="skeleton-row" className="border-b border-line last:border-0">
                    {columns.map((column) => (
                      <td key={column.id} className="h-14 px-4">
                        <span
                          aria-hidden
                          className="block h-3 animate-pulse rounded bg-paper-sunk"
                          style={{ width: `${40 + ((i * 7 + column.id.length * 11) % 50)}%` }}
                        />
                      </td>
                    ))}
                  </tr>
                ))
              : rows.map((row) => (
                  <tr key={row.id} className="border-b border-line transition-colors last:border-0 hover:bg-paper/70">
                    {row.getVisibleCells().map((cell) => {
                      const meta = cell.column.columnDef.meta;
                      return (
                        <td
                          key={cell.id}
                          className={cn(
                            'h-14 px-4 align-middle text-ink',
                            meta?.align === 'right' ? 'text-right tabular-nums' : 'text-left',
                            meta?.className,
                          )}
                        >
                          {flexRender(cell.column.columnDef.cell, cell.getContext())}
                        </td>
                      );
                    })}
                  </tr>
                ))}
            {!loading && rows.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-4 py-10 text-center text-sm text-ink-soft">
                  {noMatch}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
        {loading ? <span className="sr-only">Loading…</span> : null}
      </div>
    </>
  );
}

/** The rows as cards for a phone: title and badge on top, a line under them, named fields, then actions. */
function RowCards<T>({
  table,
  caption,
  loading,
  noMatch,
}: Pick<DataTableProps<T>, 'table' | 'caption' | 'loading' | 'noMatch'>) {
  const rows = table.getRowModel().rows;
  if (loading) return <p className="text-sm text-ink-soft md:hidden">Loading…</p>;
  if (rows.length === 0) {
    return (
      <p className="rounded-card border border-line bg-paper-raised px-4 py-8 text-center text-sm text-ink-soft md:hidden">
        {noMatch}
      </p>
    );
  }
  return (
    <ul aria-label={caption} data-testid="row-cards" className="flex flex-col gap-2 md:hidden">
      {rows.map((row) => {
        const cells = row.getVisibleCells();
        const place = (where: string) => cells.filter((c) => (c.column.columnDef.meta?.card ?? 'field') === where);
        const render = (c: (typeof cells)[number]) => flexRender(c.column.columnDef.cell, c.getContext());
        // A card shows what the row has: an empty value leaves no "· —" under the title, nor a
        // named field with a dash
        const filled = (c: (typeof cells)[number]) => {
          const value = c.getValue();
          return value !== '' && value !== null && value !== undefined;
        };
        const subs = place('sub').filter(filled);
        return (
          <li key={row.id} className="rounded-card border border-line bg-paper-raised p-3">
            <div className="flex items-start justify-between gap-3">
              <div className="min-w-0 text-base font-medium break-words">
                {place('title').map((c) => (
                  <Fragment key={c.id}>{render(c)}</Fragment>
                ))}
              </div>
              {place('badge').map((c) => (
                <div key={c.id} className="shrink-0">
                  {render(c)}
                </div>
              ))}
            </div>
            {subs.length ? (
              <p className="mt-0.5 text-sm text-ink-soft">
                {subs.map((c, i) => (
                  <Fragment key={c.id}>
                    {i > 0 ? ' · ' : null}
                    {render(c)}
                  </Fragment>
                ))}
              </p>
            ) : null}
            <dl className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm">
              {place('field')
                .filter(filled)
                .map((c) => {
                  const header = c.column.columnDef.header;
                  return (
                    <div key={c.id} className="flex items-baseline gap-1.5">
                      <dt className="text-xs text-ink-soft">{typeof header === 'string' ? header : c.column.id}</dt>
                      <dd className="text-ink tabular-nums">{render(c)}</dd>
                    </div>
                  );
                })}
            </dl>
            {place('actions').map((c) => (
              <div key={c.id} className="mt-2 flex justify-end">
                {render(c)}
              </div>
            ))}
          </li>
        );
      })}
    </ul>
  );
}

/** A search box for the top of a table. */
export function TableSearch({
  value,
  onChange,
  label,
  placeholder,
}: {
  value: string;
  onChange: (value: string) => void;
  label: string;
  placeholder?: string;
}) {
  return (
    <input
      type="search"
      aria-label={label}
      placeholder={placeholder ?? label}
      value={value}
      onChange={(event) => onChange(event.target.value)}
      className="h-10 w-full min-w-0 rounded-md border border-line-strong bg-paper-raised px-3 text-sm text-ink placeholder:text-ink-faint focus:border-copper focus:outline-none sm:w-72"
    />
  );
}
