import { useParams } from 'react-router';
import { useQueries } from '@tanstack/react-query';
import { Printer } from 'lucide-react';
import {
  chemicalSchema,
  hazardStatementTexts,
  type PlanHazard,
  type Procedure,
  type Run,
  type RunTimeline,
} from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { api } from '../../../lib/api-client';
import { formatDate, formatDateTime } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { preparationKeys, useProcedure, useRun } from '../../preparations/api';
import { RunStatusBadge } from '../../preparations/labels';
import { BackLink, Property, QueryState, Section } from '../../preparations/components/page-parts';
import {
  PreparationSafety,
  procedureHazards,
} from '../../preparations/components/preparation-safety';
import { fullPrecision } from '../../preparations/components/rounded';
import {
  Portions,
  RunDraws,
  RunObservations,
  YieldSummary,
} from '../../preparations/components/run-summary';
import { useRunTimeline } from '../api';
import { TimelineSections } from '../components/run-timeline-sections';

/**
 * The hazards of every chemical drawn or made: the procedure's lines, and any chemical drawn
 * beside them (fetched on its own, since the run names only its id).
 */
function useRunHazards(run: Run, procedure: Procedure) {
  const known = new Set(procedure.lines.map((line) => line.chemicalId));
  const extraIds = [...new Set(run.draws.map((d) => d.chemicalId).filter((id) => !known.has(id)))];
  const extras = useQueries({
    queries: extraIds.map((id) => ({
      queryKey: [...preparationKeys.all, 'chemical', id] as const,
      queryFn: ({ signal }: { signal: AbortSignal }) =>
        api.get(`/api/chemicals/${id}`, chemicalSchema, signal),
    })),
  });
  const hazards: PlanHazard[] = [...procedureHazards(procedure)];
  for (const extra of extras) {
    if (!extra.data) continue;
    hazards.push({
      chemicalId: extra.data.id,
      name: extra.data.name,
      ghsPictograms: extra.data.ghsPictograms,
      hazardStatements: extra.data.hazardStatements.map((code) => ({
        code,
        text: hazardStatementTexts[code] ?? null,
      })),
    });
  }
  return {
    hazards: hazards.sort((a, b) => a.name.localeCompare(b.name)),
    pending: extras.some((extra) => extra.isPending),
  };
}

/**
 * Paper: margins that fit A4 and Letter alike, colours kept (the window bands, the
 * deviation boxes), and no heading left alone at the foot of a page.
 */
const notebookPrintCss = `
@media print {
  @page { margin: 14mm 12mm; }
  .notebook-page { -webkit-print-color-adjust: exact; print-color-adjust: exact; font-size: 11pt; }
  .notebook-page h2, .notebook-page h3 { break-after: avoid; }
  .notebook-page figure, .notebook-page tr, .notebook-page li { break-inside: avoid; }
  .notebook-page .stack-table { break-inside: avoid; }
  /* the hazards may run on to the next sheet rather than leave the first one blank */
  .notebook-page [aria-labelledby='prep-safety-heading'] { break-inside: auto; }
  .notebook-page [aria-labelledby='prep-safety-heading'] .stack-table { break-inside: auto; }
}
`;

function SignatureLines() {
  return (
    <section
      aria-label="Signatures"
      className="mt-2 grid gap-6 break-inside-avoid pt-4 text-sm sm:grid-cols-2 print:grid-cols-2"
    >
      {['Performed by', 'Checked by'].map((who) => (
        <div key={who} className="flex flex-col gap-6">
          <p className="flex items-end gap-2">
            <span className="shrink-0 text-ink-700">{who}</span>
            <span className="h-6 flex-1 border-b border-ink-800" />
          </p>
          <p className="flex items-end gap-2">
            <span className="shrink-0 text-ink-700">Signature and date</span>
            <span className="h-6 flex-1 border-b border-ink-800" />
          </p>
        </div>
      ))}
    </section>
  );
}

function Notebook({
  run,
  procedure,
  timeline,
}: {
  run: Run;
  procedure: Procedure;
  timeline: RunTimeline;
}) {
  const { hazards, pending } = useRunHazards(run, procedure);
  return (
    <div className="flex flex-col gap-4">
      <style>{notebookPrintCss}</style>
      <div className="flex flex-wrap items-center justify-between gap-2 print:hidden">
        <BackLink to={paths.run(run.id)}>Back to run #{run.id}</BackLink>
        <Button
          variant="primary"
          icon={<Printer aria-hidden="true" className="size-4" />}
          onClick={() => window.print()}
        >
          Print
        </Button>
      </div>

      <article
        aria-labelledby="notebook-title"
        className="notebook-page flex flex-col gap-5 rounded-lg border border-ink-200 bg-white p-5 print:gap-4 print:border-0 print:p-0"
      >
        <header className="flex flex-col gap-2 border-b-2 border-ink-800 pb-2">
          <p className="text-xs text-ink-600">
            Lotwise run notebook · run #{run.id} · printed {formatDateTime(new Date())}
          </p>
          <h1 id="notebook-title" className="text-xl font-semibold text-ink-900">
            {procedure.title}
          </h1>
          <dl className="grid gap-x-8 sm:grid-cols-2 print:grid-cols-2">
            <Property term="Procedure">
              {procedure.title}
              {procedure.reference && (
                <span className="block text-xs text-ink-700">{procedure.reference}</span>
              )}
            </Property>
            <Property term="Scale">
              <span className="tabular-nums">
                factor {fullPrecision(run.scaleFactor)} of the base scale
              </span>
              {procedure.baseScale && (
                <span className="block text-xs text-ink-700">({procedure.baseScale})</span>
              )}
            </Property>
            <Property term="Performed by">{run.performedBy?.displayName ?? '—'}</Property>
            <Property term="Performed on">
              {formatDate(run.performedOn ?? run.createdAt)}
              {run.planId !== null && ` · plan #${run.planId}`}
            </Property>
            <Property term="Status">
              <RunStatusBadge status={run.status} />
              {run.recordedAt && (
                <span className="ml-2 text-xs text-ink-700">
                  recorded {formatDateTime(run.recordedAt)}
                </span>
              )}
            </Property>
          </dl>
        </header>

        <PreparationSafety
          hazards={hazards}
          cautions={{ text: procedure.cautions, flags: procedure.cautionFlags }}
          title="Hazards of every chemical drawn or made, and the cautions"
          extra={
            pending && (
              <p className="mt-1 text-xs text-ink-600">Loading the hazards of extra draws…</p>
            )
          }
        />

        {run.status === 'recorded' && <YieldSummary run={run} />}
        <RunDraws run={run} />
        {run.status === 'recorded' && (
          <Section id="portions-heading" title="Product put into stock">
            <Portions run={run} />
          </Section>
        )}

        {timeline.entries.length === 0 ? (
          <Section id="timeline-heading" title="Timeline">
            <p className="text-sm text-ink-600">Nothing was recorded during this run.</p>
          </Section>
        ) : (
          <TimelineSections timeline={timeline} />
        )}

        <RunObservations run={run} />
        <SignatureLines />
      </article>
    </div>
  );
}

function NotebookLoader({ run }: { run: Run }) {
  const procedure = useProcedure(run.procedure.id);
  const timeline = useRunTimeline(run.id, { follow: run.status === 'open' });
  if (procedure.isPending || timeline.isPending) {
    return <PageSpinner label="Loading the notebook page…" />;
  }
  if (procedure.isError || timeline.isError) {
    return (
      <ErrorState
        title="The notebook page could not be put together"
        error={procedure.error ?? timeline.error}
        onRetry={() => {
          void procedure.refetch();
          void timeline.refetch();
        }}
      />
    );
  }
  return <Notebook run={run} procedure={procedure.data} timeline={timeline.data} />;
}

/** A run as one printable lab notebook page. */
export function RunNotebookPage() {
  const id = Number(useParams().id);
  const run = useRun(id);
  return (
    <QueryState query={run} what="run">
      {(data) => <NotebookLoader run={data} />}
    </QueryState>
  );
}
