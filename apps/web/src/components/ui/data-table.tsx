import type { MouseEvent, ReactNode } from 'react';
import {
  rowPaginationFeature,
  rowSortingFeature,
  tableFeatures,
  type ReactTable,
  type Row,
  type RowData,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import { cn } from '../../lib/cn';
import { SkeletonRows } from './spinner';
import { TableScroll } from './table-scroll';

/** How a column lays itself out; set per column through `meta`. */
export interface ColumnLayout {
  align?: 'left' | 'right';
  /** Width hint for the header cell, e.g. `w-32`. */
  width?: string;
}

/**
 * The feature set of every server-backed list: the server sorts and pages, the table holds
 * the state and renders. No client row models are registered, so nothing is sorted or
 * sliced on the page by accident.
 */
export const serverTableFeatures = tableFeatures({
  rowSortingFeature,
  rowPaginationFeature,
  columnMeta: {} as ColumnLayout,
});
export type ServerTableFeatures = typeof serverTableFeatures;

interface DataTableProps<TData extends RowData> {
  table: ReactTable<ServerTableFeatures, TData>;
  /** Accessible name of the table. */
  label: string;
  /** First load: shows skeleton rows. */
  loading?: boolean;
  /** A newer page is on its way while the previous one stays visible. */
  refreshing?: boolean;
  /**
   * Mouse click anywhere on a row. Keyboard users reach the same place through the link the
   * row's first cell must hold, so each row is one tab stop.
   */
  onRowActivate?: (row: Row<ServerTableFeatures, TData>) => void;
  empty?: ReactNode;
  /** `top` for rows with several lines (the default), `middle` for rows of controls. */
  rowAlign?: 'top' | 'middle';
}

const sortLabels = { asc: 'ascending', desc: 'descending' } as const;

/** Renders a TanStack table as a semantic, keyboard-usable HTML table. */
export function DataTable<TData extends RowData>({
  table,
  label,
  loading,
  refreshing,
  onRowActivate,
  empty,
  rowAlign = 'top',
}: DataTableProps<TData>) {
  const rows = table.getRowModel().rows;
  const columnCount = table.getAllLeafColumns().length;

  function handleRowClick(
    event: MouseEvent<HTMLTableRowElement>,
    row: Row<ServerTableFeatures, TData>,
  ) {
    // Let links, buttons and form controls inside the row do their own thing.
    if ((event.target as Element).closest('a, button, input, select, label')) return;
    onRowActivate?.(row);
  }

  return (
    <TableScroll label={label} className="rounded-lg border border-ink-200 bg-white">
      <table
        aria-label={label}
        aria-busy={loading || refreshing || undefined}
        className="w-full border-collapse text-sm"
      >
        <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const meta = header.column.columnDef.meta;
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                const alignRight = meta?.align === 'right';
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted ? sortLabels[sorted] : canSort ? 'none' : undefined}
                    className={cn(
                      'px-2.5 py-2 font-semibold whitespace-nowrap',
                      alignRight && 'text-right',
                      meta?.width,
                    )}
                  >
                    {header.isPlaceholder ? null : canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className={cn(
                          'inline-flex items-center gap-1 rounded uppercase hover:text-ink-900',
                          alignRight && 'flex-row-reverse',
                          sorted && 'text-ink-900',
                        )}
                      >
                        <table.FlexRender header={header} />
                        {sorted === 'asc' ? (
                          <ArrowUp aria-hidden="true" className="size-3.5" />
                        ) : sorted === 'desc' ? (
                          <ArrowDown aria-hidden="true" className="size-3.5" />
                        ) : (
                          <ArrowUpDown aria-hidden="true" className="size-3.5 text-ink-400" />
                        )}
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className={cn(refreshing && 'opacity-60 transition-opacity')}>
          {loading ? (
            <SkeletonRows columns={columnCount} />
          ) : rows.length === 0 ? (
            <tr>
              <td colSpan={columnCount}>{empty}</td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr
                key={row.id}
                onClick={onRowActivate ? (event) => handleRowClick(event, row) : undefined}
                className={cn(
                  'border-b border-ink-100 last:border-b-0',
                  rowAlign === 'top' ? 'align-top' : 'align-middle',
                  onRowActivate && 'cursor-pointer hover:bg-accent-50/60',
                )}
              >
                {row.getAllCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={cn(
                      'px-2.5 py-2.5',
                      cell.column.columnDef.meta?.align === 'right' && 'text-right tabular-nums',
                    )}
                  >
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </TableScroll>
  );
}
