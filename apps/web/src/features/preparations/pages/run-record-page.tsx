import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import { Plus, Save } from 'lucide-react';
import {
  runRecordSchema,
  type PlanDetail,
  type Procedure,
  type Run,
  type RunRecord,
} from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { todayIsoDate } from '../../../lib/dates';
import { formatAmount } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';
import { paths } from '../../../config/paths';
import { useLocations, usePlan, useProcedure, useRecordRun, useRun } from '../api';
import { roleLabels } from '../labels';
import { ContainerDraw, drawBody, newDraw, type DrawValues } from '../components/container-draw';
import { LineChemicalPicker, type PickedChemical } from '../components/line-chemical-picker';
import { BackLink, PageHeader, QueryState, Section } from '../components/page-parts';
import { PreparationSafety, procedureHazards } from '../components/preparation-safety';
import { fullPrecision } from '../components/rounded';

interface ExtraDraw {
  key: string;
  chemical: PickedChemical | null;
  purpose: string;
  draw: DrawValues;
}

interface PortionValues {
  key: string;
  label: string;
  quantity: string;
  unit: string;
  locationId: string;
  tareMass: string;
  notes: string;
}

let nextKey = 1;
const newPortion = (label: string, unit: string, locationId = ''): PortionValues => ({
  key: `portion-${nextKey++}`,
  label,
  quantity: '',
  unit,
  locationId,
  tareMass: '',
  notes: '',
});

/** Draws to start from: the containers the plan suggested, else one empty draw per line. */
function initialDraws(procedure: Procedure, plan: PlanDetail | undefined) {
  const draws: Record<number, DrawValues[]> = {};
  for (const line of procedure.lines) {
    if (line.role === 'product') continue;
    const check = plan?.stockCheck.lines.find(
      (l) => l.lineIndex === line.index && l.purpose === 'line',
    );
    const fromPlan = check?.take.map((take) => newDraw(String(take.containerId), check.unit)) ?? [];
    draws[line.index] = fromPlan.length > 0 ? fromPlan : [newDraw('', line.chemical.stockUnit)];
  }
  return draws;
}

/** Where a schema issue is, in words a person recognises. */
function issuePlace(path: readonly PropertyKey[], procedure: Procedure, body: RunRecord): string {
  const [section, index, , drawIndex] = path;
  if (section === 'lines' && typeof index === 'number') {
    const lineIndex = body.lines?.[index]?.lineIndex ?? 0;
    const name = procedure.lines[lineIndex]?.chemical.name ?? '';
    return `Line ${lineIndex + 1} (${name}), draw ${Number(drawIndex ?? 0) + 1}`;
  }
  if (section === 'extraDraws' && typeof index === 'number') return `Extra draw ${index + 1}`;
  if (section === 'products') {
    const portion = path[3];
    return typeof portion === 'number' ? `Portion ${portion + 1}` : 'Product';
  }
  if (section === 'observations') return 'Observations';
  return String(section ?? 'Record');
}

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
  const locations = useLocations();
  const product = procedure.lines.find((line) => line.role === 'product');
  const productUnit = product?.chemical.stockUnit ?? 'g';
  const [performedOn, setPerformedOn] = useState(todayIsoDate());
  const [draws, setDraws] = useState(() => initialDraws(procedure, plan));
  const [extras, setExtras] = useState<ExtraDraw[]>([]);
  const [crude, setCrude] = useState('');
  const [portions, setPortions] = useState<PortionValues[]>(() => [
    newPortion('first crop', productUnit),
  ]);
  const [meltingLow, setMeltingLow] = useState('');
  const [meltingHigh, setMeltingHigh] = useState('');
  const [appearance, setAppearance] = useState('');
  const [notes, setNotes] = useState('');
  const [problems, setProblems] = useState<string[]>([]);

  const setPortion = (key: string, patch: Partial<PortionValues>) =>
    setPortions((all) => all.map((p) => (p.key === key ? { ...p, ...patch } : p)));

  function buildBody(): RunRecord {
    const low = parseDecimal(meltingLow);
    const high = parseDecimal(meltingHigh);
    return {
      performedOn,
      lines: Object.entries(draws)
        .map(([lineIndex, list]) => ({
          lineIndex: Number(lineIndex),
          draws: list.map(drawBody).filter((d) => d !== null),
        }))
        .filter((line) => line.draws.length > 0),
      extraDraws: extras
        .map((extra) => {
          const body = drawBody(extra.draw);
          return body ? { ...body, purpose: extra.purpose } : null;
        })
        .filter((d) => d !== null),
      products: product
        ? [
            {
              lineIndex: product.index,
              crudeMassG: parseDecimal(crude),
              portions: portions.map((p) => ({
                label: p.label,
                quantity: parseDecimal(p.quantity) ?? (undefined as unknown as number),
                unit: p.unit,
                locationId: p.locationId ? Number(p.locationId) : (undefined as unknown as number),
                tareMass: parseDecimal(p.tareMass),
                notes: p.notes,
              })),
            },
          ]
        : [],
      observations: {
        meltingRangeC:
          low === null && high === null
            ? null
            : { low: low ?? Number.NaN, high: high ?? low ?? Number.NaN },
        appearance,
        notes,
      },
    };
  }

  async function handleSubmit(event: FormEvent) {
    event.preventDefault();
    const body = buildBody();
    const parsed = runRecordSchema.safeParse(body);
    if (!parsed.success) {
      setProblems(
        parsed.error.issues.map(
          (issue) => `${issuePlace(issue.path, procedure, body)}: ${issue.message}`,
        ),
      );
      return;
    }
    setProblems([]);
    try {
      await record.mutateAsync(body);
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

      <Section id="used-heading" title="What was really used">
        <p className="text-sm text-ink-600">
          Name the container each amount came from. Weighing the container before and after is the
          most exact: the tare cancels out. A line left empty counts as its planned amount.
        </p>
        <ol className="flex flex-col gap-3">
          {procedure.lines
            .filter((line) => line.role !== 'product')
            .map((line) => {
              const planned =
                line.quantity !== null && line.unit
                  ? `planned ${formatAmount(line.quantity * run.scaleFactor, line.unit)}`
                  : undefined;
              return (
                <li
                  key={line.index}
                  aria-label={`Line ${line.index + 1}: ${line.chemical.name}`}
                  className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-white px-4 py-3"
                >
                  <p className="text-sm">
                    <span className="font-semibold text-ink-900">
                      {line.index + 1}. {line.chemical.name}
                    </span>{' '}
                    <span className="text-ink-600">
                      {roleLabels[line.role]}
                      {planned && ` · ${planned}`}
                      {line.optional && ' · optional'}
                    </span>
                  </p>
                  {(draws[line.index] ?? []).map((draw, drawIndex) => (
                    <ContainerDraw
                      key={draw.key}
                      chemicalId={line.chemicalId}
                      value={draw}
                      label={`Line ${line.index + 1} draw ${drawIndex + 1}`}
                      plannedHint={drawIndex === 0 ? planned : undefined}
                      onChange={(next) =>
                        setDraws((all) => ({
                          ...all,
                          [line.index]: all[line.index]!.map((d) =>
                            d.key === draw.key ? next : d,
                          ),
                        }))
                      }
                      onRemove={() =>
                        setDraws((all) => ({
                          ...all,
                          [line.index]: all[line.index]!.filter((d) => d.key !== draw.key),
                        }))
                      }
                    />
                  ))}
                  <Button
                    size="sm"
                    className="self-start"
                    icon={<Plus aria-hidden="true" className="size-4" />}
                    onClick={() =>
                      setDraws((all) => ({
                        ...all,
                        [line.index]: [
                          ...(all[line.index] ?? []),
                          newDraw('', line.chemical.stockUnit),
                        ],
                      }))
                    }
                  >
                    Another container for {line.chemical.name}
                  </Button>
                </li>
              );
            })}
        </ol>
      </Section>

      <Section id="extra-heading" title="Extra draws">
        <p className="text-sm text-ink-600">
          Anything used that is not a line of the procedure, e.g. solvent to recrystallize from.
        </p>
        {extras.map((extra, index) => (
          <div
            key={extra.key}
            className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-white px-4 py-3"
          >
            <div className="grid gap-3 md:grid-cols-2">
              <Field label={`Extra draw ${index + 1}: chemical`}>
                {(props) => (
                  <LineChemicalPicker
                    id={props.id}
                    label={`extra draw ${index + 1}`}
                    value={extra.chemical}
                    onChange={(chemical) =>
                      setExtras((all) =>
                        all.map((e) =>
                          e.key === extra.key
                            ? { ...e, chemical, draw: newDraw('', chemical?.stockUnit ?? 'mL') }
                            : e,
                        ),
                      )
                    }
                  />
                )}
              </Field>
              <Field label="What for">
                {(props) => (
                  <Input
                    {...props}
                    value={extra.purpose}
                    onChange={(event) =>
                      setExtras((all) =>
                        all.map((e) =>
                          e.key === extra.key ? { ...e, purpose: event.target.value } : e,
                        ),
                      )
                    }
                  />
                )}
              </Field>
            </div>
            {extra.chemical && (
              <ContainerDraw
                chemicalId={extra.chemical.id}
                value={extra.draw}
                label={`Extra draw ${index + 1}`}
                onChange={(draw) =>
                  setExtras((all) => all.map((e) => (e.key === extra.key ? { ...e, draw } : e)))
                }
                onRemove={() => setExtras((all) => all.filter((e) => e.key !== extra.key))}
              />
            )}
          </div>
        ))}
        <Button
          size="sm"
          className="self-start"
          icon={<Plus aria-hidden="true" className="size-4" />}
          onClick={() =>
            setExtras((all) => [
              ...all,
              {
                key: `extra-${nextKey++}`,
                chemical: null,
                purpose: 'recrystallization solvent',
                draw: newDraw('', 'mL'),
              },
            ])
          }
        >
          Add an extra draw
        </Button>
      </Section>

      {product && (
        <Section id="product-heading" title={`What was obtained: ${product.chemical.name}`}>
          <p className="text-sm text-ink-600">
            Each portion put into stock becomes its own prepared lot in a new labelled container,
            linked to this run and to the lots it was made from.
          </p>
          <Field label="Crude mass (g), before purifying" optional className="w-60">
            {(props) => (
              <Input
                {...props}
                inputMode="decimal"
                value={crude}
                onChange={(event) => setCrude(event.target.value)}
              />
            )}
          </Field>
          <ol className="flex flex-col gap-2">
            {portions.map((portion, index) => (
              <li
                key={portion.key}
                aria-label={`Portion ${index + 1}`}
                className="grid gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3 md:grid-cols-[2fr_1fr_0.7fr_3fr_1fr_auto] md:items-end"
              >
                <Field label="Portion">
                  {(props) => (
                    <Input
                      {...props}
                      value={portion.label}
                      onChange={(event) => setPortion(portion.key, { label: event.target.value })}
                    />
                  )}
                </Field>
                <Field label="Amount">
                  {(props) => (
                    <Input
                      {...props}
                      inputMode="decimal"
                      value={portion.quantity}
                      onChange={(event) =>
                        setPortion(portion.key, { quantity: event.target.value })
                      }
                    />
                  )}
                </Field>
                <Field label="Unit">
                  {(props) => (
                    <Select
                      {...props}
                      value={portion.unit}
                      onChange={(event) => setPortion(portion.key, { unit: event.target.value })}
                    >
                      {['g', 'mg', 'mL'].map((u) => (
                        <option key={u}>{u}</option>
                      ))}
                    </Select>
                  )}
                </Field>
                <Field label="Location">
                  {(props) => (
                    <Select
                      {...props}
                      value={portion.locationId}
                      onChange={(event) =>
                        setPortion(portion.key, { locationId: event.target.value })
                      }
                    >
                      <option value="">
                        {locations.isPending ? 'Loading locations…' : 'Choose a location'}
                      </option>
                      {locations.data?.items.map((location) => (
                        <option key={location.id} value={location.id}>
                          {location.path}
                        </option>
                      ))}
                    </Select>
                  )}
                </Field>
                <Field label="Container tare (g)" optional>
                  {(props) => (
                    <Input
                      {...props}
                      inputMode="decimal"
                      value={portion.tareMass}
                      onChange={(event) =>
                        setPortion(portion.key, { tareMass: event.target.value })
                      }
                    />
                  )}
                </Field>
                {portions.length > 1 ? (
                  <Button
                    size="sm"
                    variant="ghost"
                    onClick={() => setPortions((all) => all.filter((p) => p.key !== portion.key))}
                  >
                    Remove
                  </Button>
                ) : (
                  <span />
                )}
              </li>
            ))}
          </ol>
          <Button
            size="sm"
            className="self-start"
            icon={<Plus aria-hidden="true" className="size-4" />}
            onClick={() =>
              setPortions((all) => [
                ...all,
                newPortion(
                  all.length === 1
                    ? 'second crop (from the mother liquor)'
                    : `crop ${all.length + 1}`,
                  productUnit,
                  all[all.length - 1]?.locationId ?? '',
                ),
              ])
            }
          >
            {portions.length === 1 ? 'Add a second crop' : 'Add another portion'}
          </Button>
        </Section>
      )}

      <Section id="observations-heading" title="Observations">
        <div className="grid gap-3 md:grid-cols-[auto_auto_1fr] md:items-end">
          <Field label="Melting range from (°C)" optional className="w-44">
            {(props) => (
              <Input
                {...props}
                inputMode="decimal"
                value={meltingLow}
                onChange={(event) => setMeltingLow(event.target.value)}
              />
            )}
          </Field>
          <Field label="Melting range to (°C)" optional className="w-44">
            {(props) => (
              <Input
                {...props}
                inputMode="decimal"
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
