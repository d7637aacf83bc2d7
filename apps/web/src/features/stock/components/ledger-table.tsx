import { useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { History } from 'lucide-react';
import type { LedgerEntry } from '@lotwise/shared';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { ServerTable } from '../../../components/ui/server-table';
import { cn } from '../../../lib/cn';
import { formatAmount, formatDateTime } from '../../../lib/format';
import { useLedger } from '../api';
import { ledgerReasonLooks } from '../labels';

const column = createColumnHelper<ServerTableFeatures, LedgerEntry>();

/** "+250.00 g", "−12.30 g", "±0.00 g" for a move. */
export function signedAmount(value: number, unit: string): string {
  const size = formatAmount(Math.abs(value), unit);
  if (value > 0) return `+${size}`;
  if (value < 0) return `−${size}`;
  return `±${size}`;
}

const columns = column.columns([
  column.accessor('createdAt', {
    header: 'When',
    enableSorting: false,
    cell: ({ getValue }) => (
      <span className="whitespace-nowrap tabular-nums">{formatDateTime(getValue())}</span>
    ),
  }),
  column.accessor((entry) => entry.user?.displayName ?? '', {
    id: 'user',
    header: 'Who',
    enableSorting: false,
    cell: ({ row }) =>
      row.original.user?.displayName ?? <span className="text-ink-600">Lotwise</span>,
  }),
  column.accessor('reason', {
    header: 'What',
    enableSorting: false,
    cell: ({ getValue }) => {
      const look = ledgerReasonLooks[getValue()];
      const Icon = look.icon;
      return (
        <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
          <Icon aria-hidden="true" className="size-4 text-ink-600" />
          {look.label}
        </span>
      );
    },
  }),
  column.accessor('quantity', {
    header: 'Change',
    enableSorting: false,
    meta: { align: 'right' },
    cell: ({ row }) => (
      <span
        className={cn(
          'whitespace-nowrap',
          row.original.quantity < 0 ? 'text-ink-900' : 'text-ok-700',
        )}
      >
        {signedAmount(row.original.quantity, row.original.unit)}
      </span>
    ),
  }),
  column.accessor('balanceAfter', {
    header: 'Balance after',
    enableSorting: false,
    meta: { align: 'right' },
    cell: ({ row }) => (
      <span className="font-semibold whitespace-nowrap">
        {formatAmount(row.original.balanceAfter, row.original.unit)}
      </span>
    ),
  }),
  column.accessor('note', {
    header: 'Note',
    enableSorting: false,
    cell: ({ getValue }) => <span className="text-ink-700">{getValue() || '—'}</span>,
  }),
]);

/** Every change to one container, newest first, as the server pages it. */
export function LedgerTable({ containerId }: { containerId: number }) {
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(10);
  const ledger = useLedger(containerId, page, pageSize);

  if (ledger.isError && !ledger.data) {
    return (
      <ErrorState
        title="The ledger could not be loaded"
        error={ledger.error}
        onRetry={() => void ledger.refetch()}
      />
    );
  }
  return (
    <ServerTable
      columns={columns}
      rows={ledger.data?.items}
      getRowId={(entry) => String(entry.id)}
      total={ledger.data?.total ?? 0}
      sort="createdAt.desc"
      onSortChange={() => {}}
      page={page}
      pageSize={pageSize}
      loading={ledger.isPending}
      refreshing={ledger.isPlaceholderData && ledger.isFetching}
      label="Ledger"
      noun={['entry', 'entries']}
      onPageChange={setPage}
      onPageSizeChange={(size) => {
        setPageSize(size);
        setPage(1);
      }}
      empty={<EmptyState icon={<History />} title="No ledger entries" />}
    />
  );
}
