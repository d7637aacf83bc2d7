import type { ReactNode } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { Link, useNavigate } from 'react-router';
import { Archive } from 'lucide-react';
import type { Supplier } from '@lotwise/shared';
import { Badge } from '../../../components/ui/badge';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { ServerTable } from '../../../components/ui/server-table';
import type { ServerTableState } from '../../../components/ui/use-server-table';
import { formatCount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { moneyText } from '../money';

const column = createColumnHelper<ServerTableFeatures, Supplier>();

const money = (minor: number, currency: string, none?: string) => (
  <span className="whitespace-nowrap tabular-nums">
    {minor === 0 && none ? none : moneyText(minor, currency)}
  </span>
);

const columns = column.columns([
  column.accessor('name', {
    header: 'Supplier',
    cell: ({ row }) => (
      <div className="min-w-44">
        <Link
          to={paths.supplier(row.original.id)}
          className="font-medium text-accent-700 underline-offset-2 hover:underline"
        >
          {row.original.name}
        </Link>
        {row.original.archived && (
          <Badge icon={<Archive aria-hidden="true" />} className="ml-2 align-text-bottom">
            Archived
          </Badge>
        )}
      </div>
    ),
  }),
  column.display({
    id: 'contact',
    header: 'Contact',
    cell: ({ row }) => (
      <div className="text-sm">
        <p>{row.original.contactName || '—'}</p>
        {row.original.email && <p className="text-xs text-ink-600">{row.original.email}</p>}
      </div>
    ),
  }),
  column.display({
    id: 'minimumOrder',
    header: 'Minimum order',
    meta: { align: 'right' },
    cell: ({ row }) => money(row.original.minimumOrderMinor, row.original.currency, 'None'),
  }),
  column.display({
    id: 'shipping',
    header: 'Shipping fee',
    meta: { align: 'right' },
    cell: ({ row }) => money(row.original.shippingFeeMinor, row.original.currency),
  }),
  column.display({
    id: 'hazardous',
    header: 'Hazardous-goods fee',
    meta: { align: 'right' },
    cell: ({ row }) => money(row.original.hazardousFeeMinor, row.original.currency),
  }),
  column.display({
    id: 'items',
    header: 'Items sold',
    meta: { align: 'right' },
    cell: ({ row }) => (
      <span className="tabular-nums">{formatCount(row.original.catalogItemCount)}</span>
    ),
  }),
]);

interface SuppliersTableProps extends ServerTableState<Supplier> {
  loading: boolean;
  refreshing: boolean;
  empty: ReactNode;
}

/** One page of suppliers, sorted and paged by the server. */
export function SuppliersTable({ loading, refreshing, empty, ...list }: SuppliersTableProps) {
  const navigate = useNavigate();
  return (
    <ServerTable
      {...list}
      columns={columns}
      getRowId={(supplier) => String(supplier.id)}
      loading={loading}
      refreshing={refreshing}
      label="Suppliers"
      noun={['supplier', 'suppliers']}
      onRowActivate={(row) => void navigate(paths.supplier(row.original.id))}
      empty={empty}
    />
  );
}
