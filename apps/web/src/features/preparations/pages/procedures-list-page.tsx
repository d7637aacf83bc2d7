import { useState } from 'react';
import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import { NotebookPen, Plus, Search } from 'lucide-react';
import type { GhsCode, Procedure } from '@lotwise/shared';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { buttonClasses } from '../../../components/ui/button';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Input } from '../../../components/ui/input';
import { ServerTable } from '../../../components/ui/server-table';
import { paths } from '../../../config/paths';
import { useCan } from '../../../lib/auth';
import { formatDate, formatPercent } from '../../../lib/format';
import { useProcedures } from '../api';
import { useProcedureListParams } from '../list-params';
import { PageHeader } from '../components/page-parts';
import { theoreticalYieldOf } from '../components/stoichiometry-table';
import { Mass } from '../components/rounded';

const column = createColumnHelper<ServerTableFeatures, Procedure>();

function pictogramsOf(procedure: Procedure): GhsCode[] {
  const codes = new Set<GhsCode>();
  for (const line of procedure.lines)
    for (const code of line.chemical.ghsPictograms) codes.add(code);
  return [...codes].sort();
}

const columns = column.columns([
  column.accessor('title', {
    header: 'Procedure',
    cell: ({ row }) => (
      <div className="max-w-80 min-w-48">
        <Link
          to={paths.procedure(row.original.id)}
          className="font-medium text-accent-700 underline-offset-2 hover:underline"
        >
          {row.original.title}
        </Link>
        {row.original.baseScale && <p className="text-xs text-ink-600">{row.original.baseScale}</p>}
      </div>
    ),
  }),
  column.display({
    id: 'product',
    header: 'Makes',
    cell: ({ row }) => {
      const products = row.original.lines.filter((line) => line.role === 'product');
      const theoretical = row.original.stoichiometry
        ? theoreticalYieldOf(row.original.stoichiometry)
        : null;
      return (
        <div className="min-w-36">
          {products.map((line) => line.chemical.name).join(', ') || '—'}
          {theoretical?.massG !== undefined && (
            <span className="block text-xs text-ink-600">
              theoretical <Mass g={theoretical?.massG} inline secondary={false} /> at base scale
            </span>
          )}
        </div>
      );
    },
  }),
  column.accessor('expectedYieldPercent', {
    header: 'Expected yield',
    enableSorting: false,
    meta: { align: 'right' },
    cell: ({ getValue }) => <span className="tabular-nums">{formatPercent(getValue())}</span>,
  }),
  column.accessor('runCount', {
    header: 'Runs',
    enableSorting: false,
    meta: { align: 'right' },
    cell: ({ getValue }) => <span className="tabular-nums">{getValue()}</span>,
  }),
  column.display({
    id: 'hazards',
    header: 'Hazards of its chemicals',
    cell: ({ row }) => (
      <div className="max-w-64 min-w-40">
        <PictogramList codes={pictogramsOf(row.original)} />
      </div>
    ),
  }),
  column.accessor('updatedAt', {
    header: 'Changed',
    cell: ({ getValue }) => <span className="whitespace-nowrap">{formatDate(getValue())}</span>,
  }),
]);

export function ProceduresListPage() {
  const { query, update } = useProcedureListParams();
  const procedures = useProcedures(query);
  const mayWrite = useCan('procedures.write');
  const navigate = useNavigate();
  const [text, setText] = useState(query.q);

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        title="Procedures"
        actions={
          mayWrite && (
            <Link to={paths.procedureNew} className={buttonClasses('primary')}>
              <Plus aria-hidden="true" className="size-4" />
              New procedure
            </Link>
          )
        }
      >
        Written preparations at their base scale. Open one to scale it, plan a session or see how
        its runs went.
      </PageHeader>
      <SafetyCaution />
      <form
        role="search"
        className="relative max-w-md"
        onSubmit={(event) => {
          event.preventDefault();
          update({ q: text });
        }}
      >
        <Search
          aria-hidden="true"
          className="pointer-events-none absolute top-2.5 left-2.5 size-4 text-ink-500"
        />
        <label htmlFor="procedures-search" className="sr-only">
          Search procedures by title
        </label>
        <Input
          id="procedures-search"
          className="pl-8"
          placeholder="Search by title, then Enter"
          value={text}
          onChange={(event) => setText(event.target.value)}
        />
      </form>
      {procedures.isError ? (
        <ErrorState
          title="The procedures could not be loaded"
          error={procedures.error}
          onRetry={() => void procedures.refetch()}
        />
      ) : (
        <ServerTable
          columns={columns}
          getRowId={(row) => String(row.id)}
          rows={procedures.data?.items}
          total={procedures.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          loading={procedures.isPending}
          refreshing={procedures.isPlaceholderData}
          label="Procedures"
          noun={['procedure', 'procedures']}
          onRowActivate={(row) => navigate(paths.procedure(row.original.id))}
          empty={
            <EmptyState icon={<NotebookPen />} title="No procedures yet">
              {query.q
                ? `No procedure title matches “${query.q}”.`
                : 'Write one with its lines at base scale; Lotwise works out the stoichiometry.'}
            </EmptyState>
          }
        />
      )}
    </div>
  );
}
