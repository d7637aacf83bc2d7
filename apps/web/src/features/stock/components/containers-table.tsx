import { useMemo, type ReactNode } from 'react';
import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import type { Container } from '@lotwise/shared';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { Checkbox } from '../../../components/ui/input';
import { ServerTable } from '../../../components/ui/server-table';
import { formatAmount, formatDate } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { ContainerStatusBadge, ExpiryText, PeroxideDueText } from '../labels';

const column = createColumnHelper<ServerTableFeatures, Container>();

/** "Lot DL-02585 · ACS reagent · supplier", whatever the lot says about itself. */
export function lotSummary(lot: Container['lot']): string {
  const parts = [
    lot.supplierLotNumber ? `Lot ${lot.supplierLotNumber}` : null,
    lot.grade,
    lot.source === 'prepared' ? 'made in-house' : lot.supplierName,
  ].filter(Boolean);
  return parts.length > 0 ? parts.join(' · ') : `Lot #${lot.id}`;
}

const columns = column.columns([
  column.accessor('labelCode', {
    header: 'Label code',
    cell: ({ row }) => (
      <Link
        to={paths.stockContainer(row.original.id)}
        className="font-mono font-medium whitespace-nowrap text-accent-700 underline-offset-2 hover:underline"
      >
        {row.original.labelCode}
      </Link>
    ),
  }),
  column.accessor((c) => c.chemical.name, {
    id: 'chemical',
    header: 'Chemical',
    cell: ({ row }) => (
      <div className="flex min-w-44 flex-col gap-1">
        <span className="font-medium text-ink-900">{row.original.chemical.name}</span>
        <HazardCodes
          pictograms={row.original.chemical.ghsPictograms}
          statements={row.original.chemical.hazardStatements}
        />
      </div>
    ),
  }),
  column.display({
    id: 'lot',
    header: 'Lot',
    cell: ({ row }) => {
      const { lot } = row.original;
      return (
        <span className="block min-w-28 text-ink-800">
          <span className="block whitespace-nowrap">
            {lot.supplierLotNumber ?? (lot.source === 'prepared' ? 'Made in-house' : `#${lot.id}`)}
          </span>
          {lot.grade && <span className="block text-xs text-ink-600">{lot.grade}</span>}
        </span>
      );
    },
  }),
  column.accessor((c) => c.location.path, {
    id: 'location',
    header: 'Location',
    cell: ({ row }) => (
      <div className="max-w-48 min-w-36">
        <Link
          to={paths.stockLocation(row.original.location.id)}
          className="block text-ink-800 underline-offset-2 hover:underline"
        >
          {row.original.location.path}
        </Link>
        {row.original.owner && (
          <span className="block text-xs text-ink-600">
            Belongs to {row.original.owner.displayName}
          </span>
        )}
      </div>
    ),
  }),
  column.accessor('quantity', {
    header: 'Quantity',
    meta: { align: 'right' },
    cell: ({ row }) => (
      <span className="font-semibold whitespace-nowrap text-ink-900">
        {formatAmount(row.original.quantity, row.original.unit)}
      </span>
    ),
  }),
  column.display({
    id: 'status',
    header: 'Status',
    cell: ({ row }) => (
      <span className="flex flex-col items-start gap-0.5">
        <ContainerStatusBadge status={row.original.status} />
        <span className="text-xs whitespace-nowrap text-ink-600 tabular-nums">
          {row.original.openedOn ? `opened ${formatDate(row.original.openedOn)}` : 'not opened'}
        </span>
      </span>
    ),
  }),
  column.accessor('expiresOn', {
    header: 'Expires on',
    cell: ({ row }) => (
      <ExpiryText expiresOn={row.original.expiresOn} expired={row.original.expired} />
    ),
  }),
  column.display({
    id: 'peroxide',
    header: 'Peroxide test',
    cell: ({ row }) => <PeroxideDueText peroxide={row.original.peroxide} />,
  }),
]);

/** Containers ticked in the list (kept across pages), and how to change the set. */
export interface ContainerSelection {
  selected: ReadonlySet<number>;
  onChange: (next: Set<number>) => void;
}

function selectionColumn({ selected, onChange }: ContainerSelection, rows: Container[]) {
  const pageIds = rows.map((c) => c.id);
  const allOnPage = pageIds.length > 0 && pageIds.every((id) => selected.has(id));
  const someOnPage = pageIds.some((id) => selected.has(id));
  return column.display({
    id: 'select',
    header: () => (
      <Checkbox
        aria-label={
          allOnPage ? 'Untick every container on this page' : 'Tick every container on this page'
        }
        checked={allOnPage}
        ref={(element) => {
          if (element) element.indeterminate = someOnPage && !allOnPage;
        }}
        onChange={() => {
          const next = new Set(selected);
          for (const id of pageIds) {
            if (allOnPage) next.delete(id);
            else next.add(id);
          }
          onChange(next);
        }}
      />
    ),
    cell: ({ row }) => (
      <Checkbox
        aria-label={`Tick ${row.original.labelCode}`}
        checked={selected.has(row.original.id)}
        onChange={() => {
          const next = new Set(selected);
          if (next.has(row.original.id)) next.delete(row.original.id);
          else next.add(row.original.id);
          onChange(next);
        }}
      />
    ),
  });
}

interface ContainersTableProps {
  rows: Container[] | undefined;
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
  label?: string;
  /** Adds a first column of tick boxes (for printing labels of several containers). */
  selection?: ContainerSelection;
}

export function ContainersTable({
  label = 'Containers',
  selection,
  ...props
}: ContainersTableProps) {
  const navigate = useNavigate();
  const rows = props.rows;
  const withSelection = useMemo(
    () => (selection ? [selectionColumn(selection, rows ?? []), ...columns] : columns),
    [selection, rows],
  );
  return (
    <ServerTable
      {...props}
      columns={withSelection}
      getRowId={(c) => String(c.id)}
      label={label}
      noun={['container', 'containers']}
      onRowActivate={(row) => navigate(paths.stockContainer(row.original.id))}
    />
  );
}
