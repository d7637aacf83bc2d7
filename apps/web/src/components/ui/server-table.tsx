import type { ReactNode } from 'react';
import type { ColumnDef, Row, RowData } from '@tanstack/react-table';
import { DataTable, type ServerTableFeatures } from './data-table';
import { Pagination } from './pagination';
import { useServerTable, type ServerTableState } from './use-server-table';

interface ServerTableProps<TData extends RowData> extends ServerTableState<TData> {
  columns: ColumnDef<ServerTableFeatures, TData>[];
  getRowId: (row: TData) => string;
  loading: boolean;
  refreshing: boolean;
  label: string;
  /** What the rows are: [one, many], e.g. ['container', 'containers']. */
  noun: [string, string];
  onRowActivate?: (row: Row<ServerTableFeatures, TData>) => void;
  empty: ReactNode;
}

/** A list sorted and paged by the server, drawn as {@link DataTable} with {@link Pagination}. */
export function ServerTable<TData extends RowData>({
  columns,
  getRowId,
  loading,
  refreshing,
  label,
  noun,
  onRowActivate,
  empty,
  ...list
}: ServerTableProps<TData>) {
  const table = useServerTable(columns, getRowId, list);
  return (
    <div>
      <DataTable
        table={table}
        label={label}
        loading={loading}
        refreshing={refreshing}
        empty={empty}
        onRowActivate={onRowActivate}
      />
      {list.total > 0 && (
        <Pagination
          page={list.page}
          pageCount={table.getPageCount()}
          pageSize={list.pageSize}
          total={list.total}
          noun={list.total === 1 ? noun[0] : noun[1]}
          onPageChange={(next) => table.setPageIndex(next - 1)}
          onPageSizeChange={(next) => table.setPageSize(next)}
        />
      )}
    </div>
  );
}
