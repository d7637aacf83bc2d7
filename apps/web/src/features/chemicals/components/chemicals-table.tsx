import type { ReactNode } from 'react';
import {
  functionalUpdate,
  useTable,
  createColumnHelper,
  type PaginationState,
  type SortingState,
  type Updater,
} from '@tanstack/react-table';
import { Link, useNavigate } from 'react-router';
import { Lock } from 'lucide-react';
import { hazardStatementTexts, parseSort, type Chemical } from '@lotwise/shared';
import { Formula } from '../../../components/chem/formula';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { Badge } from '../../../components/ui/badge';
import {
  DataTable,
  serverTableFeatures,
  type ServerTableFeatures,
} from '../../../components/ui/data-table';
import { Pagination } from '../../../components/ui/pagination';
import { formatAmount, formatMolarMass } from '../../../lib/format';
import { paths } from '../../../config/paths';

const column = createColumnHelper<ServerTableFeatures, Chemical>();

const columns = column.columns([
  column.accessor('name', {
    header: 'Name',
    cell: ({ row }) => {
      const chemical = row.original;
      return (
        <div className="max-w-60 min-w-40">
          <Link
            to={paths.chemical(chemical.id)}
            className="font-medium text-accent-700 underline-offset-2 hover:underline"
          >
            {chemical.name}
          </Link>
          {chemical.restricted && (
            <Badge
              tone="warn"
              icon={<Lock aria-hidden="true" />}
              className="ml-2 align-text-bottom"
            >
              Restricted
            </Badge>
          )}
          {chemical.synonyms.length > 0 && (
            <p className="truncate text-xs text-ink-600" title={chemical.synonyms.join('; ')}>
              {chemical.synonyms.join('; ')}
            </p>
          )}
        </div>
      );
    },
  }),
  column.accessor('formula', {
    header: 'Formula',
    cell: ({ getValue }) => <Formula value={getValue()} />,
  }),
  column.accessor('casNumber', {
    header: 'CAS RN',
    cell: ({ getValue }) => (
      <span className="whitespace-nowrap tabular-nums">{getValue() ?? '—'}</span>
    ),
  }),
  column.accessor('molarMass', {
    header: 'Molar mass',
    meta: { align: 'right' },
    cell: ({ getValue }) => (
      <span className="whitespace-nowrap">{formatMolarMass(getValue())}</span>
    ),
  }),
  column.accessor('storageGroup', {
    header: 'Storage group',
    cell: ({ getValue }) => <StorageGroupLabel group={getValue()} />,
  }),
  column.display({
    id: 'hazards',
    header: 'Hazards',
    enableSorting: false,
    cell: ({ row }) => {
      const { ghsPictograms, hazardStatements } = row.original;
      return (
        <div className="flex max-w-56 min-w-44 flex-col gap-1">
          <PictogramList codes={ghsPictograms} />
          {hazardStatements.length > 0 && (
            <p className="text-xs text-ink-600 tabular-nums">
              {hazardStatements.map((code, index) => (
                <span key={code}>
                  {index > 0 && ' '}
                  <abbr title={hazardStatementTexts[code] ?? 'See SDS'} className="no-underline">
                    {code}
                  </abbr>
                </span>
              ))}
            </p>
          )}
        </div>
      );
    },
  }),
  column.accessor('reorderPoint', {
    header: 'Reorder point',
    enableSorting: false,
    meta: { align: 'right' },
    cell: ({ row }) => (
      <span className="whitespace-nowrap">
        {formatAmount(row.original.reorderPoint, row.original.stockUnit)}
      </span>
    ),
  }),
]);

const noRows: Chemical[] = [];

interface ChemicalsTableProps {
  rows: Chemical[] | undefined;
  total: number;
  sort: string;
  page: number;
  pageSize: number;
  loading: boolean;
  refreshing: boolean;
  onSortChange: (sort: string) => void;
  onPageChange: (page: number) => void;
  onPageSizeChange: (pageSize: number) => void;
  empty: ReactNode;
}

/** The chemicals of one page, sorted and paged by the server; state lives in the URL. */
export function ChemicalsTable({
  rows,
  total,
  sort,
  page,
  pageSize,
  loading,
  refreshing,
  onSortChange,
  onPageChange,
  onPageSizeChange,
  empty,
}: ChemicalsTableProps) {
  const navigate = useNavigate();
  const { field, direction } = parseSort(sort);
  const sorting: SortingState = [{ id: field, desc: direction === 'desc' }];
  const pagination: PaginationState = { pageIndex: page - 1, pageSize };

  const table = useTable({
    features: serverTableFeatures,
    columns,
    data: rows ?? noRows,
    getRowId: (chemical) => String(chemical.id),
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    rowCount: total,
    state: { sorting, pagination },
    onSortingChange: (updater: Updater<SortingState>) => {
      const next = functionalUpdate(updater, sorting)[0];
      if (next) onSortChange(`${next.id}.${next.desc ? 'desc' : 'asc'}`);
    },
    onPaginationChange: (updater: Updater<PaginationState>) => {
      const next = functionalUpdate(updater, pagination);
      if (next.pageSize !== pageSize) onPageSizeChange(next.pageSize);
      else if (next.pageIndex !== pagination.pageIndex) onPageChange(next.pageIndex + 1);
    },
  });

  return (
    <div>
      <DataTable
        table={table}
        label="Chemicals"
        loading={loading}
        refreshing={refreshing}
        empty={empty}
        onRowActivate={(row) => navigate(paths.chemical(row.original.id))}
      />
      {total > 0 && (
        <Pagination
          page={page}
          pageCount={table.getPageCount()}
          pageSize={pageSize}
          total={total}
          noun={total === 1 ? 'chemical' : 'chemicals'}
          onPageChange={(next) => table.setPageIndex(next - 1)}
          onPageSizeChange={(next) => table.setPageSize(next)}
        />
      )}
    </div>
  );
}
