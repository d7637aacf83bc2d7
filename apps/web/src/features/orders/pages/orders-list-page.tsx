import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import { Plus, ShoppingCart } from 'lucide-react';
import {
  orderSortFields,
  orderStatuses,
  orderStatusSchema,
  type OrderSummary,
} from '@lotwise/shared';
import { buttonClasses } from '../../../components/ui/button';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { ServerTable } from '../../../components/ui/server-table';
import { paths } from '../../../config/paths';
import { useCan } from '../../../lib/auth';
import { formatDate } from '../../../lib/format';
import { useListSearchParams } from '../../../lib/list-search-params';
import { useOrders, type OrderListParams } from '../api';
import { money, OrderStatusBadge, orderStatusLooks } from '../labels';

const column = createColumnHelper<ServerTableFeatures, OrderSummary>();

const columns = column.columns([
  column.accessor('title', {
    header: 'Order',
    cell: ({ row }) => (
      <span>
        <Link
          to={paths.order(row.original.id)}
          className="font-medium text-accent-700 underline-offset-2 hover:underline"
        >
          {row.original.title}
        </Link>
        <span className="block text-xs text-ink-600">{row.original.supplier.name}</span>
      </span>
    ),
  }),
  column.accessor('status', {
    header: 'Status',
    cell: ({ row }) => (
      <OrderStatusBadge status={row.original.status} claimsClosedAt={row.original.claimsClosedAt} />
    ),
  }),
  column.accessor('claimDeadline', {
    header: 'Claims until',
    cell: ({ getValue }) => <span className="whitespace-nowrap">{formatDate(getValue())}</span>,
  }),
  column.display({
    id: 'total',
    header: 'Total',
    meta: { align: 'right' },
    cell: ({ row }) => money(row.original.totalMinor, row.original.currency),
  }),
  column.display({
    id: 'mine',
    header: 'Your share',
    meta: { align: 'right' },
    cell: ({ row }) => {
      const { mine, currency } = row.original;
      if (mine.shareCount === 0) return <span className="text-ink-600">—</span>;
      return (
        <span className="whitespace-nowrap">
          {money(mine.amountMinor, currency)}
          <span className="block text-xs text-ink-600">
            {!mine.amountFixed
              ? 'estimate'
              : mine.owedMinor > 0
                ? `${money(mine.owedMinor, currency)} to pay`
                : 'nothing to pay'}
          </span>
        </span>
      );
    },
  }),
]);

const sortValues = orderSortFields.flatMap((field) => [`${field}.asc`, `${field}.desc`]);
const filterKeys = ['status'] as const;

export function OrdersListPage() {
  const { params, update } = useListSearchParams<(typeof filterKeys)[number]>({
    defaultSort: 'createdAt.desc',
    sortValues,
    filterKeys,
  });
  const status = orderStatusSchema.safeParse(params.filters.status);
  const query: OrderListParams = {
    q: params.q,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
    status: status.success ? status.data : undefined,
  };
  const orders = useOrders(query);
  const mayManage = useCan('orders.manage');
  const navigate = useNavigate();

  return (
    <div className="flex flex-col gap-5">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div className="max-w-3xl">
          <h1 className="text-xl font-semibold text-ink-900">Shared orders</h1>
          <p className="text-sm text-ink-600">
            Small purchases pooled into one order: claim what you need, the shipping and
            hazardous-goods fees are shared, and everyone pays their part.
          </p>
        </div>
        {mayManage && (
          <Link to={paths.orderNew} className={buttonClasses('primary')}>
            <Plus aria-hidden="true" className="size-4" />
            New order
          </Link>
        )}
      </header>
      <div className="flex flex-col items-start gap-1">
        <label htmlFor="orders-status" className="text-sm font-medium text-ink-800">
          Status
        </label>
        <div className="w-56">
          <Select
            id="orders-status"
            value={query.status ?? ''}
            onChange={(event) => update({ filters: { status: event.target.value || undefined } })}
          >
            <option value="">Any status</option>
            {orderStatuses.map((value) => (
              <option key={value} value={value}>
                {orderStatusLooks[value].label}
              </option>
            ))}
          </Select>
        </div>
      </div>
      {orders.isError ? (
        <ErrorState
          title="The orders could not be loaded"
          error={orders.error}
          onRetry={() => void orders.refetch()}
        />
      ) : (
        <ServerTable
          columns={columns}
          getRowId={(row) => String(row.id)}
          rows={orders.data?.items}
          total={orders.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          loading={orders.isPending}
          refreshing={orders.isPlaceholderData}
          label="Shared orders"
          noun={['order', 'orders']}
          onRowActivate={(row) => navigate(paths.order(row.original.id))}
          empty={
            <EmptyState icon={<ShoppingCart />} title="No shared orders">
              {mayManage
                ? 'Start one with “New order”.'
                : 'When a coordinator opens an order, it shows here.'}
            </EmptyState>
          }
        />
      )}
    </div>
  );
}
