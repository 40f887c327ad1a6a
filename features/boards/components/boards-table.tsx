'use client';

import {
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type ColumnFiltersState,
  type SortingState,
} from '@tanstack/react-table';
import Link from 'next/link';
import { useMemo, useState } from 'react';

import { Button } from '@/components/ui/button';
import { byText, DataTable, TableSearch } from '@/components/ui/data-table';
import { Select } from '@/components/ui/field';
import { ArchivedBadge, StatusBadge } from '@/components/ui/status-badge';
import { actionsColumn, lastChangeColumn, RowCount, textOrDash } from '@/components/ui/table-columns';
import { countWords } from '@/lib/boards/counts';
import type { BoardSummary } from '@/lib/boards/types';

import { BOARD_STAGES, stageOrder } from '../utils/board-stages';

type BoardsTableProps = {
  boards: BoardSummary[];
  loading?: boolean;
  canEdit: boolean;
  /** Hides the site column and filter when the list is already one site's. */
  singleSite?: boolean;
  onRename: (board: BoardSummary) => void;
  onDelete: (board: BoardSummary) => void;
  /** The word on a row's remove button ("Delete", "Archive", "Restore"), null for none (default "Delete"). */
  removeLabelOf?: (board: BoardSummary) => string | null;
};

/** Searches a board's name, site and location. */
function matchesSearch(board: BoardSummary, query: string): boolean {
  const needle = query.trim().toLowerCase();
  if (!needle) return true;
  return [board.name, board.siteName, board.location].some((v) => v.toLowerCase().includes(needle));
}

const selectClass = 'h-10 w-auto min-w-40';

/** Boards: sortable by every column, filtered by stage, site and a search. */
export function BoardsTable({
  boards,
  loading,
  canEdit,
  singleSite,
  onRename,
  onDelete,
  removeLabelOf,
}: BoardsTableProps) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'updatedAt', desc: true }]);
  const [search, setSearch] = useState('');
  const [filters, setFilters] = useState<ColumnFiltersState>([]);

  const statusFilter = (filters.find((f) => f.id === 'status')?.value as string | undefined) ?? '';
  const siteFilter = (filters.find((f) => f.id === 'site')?.value as string | undefined) ?? '';

  function setFilter(id: 'status' | 'site', value: string) {
    setFilters((current) => [...current.filter((f) => f.id !== id), ...(value ? [{ id, value }] : [])]);
  }

  // The sites present in the list, for the site filter
  const sites = useMemo(() => {
    const byId = new Map<string, string>();
    for (const b of boards) byId.set(b.siteId, b.siteName);
    return [...byId].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name));
  }, [boards]);

  const columns = useMemo<ColumnDef<BoardSummary>[]>(() => {
    const list: ColumnDef<BoardSummary>[] = [
      {
        id: 'name',
        accessorKey: 'name',
        header: 'Board',
        sortingFn: byText,
        meta: { card: 'title' },
        cell: ({ row }) => (
          <Link
            href={`/boards/${row.original.id}`}
            className="font-medium text-ink underline-offset-4 hover:text-copper-dark hover:underline"
          >
            {row.original.name}
          </Link>
        ),
      },
      {
        id: 'site',
        accessorFn: (b) => b.siteName,
        header: 'Site',
        sortingFn: byText,
        // Filters on the site's id; sorts and shows its name
        filterFn: (row, _id, value: string) => row.original.siteId === value,
        meta: { card: 'sub' },
        cell: ({ row }) => (
          <Link
            href={`/sites/${row.original.siteId}`}
            className="text-ink-soft underline-offset-4 hover:text-ink hover:underline"
          >
            {row.original.siteName}
          </Link>
        ),
      },
      {
        id: 'location',
        accessorKey: 'location',
        header: 'Location',
        sortingFn: byText,
        meta: { card: 'sub' },
        cell: textOrDash('text-ink-soft'),
      },
      {
        id: 'phases',
        accessorKey: 'phases',
        header: 'Phases',
        cell: ({ row }) => (row.original.phases === 3 ? 'Three-phase' : 'Single-phase'),
      },
      {
        id: 'ways',
        accessorKey: 'wayCount',
        header: 'Ways',
        sortDescFirst: true,
        // The same words as the editor's summary and the schedule (counts.ts)
        cell: ({ row }) => countWords(row.original.counts),
      },
      {
        id: 'status',
        accessorKey: 'status',
        header: 'Stage',
        sortingFn: (a, b) => stageOrder(a.original.status) - stageOrder(b.original.status),
        filterFn: (row, _id, value: string) => row.original.status === value,
        meta: { card: 'badge' },
        cell: ({ row }) => (
          <span className="inline-flex flex-wrap items-center gap-1">
            <StatusBadge status={row.original.status} />
            {row.original.archivedAt ? <ArchivedBadge /> : null}
          </span>
        ),
      },
      {
        id: 'revision',
        accessorKey: 'revision',
        header: 'Rev.',
        sortDescFirst: true,
        meta: { align: 'right' },
      },
      lastChangeColumn(),
    ];
    if (canEdit) list.push(actionsColumn('Rename', onRename, onDelete, removeLabelOf));
    return list;
  }, [canEdit, onRename, onDelete, removeLabelOf]);

  const table = useReactTable({
    data: boards,
    columns,
    state: {
      sorting,
      globalFilter: search,
      columnFilters: filters,
      columnVisibility: { site: !singleSite },
    },
    onSortingChange: setSorting,
    onGlobalFilterChange: setSearch,
    onColumnFiltersChange: setFilters,
    globalFilterFn: (row, _columnId, value: string) => matchesSearch(row.original, value),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const shown = table.getRowModel().rows.length;
  const filtered = Boolean(search.trim() || statusFilter || siteFilter);
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <TableSearch
          label="Search boards"
          placeholder="Search by board, site or location"
          value={search}
          onChange={setSearch}
        />
        <Select
          aria-label="Stage"
          className={selectClass}
          value={statusFilter}
          onChange={(event) => setFilter('status', event.target.value)}
        >
          <option value="">Every stage</option>
          {BOARD_STAGES.map((s) => (
            <option key={s.value} value={s.value}>
              {s.label}
            </option>
          ))}
        </Select>
        {!singleSite ? (
          <Select
            aria-label="Site"
            className={selectClass}
            value={siteFilter}
            onChange={(event) => setFilter('site', event.target.value)}
          >
            <option value="">Every site</option>
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </Select>
        ) : null}
        {filtered ? (
          <Button
            variant="quiet"
            size="sm"
            onClick={() => {
              setSearch('');
              setFilters([]);
            }}
          >
            Clear filters
          </Button>
        ) : null}
        {!loading ? (
          <RowCount
            shown={shown}
            total={boards.length}
            one="board"
            many="boards"
            className="ml-auto text-sm text-ink-soft"
          />
        ) : null}
      </div>
      <DataTable
        table={table}
        caption="Boards"
        loading={loading}
        phoneCards
        noMatch="No board matches these filters."
      />
    </div>
  );
}
