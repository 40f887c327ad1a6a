'use client';

import {
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';
import Link from 'next/link';
import { useMemo, useState } from 'react';

import { byText, DataTable, TableSearch } from '@/components/ui/data-table';
import { actionsColumn, lastChangeColumn, RowCount, textOrDash } from '@/components/ui/table-columns';
import type { SiteSummary } from '@/lib/sites/types';

type SitesTableProps = {
  sites: SiteSummary[];
  loading?: boolean;
  canEdit: boolean;
  onRename: (site: SiteSummary) => void;
  onDelete: (site: SiteSummary) => void;
  /** The word on a row's remove button (default "Archive"), null for none. */
  removeLabelOf?: (site: SiteSummary) => string | null;
};

/** Searches a site's name, client and address. */
function matchesSearch(site: SiteSummary, query: string): boolean {
  const needle = query.trim().toLowerCase();
  if (!needle) return true;
  return [site.name, site.client, site.address].some((v) => v.toLowerCase().includes(needle));
}

/** The organisation's sites: sortable by every column, searchable, editable by editors. */
export function SitesTable({ sites, loading, canEdit, onRename, onDelete, removeLabelOf }: SitesTableProps) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const [search, setSearch] = useState('');

  const columns = useMemo<ColumnDef<SiteSummary>[]>(() => {
    const base: ColumnDef<SiteSummary>[] = [
      {
        id: 'name',
        accessorKey: 'name',
        header: 'Site',
        sortingFn: byText,
        meta: { card: 'title' },
        cell: ({ row }) => (
          <Link
            href={`/sites/${row.original.id}`}
            className="font-medium text-ink underline-offset-4 hover:text-copper-dark hover:underline"
          >
            {row.original.name}
          </Link>
        ),
      },
      {
        id: 'client',
        accessorKey: 'client',
        header: 'Client',
        sortingFn: byText,
        meta: { card: 'sub' },
        cell: textOrDash(),
      },
      {
        id: 'address',
        accessorKey: 'address',
        header: 'Address',
        sortingFn: byText,
        meta: { className: 'max-w-[22rem]' },
        cell: textOrDash('line-clamp-2 text-ink-soft'),
      },
      {
        id: 'boards',
        accessorKey: 'boardCount',
        header: 'Boards',
        sortDescFirst: true,
        meta: { align: 'right' },
      },
      lastChangeColumn(),
    ];
    if (!canEdit) return base;
    return [...base, actionsColumn('Edit', onRename, onDelete, removeLabelOf ?? (() => 'Archive'))];
  }, [canEdit, onRename, onDelete, removeLabelOf]);

  const table = useReactTable({
    data: sites,
    columns,
    state: { sorting, globalFilter: search },
    onSortingChange: setSorting,
    onGlobalFilterChange: setSearch,
    globalFilterFn: (row, _columnId, value: string) => matchesSearch(row.original, value),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const shown = table.getRowModel().rows.length;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <TableSearch
          label="Search sites"
          placeholder="Search by site, client or address"
          value={search}
          onChange={setSearch}
        />
        {!loading ? <RowCount shown={shown} total={sites.length} one="site" many="sites" /> : null}
      </div>
      <DataTable
        table={table}
        caption="Sites"
        loading={loading}
        phoneCards
        noMatch={`No site matches “${search.trim()}”.`}
      />
    </div>
  );
}
