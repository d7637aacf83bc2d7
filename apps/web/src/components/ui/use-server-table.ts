import {
  functionalUpdate,
  useTable,
  type ColumnDef,
  type PaginationState,
  type RowData,
  type SortingState,
  type Updater,
} from '@tanstack/react-table';
import { parseSort } from '@lotwise/shared';
import { serverTableFeatures, type ServerTableFeatures } from './data-table';

/** The list state a server-backed table shows; it lives in the URL, not in the table. */
export interface ServerTableState<TData> {
  rows: TData[] | undefined;
  total: number;
  /** `field.asc` or `field.desc`. */
  sort: string;
  page: number;
  pageSize: number;
  onSortChange: (sort: string) => void;
  onPageChange: (page: number) => void;
  onPageSizeChange: (pageSize: number) => void;
}

const noRows: never[] = [];

/**
 * A TanStack table whose sorting and paging are done by the server: it mirrors the given
 * state and reports changes, never sorting or slicing rows itself.
 */
export function useServerTable<TData extends RowData>(
  columns: ColumnDef<ServerTableFeatures, TData>[],
  getRowId: (row: TData) => string,
  state: ServerTableState<TData>,
) {
  const { field, direction } = parseSort(state.sort);
  const sorting: SortingState = [{ id: field, desc: direction === 'desc' }];
  const pagination: PaginationState = { pageIndex: state.page - 1, pageSize: state.pageSize };

  return useTable({
    features: serverTableFeatures,
    columns,
    data: state.rows ?? noRows,
    getRowId,
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    rowCount: state.total,
    state: { sorting, pagination },
    onSortingChange: (updater: Updater<SortingState>) => {
      const next = functionalUpdate(updater, sorting)[0];
      if (next) state.onSortChange(`${next.id}.${next.desc ? 'desc' : 'asc'}`);
    },
    onPaginationChange: (updater: Updater<PaginationState>) => {
      const next = functionalUpdate(updater, pagination);
      if (next.pageSize !== state.pageSize) state.onPageSizeChange(next.pageSize);
      else if (next.pageIndex !== pagination.pageIndex) state.onPageChange(next.pageIndex + 1);
    },
  });
}
