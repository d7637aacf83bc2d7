import { Link, useParams, useSearchParams } from 'react-router';
import { FlaskConical, NotebookText, TriangleAlert } from 'lucide-react';
import type { Run } from '@lotwise/shared';
import { buttonClasses } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useCan } from '../../../lib/auth';
import { formatAmount, formatDate } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { RunTimelineSections } from '../../run-notebook/components/run-timeline-sections';
import { useProcedure, useRun } from '../api';
import { RunStatusBadge } from '../labels';
import { DiscardRunButton } from '../components/discard-run';
import { BackLink, PageHeader, QueryState, Section } from '../components/page-parts';
import { PreparationSafety, procedureHazards } from '../components/preparation-safety';
import { fullPrecision } from '../components/rounded';
import { Portions, RunDraws, RunObservations, YieldSummary } from '../components/run-summary';
import { StoichiometryTable } from '../components/stoichiometry-table';

function RunView({ run }: { run: Run }) {
  const [search] = useSearchParams();
  const procedure = useProcedure(run.procedure.id);
  const mayRecord = useCan('runs.record');
  const rows =
    procedure.data?.lines.map((line) => {
      const drawn = run.draws.filter((d) => d.lineIndex === line.index);
      const portions = run.portions.filter((p) => p.lineIndex === line.index);
      const amount =
        line.role === 'product'
          ? portions.length > 0
            ? `${formatAmount(
                portions.reduce((sum, p) => sum + (p.massG ?? 0), 0),
                'g',
              )} obtained`
            : '—'
          : drawn.length > 0
            ? drawn.map((d) => `${formatAmount(d.quantity, d.unit)} from ${d.labelCode}`).join(', ')
            : 'planned amount';
      return { name: line.chemical.name, role: line.role, amount, optional: line.optional };
    }) ?? [];

  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.runs}>All runs</BackLink>
      {search.get('recorded') && (
        <Notice tone="ok" title={`Run #${run.id} is recorded`}>
          The draws are in the ledger and each portion is a new prepared lot in stock.
        </Notice>
      )}
      <PageHeader
        eyebrow={`Run #${run.id}`}
        title={
          <Link
            to={paths.procedure(run.procedure.id)}
            className="underline-offset-2 hover:underline"
          >
            {run.procedure.title}
          </Link>
        }
        actions={
          <>
            {mayRecord && run.status === 'open' && (
              <>
                <Link to={paths.runRecord(run.id)} className={buttonClasses('primary')}>
                  Record what was used and obtained
                </Link>
                <DiscardRunButton run={run} />
              </>
            )}
            <Link to={paths.runNotebook(run.id)} className={buttonClasses('secondary')}>
              <NotebookText aria-hidden="true" className="size-4" />
              Notebook page
            </Link>
          </>
        }
      >
        <p className="flex flex-wrap items-center gap-2 tabular-nums">
          <RunStatusBadge status={run.status} />
          factor {fullPrecision(run.scaleFactor)} of the base scale · {formatDate(run.performedOn)}{' '}
          · {run.performedBy?.displayName ?? '—'}
          {run.planId !== null && (
            <Link to={paths.plan(run.planId)} className="text-accent-700 underline">
              plan #{run.planId}
            </Link>
          )}
        </p>
      </PageHeader>

      {run.status === 'open' && (
        <Link
          to={paths.runBench(run.id)}
          className={`${buttonClasses('primary')} h-12 self-start px-5 text-base pointer-coarse:h-12`}
        >
          <FlaskConical aria-hidden="true" className="size-5" />
          Follow the steps at the bench
        </Link>
      )}

      {run.status === 'recorded' && <YieldSummary run={run} />}

      {procedure.data && (
        <PreparationSafety
          hazards={procedureHazards(procedure.data)}
          cautions={{ text: procedure.data.cautions, flags: procedure.data.cautionFlags }}
        />
      )}

      {run.status === 'recorded' && (
        <Section id="portions-heading" title="Product put into stock">
          <Portions run={run} />
        </Section>
      )}

      {(run.notices.length > 0 || run.warnings.length > 0) && (
        <ul className="flex flex-col gap-1 text-sm">
          {[...run.notices, ...run.warnings.map((w) => w.message)].map((text) => (
            <li key={text} className="flex items-start gap-2 text-warn-700">
              <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
              {text}
            </li>
          ))}
        </ul>
      )}

      {run.stoichiometry && rows.length > 0 && (
        <Section id="used-stoich-heading" title="Stoichiometry of what was really used">
          <StoichiometryTable
            result={{ ...run.stoichiometry, warnings: [] }}
            rows={rows}
            label="Stoichiometry of what was used"
          />
        </Section>
      )}

      <RunTimelineSections runId={run.id} open={run.status === 'open'} />

      <RunDraws run={run} />

      <RunObservations run={run} />
    </div>
  );
}

export function RunPage() {
  const id = Number(useParams().id);
  const run = useRun(id);
  return (
    <QueryState query={run} what="run">
      {(data) => <RunView run={data} />}
    </QueryState>
  );
}
