import { useMemo } from 'react';
import { useFieldArray, useForm, useWatch, type Control } from 'react-hook-form';
import {
  procedureCreateSchema,
  tryProcedureStoichiometry,
  type LineChemicalFacts,
  type ProcedureCreateParsed,
} from '@lotwise/shared';
import { Calculator, CircleAlert, Plus, Save } from 'lucide-react';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { Field, FieldError, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Checkbox, Input, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { cautionMeta } from './preparation-safety';
import {
  draftOf,
  emptyLine,
  formPath,
  procedureResolver,
  toProcedureBody,
  type ProcedureFormValues,
} from './procedure-form-values';
import { LineFields } from './procedure-line-fields';
import { StepsEditor } from './procedure-step-fields';
import { StoichiometryTable } from './stoichiometry-table';

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
          {(['exothermicAddition', 'flammableSolvent', 'toxicGas', 'fumeHood'] as const).map(
            (name) => (
              <label key={name} className="flex items-center gap-2">
                <Checkbox {...register(name)} />
                {cautionMeta[name].label}
              </label>
            ),
          )}
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

      <StepsEditor control={control} register={register} errors={errors.steps} />

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
