import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import { Save } from 'lucide-react';
import { runRecordSchema, type PlanDetail, type Procedure, type Run } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { useConfirmation } from '../../../components/ui/confirmation-dialog';
import { Field } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage, isApiError, sendWithConfirmation } from '../../../lib/api-client';
import { todayIsoDate } from '../../../lib/dates';
import { parseDecimal } from '../../../lib/numbers';
import { noWaste, WasteDestination } from '../../../components/waste/waste-destination';
import { paths } from '../../../config/paths';
import { RecordDeviations } from '../../run-notebook/components/record-deviations';
import { usePlan, useProcedure, useRecordRun, useRun } from '../api';
import { BackLink, PageHeader, QueryState, Section } from '../components/page-parts';
import { PreparationSafety, procedureHazards } from '../components/preparation-safety';
import { fullPrecision } from '../components/rounded';
import { RunExtraDraws } from '../components/run-extra-draws';
import { RunLineDraws } from '../components/run-line-draws';
import { RunProductFields } from '../components/run-product-fields';
import {
  initialDraws,
  issuePlace,
  newPortion,
  recordBody,
  undrawnLines,
  type ExtraDraw,
  type PortionValues,
} from '../components/run-record-body';

function RecordForm({
  run,
  procedure,
  plan,
}: {
  run: Run;
  procedure: Procedure;
  plan: PlanDetail | undefined;
}) {
  const navigate = useNavigate();
  const record = useRecordRun(run.id);
  const confirmation = useConfirmation();
  const product = procedure.lines.find((line) => line.role === 'product');
  const [performedOn, setPerformedOn] = useState(todayIsoDate());
  const [draws, setDraws] = useState(() => initialDraws(procedure, plan, run.scaleFactor));
  const [extras, setExtras] = useState<ExtraDraw[]>([]);
  const [crude, setCrude] = useState('');
  const [portions, setPortions] = useState<PortionValues[]>(() => [
    newPortion('first crop', product?.chemical.stockUnit ?? 'g'),
  ]);
  const [meltingLow, setMeltingLow] = useState('');
  const [meltingHigh, setMeltingHigh] = useState('');
  const [appearance, setAppearance] = useState('');
  const [notes, setNotes] = useState('');
  const [problems, setProblems] = useState<string[]>([]);
  const [waste, setWaste] = useState(() => noWaste(`Filtrate and washings of run #${run.id}`));
  const reagentIds = procedure.lines
    .filter((line) => line.role !== 'product')
    .map((line) => line.chemical.id);

  async function handleSubmit(event: FormEvent) {
    event.preventDefault();
    const body = {
      ...recordBody({
        performedOn,
        draws,
        extras,
        productLineIndex: product?.index ?? null,
        crude,
        portions,
        meltingLow,
        meltingHigh,
        appearance,
        notes,
      }),
      waste: waste.wasteContainerId
        ? [
            {
              wasteContainerId: Number(waste.wasteContainerId),
              description: waste.description,
              quantity: parseDecimal(waste.quantity) ?? (undefined as unknown as number),
              unit: waste.unit,
              chemicalIds: reagentIds,
            },
          ]
        : [],
    };
    const parsed = runRecordSchema.safeParse(body);
    // The rule the server applies: the yield comes only from what is drawn here.
    const undrawn = undrawnLines(procedure, draws).map(
      (line) =>
        `Line ${line.index + 1} (${line.chemical.name}): enter what was drawn and from which container — the yield is worked out only from amounts drawn from stock.`,
    );
    const issues = parsed.success
      ? []
      : parsed.error.issues.map(
          (issue) => `${issuePlace(issue.path, procedure, body)}: ${issue.message}`,
        );
    if (undrawn.length > 0 || issues.length > 0) {
      setProblems([...undrawn, ...issues]);
      return;
    }
    setProblems([]);
    try {
      // A draw into another plan's hold is asked about first; going back records nothing.
      const recorded = await sendWithConfirmation(
        (confirm) => record.mutateAsync(confirm ? { ...body, confirm } : body),
        confirmation.ask,
      );
      if (!recorded) return record.reset();
      navigate(`${paths.run(run.id)}?recorded=1`);
    } catch (error) {
      if (isApiError(error)) {
        setProblems(Object.entries(error.fields).map(([path, text]) => `${path}: ${text}`));
      }
    }
  }

  return (
    <form
      onSubmit={handleSubmit}
      noValidate
      aria-label="Record the run"
      className="flex flex-col gap-5"
    >
      <Field label="Performed on" className="w-48">
        {(props) => (
          <Input
            {...props}
            type="date"
            value={performedOn}
            onChange={(event) => setPerformedOn(event.target.value)}
          />
        )}
      </Field>

      <RunLineDraws
        procedure={procedure}
        plan={plan}
        scaleFactor={run.scaleFactor}
        draws={draws}
        onChange={setDraws}
      />
      <RunExtraDraws extras={extras} setExtras={setExtras} />
      {product && (
        <RunProductFields
          product={product}
          crude={crude}
          setCrude={setCrude}
          portions={portions}
          setPortions={setPortions}
        />
      )}

      <Section id="waste-heading" title="Waste">
        <WasteDestination
          legend="Washings, filtrates and residues"
          value={waste}
          onChange={setWaste}
          chemicalIds={reagentIds}
        />
      </Section>

      <Section id="observations-heading" title="Observations">
        <div className="grid gap-3 md:grid-cols-[auto_auto_1fr] md:items-end">
          <Field label="Melting range from (°C)" optional className="w-44">
            {(props) => (
              <AmountInput
                {...props}
                value={meltingLow}
                onChange={(event) => setMeltingLow(event.target.value)}
              />
            )}
          </Field>
          <Field label="Melting range to (°C)" optional className="w-44">
            {(props) => (
              <AmountInput
                {...props}
                value={meltingHigh}
                onChange={(event) => setMeltingHigh(event.target.value)}
              />
            )}
          </Field>
          <p className="pb-2 text-sm text-ink-600">
            Literature:{' '}
            {procedure.literatureMeltingC
              ? `${procedure.literatureMeltingC.low}–${procedure.literatureMeltingC.high} °C`
              : 'not recorded for this procedure'}
          </p>
        </div>
        <Field label="Appearance" optional>
          {(props) => (
            <Input
              {...props}
              value={appearance}
              onChange={(event) => setAppearance(event.target.value)}
            />
          )}
        </Field>
        <Field label="Notes" optional>
          {(props) => (
            <Textarea
              {...props}
              rows={3}
              value={notes}
              onChange={(event) => setNotes(event.target.value)}
            />
          )}
        </Field>
      </Section>

      <RecordDeviations runId={run.id} />

      {problems.length > 0 && (
        <Notice tone="danger" title="Not recorded yet: a few things need a look">
          <ul className="list-disc pl-4">
            {problems.map((problem) => (
              <li key={problem}>{problem}</li>
            ))}
          </ul>
        </Notice>
      )}
      {record.isError && (
        <Notice tone="danger" title="Nothing was recorded">
          {errorMessage(record.error)} The whole run is saved at once, or not at all.
        </Notice>
      )}
      <Button
        type="submit"
        variant="primary"
        className="self-start"
        busy={record.isPending}
        icon={<Save aria-hidden="true" className="size-4" />}
      >
        Record the run
      </Button>
      {confirmation.dialog}
    </form>
  );
}

function RecordLoader({ run }: { run: Run }) {
  const procedure = useProcedure(run.procedure.id);
  const plan = usePlan(run.planId ?? undefined);
  if (run.status === 'recorded') {
    return (
      <Notice tone="info" title="This run is already recorded">
        <Link to={paths.run(run.id)} className="text-accent-700 underline">
          See run #{run.id}
        </Link>
      </Notice>
    );
  }
  if (procedure.isPending || (run.planId !== null && plan.isPending)) {
    return <PageSpinner label="Loading the procedure…" />;
  }
  if (procedure.isError) return <Notice tone="danger">{errorMessage(procedure.error)}</Notice>;
  return (
    <div className="flex flex-col gap-5">
      <BackLink to={run.planId ? paths.plan(run.planId) : paths.procedure(procedure.data.id)}>
        {run.planId ? `Plan #${run.planId}` : procedure.data.title}
      </BackLink>
      <PageHeader eyebrow={`Run #${run.id}`} title={`Record: ${procedure.data.title}`}>
        At factor {fullPrecision(run.scaleFactor)} of the base scale
        {run.planId ? `, from plan #${run.planId}` : ', without a plan'}.
      </PageHeader>
      <PreparationSafety
        hazards={plan.data?.hazards ?? procedureHazards(procedure.data)}
        cautions={
          plan.data?.cautions ?? {
            text: procedure.data.cautions,
            flags: procedure.data.cautionFlags,
          }
        }
      />
      <RecordForm run={run} procedure={procedure.data} plan={plan.data} />
    </div>
  );
}

export function RunRecordPage() {
  const id = Number(useParams().id);
  const run = useRun(id);
  return (
    <QueryState query={run} what="run">
      {(data) => <RecordLoader run={data} />}
    </QueryState>
  );
}
