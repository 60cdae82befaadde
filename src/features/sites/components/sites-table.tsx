import {
  flexRender,
  getCoreRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
  type Updater,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import { Link } from 'react-router-dom';

import { SITE_SORTS, type SiteListItem } from '@server/sites/schema';
import { paths, type SiteRole } from '@/config/paths';
import { UrnStatusBadge } from '@/features/sites/components/urn-status-badge';
import type { SiteListFilters } from '@/features/sites/utils/list-filters';
import { cn } from '@/utils/cn';
import { formatDateTime } from '@/utils/format';

type SiteSort = (typeof SITE_SORTS)[number];

const sortNames: Record<SiteSort, string> = {
  reference: 'reference',
  name: 'site name',
  town: 'town',
  postcode: 'postcode',
  requiredGrade: 'grade',
  updatedAt: 'last updated',
};

const isSiteSort = (value: string): value is SiteSort =>
  (SITE_SORTS as readonly string[]).includes(value);

function buildColumns(role: SiteRole): ColumnDef<SiteListItem>[] {
  return [
    {
      accessorKey: 'reference',
      header: 'Reference',
      cell: ({ row }) => (
        <span className="font-mono whitespace-nowrap">{row.original.reference}</span>
      ),
    },
    {
      accessorKey: 'name',
      header: 'Site',
      cell: ({ row }) => (
        <Link
          to={paths.sites.workspace.getHref(role, row.original.id)}
          className="font-semibold text-ink underline decoration-brass decoration-2 underline-offset-2"
        >
          {row.original.name}
        </Link>
      ),
    },
    { accessorKey: 'town', header: 'Town', cell: ({ row }) => row.original.town },
    {
      accessorKey: 'postcode',
      header: 'Postcode',
      cell: ({ row }) => <span className="whitespace-nowrap">{row.original.postcode}</span>,
    },
    {
      accessorKey: 'requiredGrade',
      header: 'Grade',
      cell: ({ row }) => <span className="font-mono">{row.original.requiredGrade}</span>,
    },
    {
      id: 'urnStatus',
      header: 'URN status',
      enableSorting: false,
      cell: ({ row }) => <UrnStatusBadge status={row.original.urnStatus} />,
    },
    {
      id: 'monitoringCentre',
      header: 'Monitoring',
      enableSorting: false,
      cell: ({ row }) =>
        row.original.monitoringCentre?.name ?? (
          <span className="text-ink-muted">Not monitored</span>
        ),
    },
    {
      id: 'zoneCount',
      header: 'Zones',
      enableSorting: false,
      cell: ({ row }) => <span className="font-mono">{row.original.zoneCount}</span>,
    },
    {
      id: 'engineers',
      header: 'Engineers',
      enableSorting: false,
      cell: ({ row }) =>
        row.original.engineers.length > 0 ? (
          row.original.engineers.map((engineer) => engineer.displayName).join(', ')
        ) : (
          <span className="text-ink-muted">None assigned</span>
        ),
    },
    {
      accessorKey: 'updatedAt',
      header: 'Last updated',
      cell: ({ row }) => (
        <span className="whitespace-nowrap">{formatDateTime(row.original.updatedAt)}</span>
      ),
    },
  ];
}

type SitesTableProps = {
  role: SiteRole;
  sites: readonly SiteListItem[];
  filters: SiteListFilters;
  onSortChange: (sort: SiteSort, order: 'asc' | 'desc') => void;
  /** A newer page is on its way: the rows shown are the previous ones. */
  isRefreshing: boolean;
};

/**
 * The company's sites, paged, sorted and filtered by the API (TanStack Table in manual mode): the
 * table only draws what the server chose, and sorting asks the page above to change the URL.
 */
export function SitesTable({ role, sites, filters, onSortChange, isRefreshing }: SitesTableProps) {
  const sorting: SortingState = [{ id: filters.sort, desc: filters.order === 'desc' }];

  const changeSorting = (updater: Updater<SortingState>) => {
    const next = typeof updater === 'function' ? updater(sorting) : updater;
    const [first] = next;
    // Clicking a sorted column a third time would clear sorting; the API always sorts by
    // something, so that click goes back to ascending instead.
    if (!first) return onSortChange(filters.sort, 'asc');
    if (isSiteSort(first.id)) onSortChange(first.id, first.desc ? 'desc' : 'asc');
  };

  // eslint-disable-next-line react-hooks/incompatible-library -- TanStack Table keeps its own state; this component is not memoised.
  const table = useReactTable({
    data: sites as SiteListItem[],
    columns: buildColumns(role),
    getCoreRowModel: getCoreRowModel(),
    getRowId: (site) => site.id,
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    enableMultiSort: false,
    enableSortingRemoval: false,
    sortDescFirst: false,
    state: { sorting },
    onSortingChange: changeSorting,
  });

  return (
    // Focusable so keyboard users can scroll the table sideways on a narrow screen.
    <div
      role="region"
      aria-label="Sites"
      tabIndex={0}
      aria-busy={isRefreshing}
      className={cn('relative overflow-x-auto', isRefreshing && 'opacity-70')}
    >
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">
          {`Sites, sorted by ${sortNames[filters.sort]}, ${filters.order === 'asc' ? 'ascending' : 'descending'}. Column headers with buttons change the order.`}
        </caption>
        <thead className="bg-paper-deep">
          {table.getHeaderGroups().map((headerGroup) => (
            <tr key={headerGroup.id}>
              {headerGroup.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const SortIcon =
                  sorted === 'asc' ? ArrowUp : sorted === 'desc' ? ArrowDown : ArrowUpDown;
                const label = flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={
                      sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined
                    }
                    className="px-3 py-2 font-semibold whitespace-nowrap"
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="-mx-1 inline-flex min-h-8 items-center gap-1 rounded px-1 font-semibold hover:bg-paper"
                      >
                        {label}
                        <SortIcon
                          aria-hidden="true"
                          className={cn('size-3.5', sorted ? 'text-ink' : 'text-ink-muted')}
                        />
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
        <tbody className="divide-y divide-hairline">
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="align-top hover:bg-paper">
              {row.getVisibleCells().map((cell) =>
                cell.column.id === 'name' ? (
                  <th key={cell.id} scope="row" className="px-3 py-1.5 text-left font-medium">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </th>
                ) : (
                  <td key={cell.id} className="px-3 py-1.5">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ),
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
