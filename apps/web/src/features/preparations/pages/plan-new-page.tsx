import { useState, type FormEvent } from 'react';
import { useNavigate, useSearchParams } from 'react-router';
import { CalendarPlus } from 'lucide-react';
import { defaultOveragePercent, planCreateSchema } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { todayIsoDate } from '../../../lib/dates';
import { parseDecimal } from '../../../lib/numbers';
import { paths } from '../../../config/paths';
import { useCreatePlan, useProcedure, useProcedures } from '../api';
import { BackLink, PageHeader } from '../components/page-parts';
import { PreparationSafety, procedureHazards } from '../components/preparation-safety';

const fieldLabels: Record<string, string> = {
  procedureId: 'Procedure',
  scaleFactor: 'Scale per bench',
  benches: 'Benches',
  overagePercent: 'Overage',
  plannedOn: 'Date',
  notes: 'Notes',
};

/** Pick a procedure, the scale per bench, the benches, an overage and a date. */
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
  const create = useCreatePlan();
  const procedure = useProcedure(procedureId ? Number(procedureId) : undefined);

  async function handleSubmit(event: FormEvent) {
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
    try {
      const plan = await create.mutateAsync({ ...parsed.data, scaleFactor: factor.trim() });
      navigate(paths.plan(plan.id));
    } catch (error) {
      if (isApiError(error)) {
        const next: Record<string, string> = {};
        for (const [key, message] of Object.entries(error.fields))
          next[key.split('.')[0]!] = message;
        setErrors(next);
      }
    }
  }

  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.plans}>All session plans</BackLink>
      <PageHeader title="Plan a session">
        Lotwise checks every line against stock for the whole session: scale per bench × benches,
        plus the overage for spills and transfer losses.
      </PageHeader>
      {procedure.data && (
        <PreparationSafety
          title={`Hazards and cautions: ${procedure.data.title}`}
          hazards={procedureHazards(procedure.data)}
          cautions={{ text: procedure.data.cautions, flags: procedure.data.cautionFlags }}
        />
      )}
      {procedures.isPending ? (
        <PageSpinner label="Loading the procedures…" />
      ) : (
        <form
          onSubmit={handleSubmit}
          noValidate
          aria-label="Plan a session"
          className="flex flex-col gap-4 rounded-lg border border-ink-200 bg-white px-4 py-4"
        >
          <Field label="Procedure" error={errors.procedureId}>
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
                  onChange={(event) => setFactor(event.target.value)}
                />
              )}
            </Field>
            <Field label="Benches or groups" error={errors.benches}>
              {(props) => (
                <Input
                  {...props}
                  inputMode="numeric"
                  value={benches}
                  onChange={(event) => setBenches(event.target.value)}
                />
              )}
            </Field>
            <Field label="Overage (%)" hint="Default 10 %" error={errors.overagePercent}>
              {(props) => (
                <Input
                  {...props}
                  inputMode="decimal"
                  value={overage}
                  onChange={(event) => setOverage(event.target.value)}
                />
              )}
            </Field>
            <Field label="Date" error={errors.plannedOn}>
              {(props) => (
                <Input
                  {...props}
                  type="date"
                  value={plannedOn}
                  onChange={(event) => setPlannedOn(event.target.value)}
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
                onChange={(event) => setNotes(event.target.value)}
              />
            )}
          </Field>
          {create.isError && !isApiError(create.error) && (
            <Notice tone="danger">{errorMessage(create.error)}</Notice>
          )}
          {create.isError &&
            isApiError(create.error) &&
            Object.keys(create.error.fields).length === 0 && (
              <Notice tone="danger" title="The plan was not made">
                {create.error.message}
              </Notice>
            )}
          <Button
            type="submit"
            variant="primary"
            className="self-start"
            busy={create.isPending}
            icon={<CalendarPlus aria-hidden="true" className="size-4" />}
          >
            Check stock for this session
          </Button>
        </form>
      )}
    </div>
  );
}
