import type { ReactNode } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { Link, useNavigate } from 'react-router';
import { Lock } from 'lucide-react';
import { hazardStatementTexts, type Chemical } from '@lotwise/shared';
import { Formula } from '../../../components/chem/formula';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { WatchListBadges } from '../../../components/hazards/watch-list-badges';
import { Badge } from '../../../components/ui/badge';
import { DataTable, type ServerTableFeatures } from '../../../components/ui/data-table';
import { Pagination } from '../../../components/ui/pagination';
import { useServerTable, type ServerTableState } from '../../../components/ui/use-server-table';
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
          <WatchListBadges listings={row.original.watchListings} />
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

interface ChemicalsTableProps extends ServerTableState<Chemical> {
  loading: boolean;
  refreshing: boolean;
  empty: ReactNode;
}

/** The chemicals of one page, sorted and paged by the server; state lives in the URL. */
export function ChemicalsTable({ loading, refreshing, empty, ...list }: ChemicalsTableProps) {
  const navigate = useNavigate();

  const table = useServerTable(columns, (chemical) => String(chemical.id), list);

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
      {list.total > 0 && (
        <Pagination
          page={list.page}
          pageCount={table.getPageCount()}
          pageSize={list.pageSize}
          total={list.total}
          noun={list.total === 1 ? 'chemical' : 'chemicals'}
          onPageChange={(next) => table.setPageIndex(next - 1)}
          onPageSizeChange={(next) => table.setPageSize(next)}
        />
      )}
    </div>
  );
}
