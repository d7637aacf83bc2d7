import type { ReactNode } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { Ban, Pencil, Scissors, TriangleAlert } from 'lucide-react';
import type { CatalogItem } from '@lotwise/shared';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { ServerTable } from '../../../components/ui/server-table';
import type { ServerTableState } from '../../../components/ui/use-server-table';
import { formatAmount, formatPercent } from '../../../lib/format';
import { moneyText } from '../money';

const column = createColumnHelper<ServerTableFeatures, CatalogItem>();

function columnsFor(onEdit: ((item: CatalogItem) => void) | null) {
  return column.columns([
    column.accessor('sku', {
      header: 'SKU',
      cell: ({ getValue }) => (
        <span className="font-mono text-xs whitespace-nowrap">{getValue()}</span>
      ),
    }),
    column.accessor((item) => item.chemical.name, {
      id: 'chemical',
      header: 'Chemical',
      cell: ({ row }) => (
        <div className="min-w-40">
          <p className="font-medium text-ink-900">{row.original.chemical.name}</p>
          <p className="text-xs text-ink-600 tabular-nums">
            {row.original.chemical.casNumber
              ? `CAS RN ${row.original.chemical.casNumber}`
              : 'No CAS RN'}
          </p>
        </div>
      ),
    }),
    column.display({
      id: 'hazards',
      header: 'Hazards',
      cell: ({ row }) => (
        <HazardCodes
          pictograms={row.original.chemical.ghsPictograms}
          statements={row.original.chemical.hazardStatements}
        />
      ),
    }),
    column.accessor('packSize', {
      header: 'Pack',
      meta: { align: 'right' },
      cell: ({ row }) => (
        <span className="whitespace-nowrap tabular-nums">
          {formatAmount(row.original.packSize, row.original.packUnit)}
        </span>
      ),
    }),
    column.display({
      id: 'grade',
      header: 'Grade, purity',
      cell: ({ row }) => (
        <span className="text-sm">
          {row.original.grade ?? '—'}
          {row.original.purityPercent !== null && (
            <span className="text-ink-600 tabular-nums">
              , {formatPercent(row.original.purityPercent)}
            </span>
          )}
        </span>
      ),
    }),
    column.accessor('priceMinor', {
      id: 'price',
      header: 'Price per pack',
      meta: { align: 'right' },
      cell: ({ row }) => (
        <span className="font-medium whitespace-nowrap tabular-nums">
          {moneyText(row.original.priceMinor, row.original.currency)}
        </span>
      ),
    }),
    column.display({
      id: 'flags',
      header: 'Shipping and sharing',
      cell: ({ row }) => (
        <div className="flex flex-col items-start gap-1">
          {row.original.hazardous && (
            <Badge tone="warn" icon={<TriangleAlert aria-hidden="true" />}>
              Hazardous goods
            </Badge>
          )}
          {row.original.splittable && (
            <Badge icon={<Scissors aria-hidden="true" />}>Part packs allowed</Badge>
          )}
          {row.original.discontinued && (
            <Badge tone="danger" icon={<Ban aria-hidden="true" />}>
              Discontinued
            </Badge>
          )}
          {!row.original.hazardous && !row.original.splittable && !row.original.discontinued && (
            <span className="text-xs text-ink-600">Whole packs, ordinary shipping</span>
          )}
        </div>
      ),
    }),
    ...(onEdit
      ? [
          column.display({
            id: 'actions',
            header: () => <span className="sr-only">Actions</span>,
            cell: ({ row }) => (
              <Button
                size="sm"
                variant="ghost"
                icon={<Pencil aria-hidden="true" className="size-4" />}
                onClick={() => onEdit(row.original)}
                aria-label={`Edit ${row.original.sku} (${row.original.chemical.name})`}
              >
                Edit
              </Button>
            ),
          }),
        ]
      : []),
  ]);
}

interface CatalogTableProps extends ServerTableState<CatalogItem> {
  loading: boolean;
  refreshing: boolean;
  empty: ReactNode;
  /** Null when the reader may not change the catalogue. */
  onEdit: ((item: CatalogItem) => void) | null;
}

/** A supplier's catalogue: each pack with its chemical's hazards and its price. */
export function CatalogTable({ loading, refreshing, empty, onEdit, ...list }: CatalogTableProps) {
  return (
    <ServerTable
      {...list}
      columns={columnsFor(onEdit)}
      getRowId={(item) => String(item.id)}
      loading={loading}
      refreshing={refreshing}
      label="Catalogue"
      noun={['item', 'items']}
      empty={empty}
    />
  );
}
