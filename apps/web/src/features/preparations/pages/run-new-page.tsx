import { useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router';
import { FlaskConical, FlaskRound } from 'lucide-react';
import { countOf, scaleFactorInputSchema } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input, Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { formatDate } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useCreateRun, usePlan, useProcedure, useProcedures } from '../api';
import { PlanStatusBadge } from '../labels';
import { BackLink, PageHeader } from '../components/page-parts';
import { PreparationSafety, procedureHazards } from '../components/preparation-safety';
import { fullPrecision } from '../components/rounded';

/**
 * Opens a run — from a plan (its procedure and whole-session scale) or without one — and
 * goes on to the bench page (a procedure with steps) or to record what was used and obtained.
 */
export function RunNewPage() {
  const [search] = useSearchParams();
  const planId = Number(search.get('planId')) || undefined;
  const navigate = useNavigate();
  const create = useCreateRun();
  const plan = usePlan(planId);
  const procedures = useProcedures({ q: '', sort: 'title.asc', page: 1, pageSize: 200 });
  const [procedureId, setProcedureId] = useState(search.get('procedureId') ?? '');
  const [factor, setFactor] = useState('1');
  const [factorError, setFactorError] = useState<string>();
  const procedure = useProcedure(procedureId && !planId ? Number(procedureId) : undefined);

  const steps = planId ? (plan.data?.steps.length ?? 0) : (procedure.data?.steps.length ?? 0);

  /** Opens the run, then goes to the bench page (`bench`) or straight to recording it. */
  function start(next: 'bench' | 'record') {
    const go = (run: { id: number }) =>
      navigate(next === 'bench' ? paths.runBench(run.id) : paths.runRecord(run.id));
    if (planId) {
      create.mutate({ planId }, { onSuccess: go });
      return;
    }
    const parsed = scaleFactorInputSchema.safeParse(factor.trim());
    if (!parsed.success) {
      setFactorError(parsed.error.issues[0]?.message);
      return;
    }
    setFactorError(undefined);
    create.mutate(
      { procedureId: Number(procedureId), scaleFactor: factor.trim() },
      { onSuccess: go },
    );
  }

  return (
    <div className="flex flex-col gap-5">
      <BackLink to={planId ? paths.plan(planId) : paths.runs}>
        {planId ? 'Back to the plan' : 'All runs'}
      </BackLink>
      <PageHeader title="Record a run">
        Open a run, follow the procedure's steps at the bench (timers, readings, notes and photos),
        then enter what was really drawn from which container and what was obtained.
      </PageHeader>
      {planId && plan.data && (
        <>
          <PreparationSafety hazards={plan.data.hazards} cautions={plan.data.cautions} />
          <div className="rounded-lg border border-ink-200 bg-white px-4 py-3 text-sm">
            <p className="font-semibold text-ink-900">{plan.data.procedure.title}</p>
            <p className="flex flex-wrap items-center gap-2 text-ink-700 tabular-nums">
              <PlanStatusBadge status={plan.data.status} /> plan #{plan.data.id} ·{' '}
              {formatDate(plan.data.plannedOn)} · {plan.data.benches} benches × scale{' '}
              {fullPrecision(plan.data.scaleFactor)}: the run is recorded at factor{' '}
              {fullPrecision(plan.data.scaleFactor * plan.data.benches)} of the base scale.
            </p>
          </div>
        </>
      )}
      {!planId && (
        <>
          {procedure.data && (
            <PreparationSafety
              hazards={procedureHazards(procedure.data)}
              cautions={{ text: procedure.data.cautions, flags: procedure.data.cautionFlags }}
            />
          )}
          <div className="grid gap-4 rounded-lg border border-ink-200 bg-white px-4 py-3 sm:grid-cols-[2fr_1fr]">
            <Field label="Procedure">
              {(props) => (
                <Select
                  {...props}
                  value={procedureId}
                  onChange={(event) => setProcedureId(event.target.value)}
                >
                  <option value="">Choose a procedure</option>
                  {procedures.data?.items.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.title}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="Scale factor" hint="e.g. 1, 0.5 or 1/4" error={factorError}>
              {(props) => (
                <Input
                  {...props}
                  value={factor}
                  onChange={(event) => setFactor(event.target.value)}
                />
              )}
            </Field>
          </div>
        </>
      )}
      {create.isError && (
        <Notice tone="danger" title="The run was not opened">
          {errorMessage(create.error)}
        </Notice>
      )}
      <div className="flex flex-wrap gap-2">
        {steps > 0 && (
          <Button
            variant="primary"
            busy={create.isPending}
            disabled={!planId && !procedureId}
            icon={<FlaskConical aria-hidden="true" className="size-4" />}
            onClick={() => start('bench')}
          >
            Start and follow the {countOf(steps, 'step')}
          </Button>
        )}
        <Button
          variant={steps > 0 ? 'secondary' : 'primary'}
          busy={create.isPending}
          disabled={!planId && !procedureId}
          icon={<FlaskRound aria-hidden="true" className="size-4" />}
          onClick={() => start('record')}
        >
          Start recording
        </Button>
      </div>
    </div>
  );
}
