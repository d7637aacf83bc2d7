import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import { CalendarPlus, ClipboardList } from 'lucide-react';
import { planStatuses, type Plan } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { buttonClasses } from '../../../components/ui/button';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { ServerTable } from '../../../components/ui/server-table';
import { paths } from '../../../config/paths';
import { useCan } from '../../../lib/auth';
import { formatDate, formatPercent } from '../../../lib/format';
import { usePlans } from '../api';
import { PlanStatusBadge, planStatusLooks } from '../labels';
import { usePlanListParams } from '../list-params';
import { PageHeader } from '../components/page-parts';
import { fullPrecision } from '../components/rounded';

const column = createColumnHelper<ServerTableFeatures, Plan>();

const columns = column.columns([
  column.accessor('plannedOn', {
    header: 'Date',
    cell: ({ row }) => (
      <Link
        to={paths.plan(row.original.id)}
        className="font-medium whitespace-nowrap text-accent-700 underline-offset-2 hover:underline"
      >
        {formatDate(row.original.plannedOn)}
      </Link>
    ),
  }),
  column.display({
    id: 'procedure',
    header: 'Procedure',
    cell: ({ row }) => (
      <span>
        {row.original.procedure.title}
        <span className="block text-xs text-ink-600">Plan #{row.original.id}</span>
      </span>
    ),
  }),
  column.display({
    id: 'scale',
    header: 'Benches × scale',
    meta: { align: 'right' },
    cell: ({ row }) => (
      <span className="whitespace-nowrap tabular-nums">
        {row.original.benches} × {fullPrecision(row.original.scaleFactor)}
        <span className="block text-xs text-ink-600">
          + {formatPercent(row.original.overagePercent)}
        </span>
      </span>
    ),
  }),
  column.accessor('status', {
    header: 'Status',
    enableSorting: false,
    cell: ({ getValue }) => <PlanStatusBadge status={getValue()} />,
  }),
  column.accessor('reservedUntil', {
    header: 'Held until',
    enableSorting: false,
    cell: ({ getValue }) => <span className="whitespace-nowrap">{formatDate(getValue())}</span>,
  }),
  column.display({
    id: 'by',
    header: 'Planned by',
    cell: ({ row }) => row.original.createdBy?.displayName ?? '—',
  }),
]);

export function PlansListPage() {
  const { query, update } = usePlanListParams();
  const plans = usePlans(query);
  const mayPlan = useCan('runs.record');
  const navigate = useNavigate();

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        title="Session plans"
        actions={
          mayPlan && (
            <Link to={paths.planNew} className={buttonClasses('primary')}>
              <CalendarPlus aria-hidden="true" className="size-4" />
              Plan a session
            </Link>
          )
        }
      >
        A plan checks a procedure at a scale, for a number of benches, against stock — and can hold
        the containers until the day.
      </PageHeader>
      <SafetyCaution />
      <div className="flex items-end gap-2">
        <div className="flex flex-col gap-1">
          <label htmlFor="plans-status" className="text-sm font-medium text-ink-800">
            Status
          </label>
          <Select
            id="plans-status"
            className="w-56"
            value={query.status ?? ''}
            onChange={(event) => update({ filters: { status: event.target.value || undefined } })}
          >
            <option value="">Any status</option>
            {planStatuses.map((status) => (
              <option key={status} value={status}>
                {planStatusLooks[status].label}
              </option>
            ))}
          </Select>
        </div>
      </div>
      {plans.isError ? (
        <ErrorState
          title="The plans could not be loaded"
          error={plans.error}
          onRetry={() => void plans.refetch()}
        />
      ) : (
        <ServerTable
          columns={columns}
          getRowId={(row) => String(row.id)}
          rows={plans.data?.items}
          total={plans.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          loading={plans.isPending}
          refreshing={plans.isPlaceholderData}
          label="Session plans"
          noun={['plan', 'plans']}
          onRowActivate={(row) => navigate(paths.plan(row.original.id))}
          empty={
            <EmptyState icon={<ClipboardList />} title="No session plans">
              Open a procedure and choose “Plan a session”.
            </EmptyState>
          }
        />
      )}
    </div>
  );
}
