import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import { FlaskRound, Plus } from 'lucide-react';
import type { RunSummary } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { buttonClasses } from '../../../components/ui/button';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { ServerTable } from '../../../components/ui/server-table';
import { paths } from '../../../config/paths';
import { useCan } from '../../../lib/auth';
import { formatDate } from '../../../lib/format';
import { useProcedures, useRuns } from '../api';
import { RunStatusBadge } from '../labels';
import { useRunListParams } from '../list-params';
import { PageHeader } from '../components/page-parts';
import { fullPrecision, Mass } from '../components/rounded';
import { YieldText } from '../components/yield-text';

const column = createColumnHelper<ServerTableFeatures, RunSummary>();

const columns = column.columns([
  column.accessor('createdAt', {
    header: 'Run',
    cell: ({ row }) => (
      <Link
        to={paths.run(row.original.id)}
        className="font-medium text-accent-700 underline-offset-2 hover:underline"
      >
        Run #{row.original.id}
      </Link>
    ),
  }),
  column.accessor('performedOn', {
    header: 'Performed',
    cell: ({ getValue }) => <span className="whitespace-nowrap">{formatDate(getValue())}</span>,
  }),
  column.display({
    id: 'procedure',
    header: 'Procedure',
    cell: ({ row }) => (
      <span>
        {row.original.procedure.title}
        <span className="block text-xs text-ink-600">
          factor {fullPrecision(row.original.scaleFactor)}
          {row.original.planId !== null && ` · plan #${row.original.planId}`}
        </span>
      </span>
    ),
  }),
  column.display({
    id: 'by',
    header: 'By',
    cell: ({ row }) => row.original.performedBy?.displayName ?? '—',
  }),
  column.display({
    id: 'obtained',
    header: 'Obtained',
    meta: { align: 'right' },
    cell: ({ row }) => <Mass g={row.original.productMassG} />,
  }),
  column.accessor('percentYield', {
    header: 'Yield',
    meta: { align: 'right' },
    cell: ({ getValue }) => <YieldText percent={getValue()} />,
  }),
  column.accessor('status', {
    header: 'Status',
    enableSorting: false,
    cell: ({ getValue }) => <RunStatusBadge status={getValue()} />,
  }),
]);

export function RunsListPage() {
  const { query, update } = useRunListParams();
  const runs = useRuns(query);
  const procedures = useProcedures({ q: '', sort: 'title.asc', page: 1, pageSize: 200 });
  const mayRecord = useCan('runs.record');
  const navigate = useNavigate();

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        title="Runs"
        actions={
          mayRecord && (
            <Link to={paths.runNew} className={buttonClasses('primary')}>
              <Plus aria-hidden="true" className="size-4" />
              Record a run
            </Link>
          )
        }
      >
        What was really used and obtained at the bench, newest first. Each run links to the lots it
        drew from and the lots it made.
      </PageHeader>
      <SafetyCaution />
      <div className="flex flex-col gap-1">
        <label htmlFor="runs-procedure" className="text-sm font-medium text-ink-800">
          Procedure
        </label>
        <Select
          id="runs-procedure"
          className="w-96 max-w-full"
          value={query.procedureId ?? ''}
          onChange={(event) =>
            update({ filters: { procedureId: event.target.value || undefined } })
          }
        >
          <option value="">Every procedure</option>
          {procedures.data?.items.map((p) => (
            <option key={p.id} value={p.id}>
              {p.title}
            </option>
          ))}
        </Select>
      </div>
      {runs.isError ? (
        <ErrorState
          title="The runs could not be loaded"
          error={runs.error}
          onRetry={() => void runs.refetch()}
        />
      ) : (
        <ServerTable
          columns={columns}
          getRowId={(row) => String(row.id)}
          rows={runs.data?.items}
          total={runs.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          loading={runs.isPending}
          refreshing={runs.isPlaceholderData}
          label="Runs"
          noun={['run', 'runs']}
          onRowActivate={(row) => navigate(paths.run(row.original.id))}
          empty={
            <EmptyState icon={<FlaskRound />} title="No runs yet">
              Record one from a session plan, or from a procedure without a plan.
            </EmptyState>
          }
        />
      )}
    </div>
  );
}
