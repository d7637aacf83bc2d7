import { useState, type FormEvent } from 'react';
import { useNavigate, useSearchParams } from 'react-router';
import { CalendarPlus, ClipboardCheck, TriangleAlert } from 'lucide-react';
import {
  countOf,
  defaultOveragePercent,
  planCreateSchema,
  type PlanCreateParsed,
  type PlanHazard,
} from '@lotwise/shared';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { todayIsoDate } from '../../../lib/dates';
import { parseDecimal } from '../../../lib/numbers';
import { paths } from '../../../config/paths';
import { useCreatePlan, usePreviewPlan, useProcedure, useProcedures } from '../api';
import { BackLink, PageHeader, Section } from '../components/page-parts';
import {
  allPictograms,
  PreparationSafety,
  procedureHazards,
} from '../components/preparation-safety';
import { StockCheckTable } from '../components/stock-check-table';

const fieldLabels: Record<string, string> = {
  procedureId: 'Procedure',
  scaleFactor: 'Scale per bench',
  benches: 'Benches',
  overagePercent: 'Overage',
  plannedOn: 'Date',
  notes: 'Notes',
};

/** The pictograms of every chemical and how many carry hazards, beside the form. */
function HazardSummary({ hazards }: { hazards: readonly PlanHazard[] }) {
  const statements = new Set(hazards.flatMap((h) => h.hazardStatements.map((s) => s.code)));
  const hazardous = hazards.filter(
    (h) => h.ghsPictograms.length > 0 || h.hazardStatements.length > 0,
  );
  return (
    <div
      data-testid="hazard-summary"
      className="flex flex-wrap items-center gap-x-3 gap-y-1 rounded-md border border-warn-200 bg-warn-50 px-3 py-2 text-sm text-ink-800"
    >
      <TriangleAlert aria-hidden="true" className="size-4 shrink-0 text-ghs-red" />
      <PictogramList codes={allPictograms(hazards)} />
      <span>
        {countOf(hazardous.length, 'hazardous chemical')}, {countOf(statements.size, 'H-statement')}
        :{' '}
        <a href="#prep-safety-heading" className="text-accent-700 underline">
          full hazards and cautions below
        </a>
        .
      </span>
    </div>
  );
}

/**
 * Pick a procedure, the scale per bench, the benches, an overage and a date; check the stock
 * for the whole session (nothing saved), then save the plan. The form comes first; the
 * procedure's hazards are summarised beside it and shown in full below it.
 */
export function PlanNewPage() {
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const procedures = useProcedures({ q: '', sort: 'title.asc', page: 1, pageSize: 200 });
  const [procedureId, setProcedureId] = useState(search.get('procedureId') ?? '');
  const [factor, setFactor] = useState(search.get('factor') ?? '1');
  const [benches, setBenches] = useState(search.get('benches') ?? '1');
  const [overage, setOverage] = useState(String(defaultOveragePercent));
  const [plannedOn, setPlannedOn] = useState(todayIsoDate());
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const preview = usePreviewPlan();
  const create = useCreatePlan();
  const procedure = useProcedure(procedureId ? Number(procedureId) : undefined);
  // The values the shown stock check is for; a change makes it stale, so it goes.
  const [checked, setChecked] = useState<PlanCreateParsed | null>(null);

  function edit(setter: (value: string) => void) {
    return (value: string) => {
      setter(value);
      if (checked || preview.isError) {
        setChecked(null);
        preview.reset();
      }
      create.reset();
    };
  }

  function showErrors(error: unknown) {
    if (!isApiError(error)) return;
    const next: Record<string, string> = {};
    for (const [key, message] of Object.entries(error.fields)) next[key.split('.')[0]!] = message;
    setErrors(next);
  }

  async function handleCheck(event: FormEvent) {
    event.preventDefault();
    const body = {
      procedureId: procedureId ? Number(procedureId) : undefined,
      scaleFactor: factor.trim(),
      benches: parseDecimal(benches) ?? undefined,
      overagePercent: parseDecimal(overage) ?? undefined,
      plannedOn,
      notes,
    };
    const parsed = planCreateSchema.safeParse(body);
    if (!parsed.success) {
      const next: Record<string, string> = {};
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0]);
        next[key] ??= `${fieldLabels[key] ?? key}: ${issue.message}`;
      }
      setErrors(next);
      return;
    }
    setErrors({});
    const values = { ...parsed.data, scaleFactor: factor.trim() };
    try {
      await preview.mutateAsync(values);
      setChecked(parsed.data);
    } catch (error) {
      showErrors(error);
    }
  }

  async function handleSave() {
    if (!checked) return;
    try {
      const plan = await create.mutateAsync({ ...checked, scaleFactor: factor.trim() });
      navigate(paths.plan(plan.id));
    } catch (error) {
      showErrors(error);
    }
  }

  const failed = [preview, create].find((m) => m.isError);
  const result = checked ? preview.data : undefined;

  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.plans}>All session plans</BackLink>
      <PageHeader title="Plan a session">
        Lotwise checks every line against stock for the whole session: scale per bench × benches,
        plus the overage for spills and transfer losses. Nothing is saved until you save the plan.
      </PageHeader>
      {procedures.isPending ? (
        <PageSpinner label="Loading the procedures…" />
      ) : (
        <form
          onSubmit={handleCheck}
          noValidate
          aria-label="Plan a session"
          className="flex flex-col gap-4 rounded-lg border border-ink-200 bg-white px-4 py-4"
        >
          <Field label="Procedure" error={errors.procedureId}>
            {(props) => (
              <Select
                {...props}
                value={procedureId}
                onChange={(event) => edit(setProcedureId)(event.target.value)}
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
          {procedure.data && <HazardSummary hazards={procedureHazards(procedure.data)} />}
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
            <Field
              label="Scale per bench"
              hint="A factor of the base scale: 1, 0.5, 1/4…"
              error={errors.scaleFactor}
            >
              {(props) => (
                <Input
                  {...props}
                  value={factor}
                  onChange={(event) => edit(setFactor)(event.target.value)}
                />
              )}
            </Field>
            <Field label="Benches or groups" error={errors.benches}>
              {(props) => (
                <Input
                  {...props}
                  inputMode="numeric"
                  value={benches}
                  onChange={(event) => edit(setBenches)(event.target.value)}
                />
              )}
            </Field>
            <Field label="Overage (%)" hint="Default 10 %" error={errors.overagePercent}>
              {(props) => (
                <AmountInput
                  {...props}
                  value={overage}
                  onChange={(event) => edit(setOverage)(event.target.value)}
                />
              )}
            </Field>
            <Field label="Date" error={errors.plannedOn}>
              {(props) => (
                <Input
                  {...props}
                  type="date"
                  value={plannedOn}
                  onChange={(event) => edit(setPlannedOn)(event.target.value)}
                />
              )}
            </Field>
          </div>
          <Field label="Notes" optional error={errors.notes}>
            {(props) => (
              <Textarea
                {...props}
                rows={2}
                value={notes}
                onChange={(event) => edit(setNotes)(event.target.value)}
              />
            )}
          </Field>
          {failed && !isApiError(failed.error) && (
            <Notice tone="danger">{errorMessage(failed.error)}</Notice>
          )}
          {failed && isApiError(failed.error) && Object.keys(failed.error.fields).length === 0 && (
            <Notice
              tone="danger"
              title={failed === create ? 'The plan was not saved' : 'The stock was not checked'}
            >
              {failed.error.message}
            </Notice>
          )}
          <Button
            type="submit"
            variant={result ? 'secondary' : 'primary'}
            className="self-start"
            busy={preview.isPending}
            icon={<ClipboardCheck aria-hidden="true" className="size-4" />}
          >
            {result ? 'Check the stock again' : 'Check stock for this session'}
          </Button>
        </form>
      )}

      {result && (
        <Section id="stock-check-preview-heading" title="Stock check (not saved yet)">
          {result.stockCheck.ok ? (
            <Notice tone="ok" title="Everything needed is in stock">
              Every required line is covered by usable containers.
            </Notice>
          ) : (
            <Notice
              tone="warn"
              title={`${countOf(result.stockCheck.shortCount, 'line is', 'lines are')} short`}
            >
              You can save the plan anyway and reorder or prepare what is short.
            </Notice>
          )}
          <StockCheckTable check={result.stockCheck} />
          <div className="flex flex-wrap items-center gap-3">
            <Button
              variant="primary"
              onClick={() => void handleSave()}
              busy={create.isPending}
              icon={<CalendarPlus aria-hidden="true" className="size-4" />}
            >
              Save this plan
            </Button>
            <p className="text-sm text-ink-600">
              Saves the plan as a draft; containers are held only when you reserve them.
            </p>
          </div>
        </Section>
      )}

      {procedure.data && (
        <PreparationSafety
          title={`Hazards and cautions: ${procedure.data.title}`}
          hazards={result?.hazards ?? procedureHazards(procedure.data)}
          cautions={
            result?.cautions ?? {
              text: procedure.data.cautions,
              flags: procedure.data.cautionFlags,
            }
          }
        />
      )}
    </div>
  );
}
