import { Link, useParams } from 'react-router';
import { BarChart3, CalendarPlus, FlaskRound, Pencil } from 'lucide-react';
import type { Procedure } from '@lotwise/shared';
import { buttonClasses } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { withQuery } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import { formatDate, formatPercent } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useProcedure } from '../api';
import { BackLink, PageHeader, Property, QueryState } from '../components/page-parts';
import { PreparationSafety, procedureHazards } from '../components/preparation-safety';
import { ProcedureSteps } from '../components/procedure-steps';
import { ScalePanel } from '../components/scale-panel';
import { amountText, StoichiometryTable } from '../components/stoichiometry-table';
import { YieldsHistory } from '../components/yields-history';

function ProcedureView({ procedure }: { procedure: Procedure }) {
  const mayWrite = useCan('procedures.write');
  const mayRecord = useCan('runs.record');
  const rows = procedure.lines.map((line) => ({
    name: line.chemical.name,
    role: line.role,
    amount: amountText(line),
    optional: line.optional,
    notes: line.notes,
  }));
  const products = procedure.lines.filter((line) => line.role === 'product');

  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.procedures}>All procedures</BackLink>
      <PageHeader
        title={procedure.title}
        actions={
          <>
            {mayWrite && (
              <Link to={paths.procedureEdit(procedure.id)} className={buttonClasses('secondary')}>
                <Pencil aria-hidden="true" className="size-4" />
                Edit
              </Link>
            )}
            {mayRecord && (
              <Link
                to={withQuery(paths.runNew, { procedureId: procedure.id })}
                className={buttonClasses('secondary')}
              >
                <FlaskRound aria-hidden="true" className="size-4" />
                Record a run without a plan
              </Link>
            )}
            {mayRecord && (
              <Link
                to={withQuery(paths.planNew, { procedureId: procedure.id })}
                className={buttonClasses('primary')}
              >
                <CalendarPlus aria-hidden="true" className="size-4" />
                Plan a session
              </Link>
            )}
          </>
        }
      >
        {procedure.reference && <p>{procedure.reference}</p>}
      </PageHeader>

      <PreparationSafety
        hazards={procedureHazards(procedure)}
        cautions={{ text: procedure.cautions, flags: procedure.cautionFlags }}
      />

      <section
        aria-labelledby="procedure-facts-heading"
        className="rounded-lg border border-ink-200 bg-white px-4 py-3"
      >
        <h2 id="procedure-facts-heading" className="mb-1 text-base font-semibold">
          About this procedure
        </h2>
        <dl>
          <Property term="Base scale">{procedure.baseScale || '—'}</Property>
          <Property term="Makes">
            {products.map((line) => line.chemical.name).join(', ') || '—'}
          </Property>
          <Property term="Expected yield">
            <span className="tabular-nums">{formatPercent(procedure.expectedYieldPercent)}</span>
          </Property>
          <Property term="Literature melting range">
            <span className="tabular-nums">
              {procedure.literatureMeltingC
                ? `${procedure.literatureMeltingC.low}–${procedure.literatureMeltingC.high} °C`
                : '—'}
            </span>
          </Property>
          <Property term="Written by">
            {procedure.createdBy?.displayName ?? '—'}, changed {formatDate(procedure.updatedAt)}
          </Property>
        </dl>
      </section>

      <section aria-labelledby="lines-heading" className="flex flex-col gap-2">
        <h2 id="lines-heading" className="text-base font-semibold">
          Lines at base scale
        </h2>
        {procedure.stoichiometry ? (
          <StoichiometryTable
            result={procedure.stoichiometry}
            rows={rows}
            label="Lines at base scale"
          />
        ) : (
          <Notice tone="warn" title="The stoichiometry cannot be worked out yet">
            {procedure.stoichiometryError?.message ?? 'Some lines are missing data.'}
          </Notice>
        )}
      </section>

      <ProcedureSteps
        id="steps-heading"
        steps={procedure.steps}
        lines={procedure.lines.map((line) => ({
          lineIndex: line.index,
          name: line.chemical.name,
          amount: amountText(line),
        }))}
        note="Amounts at base scale; a plan and its dispensing sheet show them at their scale."
        empty={
          mayWrite && (
            <p className="text-sm text-ink-600">
              No steps written yet. Edit the procedure to add its steps, with their times,
              temperature windows and hold points, so they print on every bench page.
            </p>
          )
        }
      />

      <ScalePanel procedure={procedure} />
      <YieldsHistory procedureId={procedure.id} />
      <p className="text-sm text-ink-600">
        <BarChart3 aria-hidden="true" className="mr-1.5 inline size-4 align-text-bottom" />
        Where a chemical of this procedure was used elsewhere:{' '}
        {procedure.lines
          .filter(
            (line, index, all) => all.findIndex((l) => l.chemicalId === line.chemicalId) === index,
          )
          .map((line, index) => (
            <span key={line.chemicalId}>
              {index > 0 && ', '}
              <Link
                to={paths.chemicalUsage(line.chemicalId)}
                className="text-accent-700 underline-offset-2 hover:underline"
              >
                {line.chemical.name}
              </Link>
            </span>
          ))}
      </p>
    </div>
  );
}

export function ProcedurePage() {
  const id = Number(useParams().id);
  const procedure = useProcedure(id);
  return (
    <QueryState query={procedure} what="procedure">
      {(data) => <ProcedureView procedure={data} />}
    </QueryState>
  );
}
