import { useMemo } from 'react';
import {
  Controller,
  useFieldArray,
  useForm,
  useWatch,
  type Control,
  type FieldErrors,
  type Resolver,
} from 'react-hook-form';
import {
  coefficientRoles,
  lineRoles,
  procedureCreateSchema,
  tryProcedureStoichiometry,
  type LineChemicalFacts,
  type LineRole,
  type Procedure,
  type ProcedureCreate,
  type ProcedureCreateParsed,
  type ProcedureLineDraft,
} from '@lotwise/shared';
import { Calculator, CircleAlert, Plus, Save, Trash2 } from 'lucide-react';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { Field, FieldError, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Checkbox, Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { parseDecimal } from '../../../lib/numbers';
import { roleLabels } from '../labels';
import { LineChemicalPicker, type PickedChemical } from './line-chemical-picker';
import { StoichiometryTable } from './stoichiometry-table';

const units = ['g', 'mg', 'kg', 'mL', 'L', 'µL', 'mmol', 'mol'] as const;
const measuredUnits = ['g', 'mg', 'kg', 'mL', 'L'] as const;

type SolutionKind = 'neat' | 'molarity' | 'percentWw' | 'dissolved';

export interface LineFormValues {
  chemical: PickedChemical | null;
  role: LineRole;
  quantity: string;
  unit: string;
  coefficient: string;
  optional: boolean;
  notes: string;
  solution: SolutionKind;
  concentration: string;
  solutionDensity: string;
  dissolvedChemical: PickedChemical | null;
  dissolvedQuantity: string;
  dissolvedUnit: string;
}

/** The form holds text as typed; numbers are read from it when checking and saving. */
export interface ProcedureFormValues {
  title: string;
  reference: string;
  baseScale: string;
  expectedYieldPercent: string;
  meltingLow: string;
  meltingHigh: string;
  cautions: string;
  exothermicAddition: boolean;
  keepBelowC: string;
  flammableSolvent: boolean;
  toxicGas: boolean;
  fumeHood: boolean;
  lines: LineFormValues[];
}

export const emptyLine = (role: LineRole = 'reagent'): LineFormValues => ({
  chemical: null,
  role,
  quantity: '',
  unit: role === 'product' ? '' : 'g',
  coefficient: '',
  optional: false,
  notes: '',
  solution: 'neat',
  concentration: '',
  solutionDensity: '',
  dissolvedChemical: null,
  dissolvedQuantity: '',
  dissolvedUnit: 'mL',
});

export const emptyProcedure: ProcedureFormValues = {
  title: '',
  reference: '',
  baseScale: '',
  expectedYieldPercent: '',
  meltingLow: '',
  meltingHigh: '',
  cautions: '',
  exothermicAddition: false,
  keepBelowC: '',
  flammableSolvent: false,
  toxicGas: false,
  fumeHood: false,
  lines: [emptyLine('limiting-reagent'), emptyLine('reagent'), emptyLine('product')],
};

const text = (value: number | null | undefined) =>
  value === null || value === undefined ? '' : String(value);

export function procedureToFormValues(procedure: Procedure): ProcedureFormValues {
  return {
    title: procedure.title,
    reference: procedure.reference,
    baseScale: procedure.baseScale,
    expectedYieldPercent: text(procedure.expectedYieldPercent),
    meltingLow: text(procedure.literatureMeltingC?.low),
    meltingHigh: text(procedure.literatureMeltingC?.high),
    cautions: procedure.cautions,
    exothermicAddition: procedure.cautionFlags.exothermicAddition,
    keepBelowC: text(procedure.cautionFlags.keepBelowC),
    flammableSolvent: procedure.cautionFlags.flammableSolvent,
    toxicGas: procedure.cautionFlags.toxicGas,
    fumeHood: procedure.cautionFlags.fumeHood,
    lines: procedure.lines.map((line) => ({
      chemical: line.chemical,
      role: line.role,
      quantity: text(line.quantity),
      unit: line.unit ?? '',
      coefficient: text(line.coefficient),
      optional: line.optional,
      notes: line.notes,
      solution: line.dissolvedIn
        ? 'dissolved'
        : line.concentration
          ? 'molarity' in line.concentration
            ? 'molarity'
            : 'percentWw'
          : 'neat',
      concentration: line.concentration
        ? String(
            'molarity' in line.concentration
              ? line.concentration.molarity
              : line.concentration.percentWw,
          )
        : '',
      solutionDensity: text(line.solutionDensity),
      dissolvedChemical: line.dissolvedIn
        ? {
            id: line.dissolvedIn.chemicalId,
            name: line.dissolvedIn.chemicalName,
            formula: null,
            molarMass: null,
            density: null,
            defaultPurityPercent: 100,
            stockUnit: 'mL',
            ghsPictograms: [],
            hazardStatements: [],
          }
        : null,
      dissolvedQuantity: line.dissolvedIn ? String(line.dissolvedIn.quantity) : '',
      dissolvedUnit: line.dissolvedIn?.unit ?? 'mL',
    })),
  };
}

/** Empty text is "not given"; anything else goes to the schema as a number (NaN fails it). */
const number = (value: string) => parseDecimal(value) ?? null;
const optionalNumber = (value: string) => {
  const n = parseDecimal(value);
  return n === null ? null : n;
};

function concentrationOf(line: LineFormValues) {
  if (line.solution === 'molarity') return { molarity: number(line.concentration) ?? Number.NaN };
  if (line.solution === 'percentWw') return { percentWw: number(line.concentration) ?? Number.NaN };
  return null;
}

/** The form's text as the body `POST /api/procedures` takes. */
export function toProcedureBody(values: ProcedureFormValues): ProcedureCreate {
  const low = optionalNumber(values.meltingLow);
  const high = optionalNumber(values.meltingHigh);
  return {
    title: values.title,
    reference: values.reference,
    baseScale: values.baseScale,
    expectedYieldPercent: optionalNumber(values.expectedYieldPercent),
    literatureMeltingC:
      low === null && high === null ? null : { low: low ?? Number.NaN, high: high ?? Number.NaN },
    cautions: values.cautions,
    cautionFlags: {
      exothermicAddition: values.exothermicAddition,
      keepBelowC: optionalNumber(values.keepBelowC),
      flammableSolvent: values.flammableSolvent,
      toxicGas: values.toxicGas,
      fumeHood: values.fumeHood,
    },
    lines: values.lines.map((line) => ({
      chemicalId: line.chemical?.id as number,
      role: line.role,
      quantity: optionalNumber(line.quantity),
      unit: line.unit || null,
      coefficient: coefficientRoles.includes(line.role) ? optionalNumber(line.coefficient) : null,
      optional: line.optional,
      notes: line.notes,
      concentration: concentrationOf(line),
      solutionDensity:
        line.solution === 'molarity' || line.solution === 'percentWw'
          ? optionalNumber(line.solutionDensity)
          : null,
      dissolvedIn:
        line.solution === 'dissolved'
          ? {
              chemicalId: line.dissolvedChemical?.id as number,
              quantity: number(line.dissolvedQuantity) ?? Number.NaN,
              unit: line.dissolvedUnit,
            }
          : null,
    })),
  };
}

/** Where a schema issue lands in the form (the body and the form name a few things apart). */
function formPath(path: readonly PropertyKey[]): string[] {
  const parts = path.map(String);
  if (parts[0] === 'lines' && parts.length === 1) return ['lines', 'root'];
  if (parts[0] === 'lines' && parts[2] === 'chemicalId') return ['lines', parts[1]!, 'chemical'];
  if (parts[0] === 'lines' && parts[2] === 'dissolvedIn') {
    const field = parts[3] === 'chemicalId' ? 'dissolvedChemical' : 'dissolvedQuantity';
    return ['lines', parts[1]!, parts[3] === 'unit' ? 'dissolvedUnit' : field];
  }
  if (parts[0] === 'lines' && parts[2] === 'concentration')
    return ['lines', parts[1]!, 'concentration'];
  if (parts[0] === 'literatureMeltingC') return [parts[1] === 'low' ? 'meltingLow' : 'meltingHigh'];
  if (parts[0] === 'cautionFlags') return [parts[1] ?? 'keepBelowC'];
  return parts;
}

function setIn(target: Record<string, unknown>, path: string[], value: unknown) {
  let node = target;
  path.slice(0, -1).forEach((key) => {
    node[key] ??= {};
    node = node[key] as Record<string, unknown>;
  });
  const last = path[path.length - 1]!;
  node[last] ??= value;
}

/** The shared schema the server applies, run on the form's text. */
const procedureResolver: Resolver<ProcedureFormValues> = async (values) => {
  const parsed = procedureCreateSchema.safeParse(toProcedureBody(values));
  if (parsed.success) return { values, errors: {} };
  const errors: Record<string, unknown> = {};
  for (const issue of parsed.error.issues) {
    const message =
      issue.code === 'invalid_type' && issue.expected === 'number'
        ? 'must be a number'
        : issue.message;
    setIn(errors, formPath(issue.path), { type: 'validation', message });
  }
  return { values: {}, errors: errors as FieldErrors<ProcedureFormValues> };
};

/** What the live calculation reads of one line as it is being typed (unreadable = missing). */
function draftOf(line: LineFormValues): ProcedureLineDraft {
  const positive = (value: string) => {
    const n = parseDecimal(value);
    return n === null || Number.isNaN(n) ? null : n;
  };
  const concentrationValue = positive(line.concentration);
  return {
    chemicalId: line.chemical?.id ?? null,
    role: line.role,
    quantity: positive(line.quantity),
    unit: line.unit || null,
    coefficient: coefficientRoles.includes(line.role) ? positive(line.coefficient) : null,
    concentration:
      concentrationValue === null
        ? null
        : line.solution === 'molarity'
          ? { molarity: concentrationValue }
          : line.solution === 'percentWw'
            ? { percentWw: concentrationValue }
            : null,
    solutionDensity:
      line.solution === 'molarity' || line.solution === 'percentWw'
        ? positive(line.solutionDensity)
        : null,
  };
}

/**
 * The stoichiometry of the lines as typed, by `tryProcedureStoichiometry` from the shared
 * contract — the function the server runs on save, so the preview is the saved result.
 */
function LivePreview({ control }: { control: Control<ProcedureFormValues> }) {
  const lines = useWatch({ control, name: 'lines' });
  const preview = useMemo(() => {
    const facts = new Map<number, LineChemicalFacts>();
    for (const line of lines) {
      if (line.chemical) facts.set(line.chemical.id, line.chemical);
    }
    return tryProcedureStoichiometry(lines.map(draftOf), facts);
  }, [lines]);
  const rows = lines.map((line, index) => ({
    name: line.chemical?.name ?? `Line ${index + 1}`,
    role: line.role,
    amount: line.quantity && line.unit ? `${line.quantity} ${line.unit}` : '—',
    optional: line.optional,
  }));

  return (
    <section
      aria-labelledby="live-calc-heading"
      aria-live="polite"
      className="flex flex-col gap-2 rounded-lg border border-accent-200 bg-accent-50/40 px-4 py-3"
    >
      <h2 id="live-calc-heading" className="flex items-center gap-2 text-base font-semibold">
        <Calculator aria-hidden="true" className="size-4 text-accent-600" />
        Calculation, as you type
      </h2>
      {preview.ok ? (
        <StoichiometryTable result={preview.value} rows={rows} label="Live calculation" />
      ) : (
        <p className="flex items-start gap-2 text-sm text-warn-700">
          <CircleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
          <span>{preview.error.message}</span>
        </p>
      )}
    </section>
  );
}

function LineFields({
  control,
  index,
  errors,
  onRemove,
  removable,
}: {
  control: Control<ProcedureFormValues>;
  index: number;
  errors: FieldErrors<LineFormValues> | undefined;
  onRemove: () => void;
  removable: boolean;
}) {
  const role = useWatch({ control, name: `lines.${index}.role` });
  const solution = useWatch({ control, name: `lines.${index}.solution` });
  const label = `Line ${index + 1}`;
  const err = (name: keyof LineFormValues, field: string) =>
    fieldMessage(field, errors?.[name]?.message as string | undefined);

  return (
    <li
      aria-label={label}
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <div className="flex items-center justify-between">
        <h3 className="text-sm font-semibold text-ink-900">{label}</h3>
        {removable && (
          <Button
            size="sm"
            variant="ghost"
            icon={<Trash2 aria-hidden="true" className="size-4" />}
            aria-label={`Remove ${label}`}
            onClick={onRemove}
          >
            Remove
          </Button>
        )}
      </div>
      <div className="grid gap-3 lg:grid-cols-[minmax(16rem,3fr)_minmax(8rem,1.2fr)_minmax(5rem,0.8fr)_minmax(4.5rem,0.6fr)_minmax(5rem,0.7fr)]">
        <Field label="Chemical" error={err('chemical', 'Chemical')}>
          {(props) => (
            <Controller
              control={control}
              name={`lines.${index}.chemical`}
              render={({ field }) => (
                <LineChemicalPicker
                  id={props.id}
                  describedBy={props['aria-describedby']}
                  invalid={props['aria-invalid']}
                  value={field.value}
                  onChange={field.onChange}
                  label={label}
                />
              )}
            />
          )}
        </Field>
        <Field label="Role" error={err('role', 'Role')}>
          {(props) => (
            <Controller
              control={control}
              name={`lines.${index}.role`}
              render={({ field }) => (
                <Select {...props} value={field.value} onChange={field.onChange}>
                  {lineRoles.map((r) => (
                    <option key={r} value={r}>
                      {roleLabels[r]}
                    </option>
                  ))}
                </Select>
              )}
            />
          )}
        </Field>
        <Field
          label="Amount"
          optional={role === 'product'}
          hint={role === 'product' ? 'Empty: Lotwise works out the yield' : undefined}
          error={err('quantity', 'Amount')}
        >
          {(props) => (
            <Controller
              control={control}
              name={`lines.${index}.quantity`}
              render={({ field }) => <AmountInput {...props} {...field} />}
            />
          )}
        </Field>
        <Field label="Unit" error={err('unit', 'Unit')}>
          {(props) => (
            <Controller
              control={control}
              name={`lines.${index}.unit`}
              render={({ field }) => (
                <Select {...props} value={field.value} onChange={field.onChange}>
                  <option value="">—</option>
                  {units.map((u) => (
                    <option key={u}>{u}</option>
                  ))}
                </Select>
              )}
            />
          )}
        </Field>
        {coefficientRoles.includes(role) ? (
          <Field label="Coefficient ν" hint="1 if empty" error={err('coefficient', 'Coefficient')}>
            {(props) => (
              <Controller
                control={control}
                name={`lines.${index}.coefficient`}
                render={({ field }) => <AmountInput {...props} {...field} />}
              />
            )}
          </Field>
        ) : (
          <div className="hidden lg:block" />
        )}
      </div>
      <div className="grid gap-3 md:grid-cols-[14rem_repeat(3,minmax(0,1fr))] md:items-end">
        <Field label="Measured as">
          {(props) => (
            <Controller
              control={control}
              name={`lines.${index}.solution`}
              render={({ field }) => (
                <Select {...props} value={field.value} onChange={field.onChange}>
                  <option value="neat">The chemical itself</option>
                  <option value="molarity">A solution of known molarity</option>
                  <option value="percentWw">A solution in % w/w</option>
                  {role !== 'product' && (
                    <option value="dissolved">Dissolved in a solvent first</option>
                  )}
                </Select>
              )}
            />
          )}
        </Field>
        {(solution === 'molarity' || solution === 'percentWw') && (
          <>
            <Field
              label={solution === 'molarity' ? 'Molarity (mol/L)' : 'Strength (% w/w)'}
              error={err('concentration', 'Concentration')}
            >
              {(props) => (
                <Controller
                  control={control}
                  name={`lines.${index}.concentration`}
                  render={({ field }) => <AmountInput {...props} {...field} />}
                />
              )}
            </Field>
            <Field
              label="Solution density (g/mL)"
              optional
              hint="When it differs from the chemical's"
              error={err('solutionDensity', 'Solution density')}
            >
              {(props) => (
                <Controller
                  control={control}
                  name={`lines.${index}.solutionDensity`}
                  render={({ field }) => <AmountInput {...props} {...field} />}
                />
              )}
            </Field>
          </>
        )}
        {solution === 'dissolved' && (
          <>
            <Field
              label="Solvent"
              error={err('dissolvedChemical', 'Solvent')}
              className="md:col-span-2"
            >
              {(props) => (
                <Controller
                  control={control}
                  name={`lines.${index}.dissolvedChemical`}
                  render={({ field }) => (
                    <LineChemicalPicker
                      id={props.id}
                      describedBy={props['aria-describedby']}
                      invalid={props['aria-invalid']}
                      value={field.value}
                      onChange={field.onChange}
                      label={`the solvent of ${label}`}
                    />
                  )}
                />
              )}
            </Field>
            <div className="grid grid-cols-2 gap-2">
              <Field label="Solvent amount" error={err('dissolvedQuantity', 'Solvent amount')}>
                {(props) => (
                  <Controller
                    control={control}
                    name={`lines.${index}.dissolvedQuantity`}
                    render={({ field }) => <AmountInput {...props} {...field} />}
                  />
                )}
              </Field>
              <Field label="Solvent unit">
                {(props) => (
                  <Controller
                    control={control}
                    name={`lines.${index}.dissolvedUnit`}
                    render={({ field }) => (
                      <Select {...props} value={field.value} onChange={field.onChange}>
                        {measuredUnits.map((u) => (
                          <option key={u}>{u}</option>
                        ))}
                      </Select>
                    )}
                  />
                )}
              </Field>
            </div>
          </>
        )}

        <Controller
          control={control}
          name={`lines.${index}.optional`}
          render={({ field }) => (
            <label className="flex items-center gap-2 pb-2 text-sm text-ink-800">
              <Checkbox
                checked={field.value}
                onChange={(event) => field.onChange(event.target.checked)}
              />
              Optional line
            </label>
          )}
        />
        <Field
          label="Notes"
          optional
          error={err('notes', 'Notes')}
          className={solution === 'neat' ? 'md:col-span-2' : 'md:col-span-3'}
        >
          {(props) => (
            <Controller
              control={control}
              name={`lines.${index}.notes`}
              render={({ field }) => <Input {...props} {...field} />}
            />
          )}
        </Field>
      </div>
    </li>
  );
}

/**
 * Create or edit a procedure. The shared schema checks it; the calculation beside the lines
 * updates on every keystroke through the same shared function the server uses.
 */
export function ProcedureForm({
  defaultValues,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  defaultValues: ProcedureFormValues;
  submitLabel: string;
  onSubmit: (body: ProcedureCreateParsed) => Promise<unknown>;
  onCancel: () => void;
}) {
  const {
    control,
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ProcedureFormValues>({
    resolver: procedureResolver,
    defaultValues,
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const { fields, append, remove } = useFieldArray({ control, name: 'lines' });

  const submit = handleSubmit(async (values) => {
    try {
      await onSubmit(procedureCreateSchema.parse(toProcedureBody(values)));
    } catch (error) {
      if (!isApiError(error)) {
        setError('root.server', {
          message: 'Something went wrong. Your changes are still here; try again.',
        });
        return;
      }
      for (const [path, message] of Object.entries(error.fields)) {
        setError(formPath(path.split('.')).join('.') as 'title', { type: 'server', message });
      }
      setError('root.server', { message: `${error.message} Nothing was saved.` });
    }
  });

  const message = (name: keyof ProcedureFormValues, label: string) =>
    fieldMessage(label, errors[name]?.message as string | undefined);

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-6" aria-label="Procedure">
      <SafetyCaution />
      <fieldset className="flex flex-col gap-4 rounded-lg border border-ink-200 bg-white px-4 py-3">
        <legend className="px-1 text-base font-semibold">The procedure</legend>
        <Field label="Title" error={message('title', 'Title')}>
          {(props) => <Input {...props} {...register('title')} />}
        </Field>
        <Field label="Literature reference" optional>
          {(props) => <Textarea {...props} rows={2} {...register('reference')} />}
        </Field>
        <div className="grid gap-4 md:grid-cols-4">
          <Field
            label="Base scale"
            optional
            hint="e.g. One bench: 2.0 g salicylic acid"
            className="md:col-span-2"
          >
            {(props) => <Input {...props} {...register('baseScale')} />}
          </Field>
          <Field
            label="Expected yield (%)"
            optional
            error={message('expectedYieldPercent', 'Expected yield')}
          >
            {(props) => <AmountInput {...props} {...register('expectedYieldPercent')} />}
          </Field>
          <div className="grid grid-cols-2 gap-2">
            <Field label="Lit. m.p. from (°C)" optional error={message('meltingLow', 'It')}>
              {(props) => <AmountInput {...props} {...register('meltingLow')} />}
            </Field>
            <Field label="to (°C)" optional error={message('meltingHigh', 'It')}>
              {(props) => <AmountInput {...props} {...register('meltingHigh')} />}
            </Field>
          </div>
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3">
        <legend className="px-1 text-base font-semibold">Cautions</legend>
        <div className="flex flex-wrap gap-x-6 gap-y-2 text-sm text-ink-800">
          {(
            [
              ['exothermicAddition', 'Exothermic addition'],
              ['flammableSolvent', 'Flammable solvent'],
              ['toxicGas', 'Gives off a toxic gas'],
              ['fumeHood', 'Needs a fume hood'],
            ] as const
          ).map(([name, words]) => (
            <label key={name} className="flex items-center gap-2">
              <Checkbox {...register(name)} />
              {words}
            </label>
          ))}
          <Field
            label="Keep below (°C)"
            optional
            error={message('keepBelowC', 'It')}
            className="w-36"
          >
            {(props) => <AmountInput {...props} {...register('keepBelowC')} />}
          </Field>
        </div>
        <Field label="Cautions in words" optional>
          {(props) => <Textarea {...props} rows={3} {...register('cautions')} />}
        </Field>
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-base font-semibold">Lines at base scale</legend>
        <ol className="flex flex-col gap-3">
          {fields.map((field, index) => (
            <LineFields
              key={field.id}
              control={control}
              index={index}
              errors={errors.lines?.[index]}
              removable={fields.length > 1}
              onRemove={() => remove(index)}
            />
          ))}
        </ol>
        {errors.lines?.root?.message && <FieldError>{errors.lines.root.message}</FieldError>}
        <Button
          className="self-start"
          icon={<Plus aria-hidden="true" className="size-4" />}
          onClick={() => append(emptyLine())}
        >
          Add a line
        </Button>
      </fieldset>

      <LivePreview control={control} />

      {errors.root?.server?.message && (
        <Notice tone="danger" title="Not saved">
          {errors.root.server.message}
        </Notice>
      )}
      <div className="flex gap-2">
        <Button
          type="submit"
          variant="primary"
          busy={isSubmitting}
          icon={<Save aria-hidden="true" className="size-4" />}
        >
          {submitLabel}
        </Button>
        <Button onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
