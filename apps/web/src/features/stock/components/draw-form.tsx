import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Calculator, CircleCheck, Scale } from 'lucide-react';
import { drawSchema, type ContainerDetail, type Draw } from '@lotwise/shared';
import { ContainerHolds, freeOf } from '../../../components/holds/container-holds';
import { Button } from '../../../components/ui/button';
import { useConfirmation } from '../../../components/ui/confirmation-dialog';
import { WasteContainerSelect } from '../../../components/waste/waste-destination';
import { Field, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { isApiError, sendWithConfirmation } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { useClearErrorsOnChange } from '../../../lib/use-clear-errors-on-change';
import { formatAmount } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';
import { drawTargetProps } from '../../../lib/shortcuts';
import { useRecordDraw } from '../api';
import { drawUnits, previewWeighing } from '../weighing';

type Mode = 'amount' | 'gross';

interface DrawFormValues {
  value: string;
  unit: string;
  note: string;
}

const modeLabels: Record<Mode, string> = {
  amount: 'Enter the amount',
  gross: 'Weigh the container',
};

/**
 * Record use from one container: either the amount taken, or the container's gross mass now
 * (net and drawn amounts previewed as you type). The server decides; a 409 (more than the
 * container holds) or a 400 lands on the field it names.
 */
export function DrawForm({ container }: { container: ContainerDetail }) {
  const draw = useRecordDraw(container.id);
  const confirmation = useConfirmation();
  const [mode, setMode] = useState<Mode>(container.tareMass !== null ? 'gross' : 'amount');
  const [done, setDone] = useState<string | null>(null);
  const [toWaste, setToWaste] = useState('');
  const units = drawUnits(container.chemical);
  // A watched chemical's draw is recorded with why: the field says so before submitting.
  const watchedBy = [
    ...new Set((container.chemical.watchListings ?? []).map((l) => l.listName)),
  ].join('; ');
  const massUnits = units.filter((u) => u === 'g' || u === 'mg' || u === 'kg');

  const form = useForm<DrawFormValues>({
    defaultValues: { value: '', unit: mode === 'gross' ? 'g' : container.unit, note: '' },
  });
  const {
    register,
    control,
    handleSubmit,
    setError,
    setValue,
    reset,
    formState: { errors, isSubmitting },
  } = form;
  useClearErrorsOnChange(form);
  const [valueText, unit] = useWatch({ control, name: ['value', 'unit'] });

  function switchMode(next: Mode) {
    setMode(next);
    setDone(null);
    draw.reset();
    setValue('unit', next === 'gross' ? 'g' : container.unit);
  }

  const typed = parseDecimal(valueText);
  const preview =
    mode === 'gross' && typed !== null && !Number.isNaN(typed) && typed >= 0
      ? previewWeighing({
          grossMass: typed,
          unit,
          tareMass: container.tareMass,
          balance: container.quantity,
          chemical: container.chemical,
        })
      : null;

  const valueLabel = mode === 'gross' ? 'Gross mass now' : 'Amount taken';

  const submit = handleSubmit(async (values) => {
    setDone(null);
    const number = parseDecimal(values.value);
    if (number === null || Number.isNaN(number)) {
      setError('value', {
        message: number === null ? `${valueLabel} is required` : `${valueLabel} must be a number`,
      });
      return;
    }
    const body: Draw =
      mode === 'gross'
        ? { grossMass: number, unit: values.unit }
        : { amount: number, unit: values.unit };
    if (watchedBy && !values.note.trim()) {
      setError(
        'note',
        { message: `Say why: ${container.chemical.name} is on ${watchedBy}` },
        { shouldFocus: true },
      );
      return;
    }
    if (values.note.trim()) body.note = values.note.trim();
    if (toWaste) body.toWasteContainerId = Number(toWaste);
    // The same schema the server applies: a zero amount or a volume as gross mass stops here.
    const checked = drawSchema.safeParse(body);
    if (!checked.success) {
      for (const issue of checked.error.issues) {
        const field =
          issue.path[0] === 'unit' ? 'unit' : issue.path[0] === 'note' ? 'note' : 'value';
        setError(field, {
          message: fieldMessage(valueLabel, issue.message.replace(/^(amount|gross mass) /, '')),
        });
      }
      return;
    }
    try {
      const change = await sendWithConfirmation(
        (confirm) => draw.mutateAsync(confirm ? { ...body, confirm } : body),
        confirmation.ask,
      );
      if (!change) {
        draw.reset();
        setError('root.server', { message: 'You went back: nothing was drawn from the hold.' });
        return;
      }
      const drawn = change.entries.find((entry) => entry.reason === 'drawn');
      setDone(
        `Drawn ${formatAmount(Math.abs(drawn?.quantity ?? 0), change.container.unit)} from ${change.container.labelCode}. Balance now ${formatAmount(change.container.quantity, change.container.unit)}.`,
      );
      reset({ value: '', unit: values.unit, note: '' });
    } catch (error) {
      if (!isApiError(error)) {
        setError('root.server', {
          message: 'Something went wrong. Nothing was recorded; try again.',
        });
        return;
      }
      const fieldText = error.fields.grossMass ?? error.fields.amount;
      if (fieldText)
        setError(
          'value',
          { type: 'server', message: fieldMessage(valueLabel, fieldText) },
          { shouldFocus: true },
        );
      if (error.fields.unit)
        setError('unit', { type: 'server', message: fieldMessage('Unit', error.fields.unit) });
      if (error.fields.note)
        setError('note', { type: 'server', message: fieldMessage('Why', error.fields.note) });
      setError('root.server', { message: `${error.message} Nothing was recorded.` });
    }
  });

  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label="Record a draw"
      className="flex flex-col gap-4"
      {...drawTargetProps}
    >
      <fieldset>
        <legend className="mb-1.5 text-sm font-medium text-ink-800">
          How do you know the amount?
        </legend>
        <div
          className="inline-flex rounded-md border border-ink-300 bg-ink-50 p-0.5"
          role="radiogroup"
        >
          {(['gross', 'amount'] as const).map((option) => (
            <label
              key={option}
              className={cn(
                'flex cursor-pointer items-center gap-1.5 rounded px-3 py-1.5 text-sm has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent-600',
                mode === option ? 'bg-white font-semibold text-ink-900 shadow-sm' : 'text-ink-700',
              )}
            >
              <input
                type="radio"
                name="draw-mode"
                value={option}
                checked={mode === option}
                onChange={() => switchMode(option)}
                className="sr-only"
              />
              {option === 'gross' ? (
                <Scale aria-hidden="true" className="size-4" />
              ) : (
                <Calculator aria-hidden="true" className="size-4" />
              )}
              {modeLabels[option]}
            </label>
          ))}
        </div>
        <p className="mt-1.5 text-xs text-ink-600">
          {mode === 'gross'
            ? 'Put the container, cap on, on the balance and type what it shows. Lotwise subtracts the tare and works out what was taken.'
            : 'Type how much you took out of this container.'}
        </p>
      </fieldset>

      {errors.root?.server && (
        <Notice tone="danger" title="Not recorded">
          {errors.root.server.message}
        </Notice>
      )}
      {done && (
        <Notice tone="ok" title="Draw recorded">
          {done}
        </Notice>
      )}

      {mode === 'gross' && container.tareMass === null ? (
        <Notice tone="warn" title="No tare recorded for this container">
          Without the mass of the empty container and cap, a gross mass cannot be turned into its
          contents. Switch to “Enter the amount”.
        </Notice>
      ) : (
        <div className="grid gap-3 sm:grid-cols-[1fr_8rem]">
          <Field label={valueLabel} error={errors.value?.message}>
            {(c) => <AmountInput {...c} {...register('value')} />}
          </Field>
          <Field label="Unit" error={errors.unit?.message}>
            {(c) => (
              // A new list of units per mode: the unit chosen on switching is set once the
              // list holds it, not left on the list's first entry.
              <Select key={mode} {...c} {...register('unit')}>
                {(mode === 'gross' ? massUnits : units).map((u) => (
                  <option key={u} value={u}>
                    {u}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        </div>
      )}

      {mode === 'gross' && container.tareMass !== null && (
        <div
          aria-live="polite"
          data-testid="weighing-preview"
          className="rounded-md border border-ink-200 bg-ink-50 px-3 py-2 text-sm"
        >
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 tabular-nums">
            <dt className="text-ink-600">Tare (empty, with cap)</dt>
            <dd>{formatAmount(container.tareMass, 'g')}</dd>
            <dt className="text-ink-600">Balance before</dt>
            <dd>{formatAmount(container.quantity, container.unit)}</dd>
            <dt className="text-ink-600">Net now</dt>
            <dd data-testid="preview-net">
              {preview && 'net' in preview && preview.net !== undefined
                ? formatAmount(preview.net, container.unit)
                : preview?.netMass !== undefined
                  ? formatAmount(preview.netMass, 'g')
                  : '—'}
            </dd>
            <dt className="font-semibold text-ink-800">Drawn</dt>
            <dd data-testid="preview-drawn" className="font-semibold text-ink-900">
              {preview?.ok ? formatAmount(preview.drawn, container.unit) : '—'}
            </dd>
          </dl>
          {preview && !preview.ok && <p className="mt-1 text-warn-700">{preview.message}</p>}
          {!preview && (
            <p className="mt-1 text-ink-600">Type the gross mass to see what was taken.</p>
          )}
        </div>
      )}

      {mode === 'amount' && (
        <p className="text-sm text-ink-600 tabular-nums">
          Available: {formatAmount(container.quantity, container.unit)}
          {container.holds.length > 0 &&
            `, of which ${formatAmount(freeOf(container), container.unit)} is not held for a plan`}
        </p>
      )}
      <ContainerHolds container={container} compact />

      {watchedBy ? (
        <Field
          label="Why (required)"
          error={errors.note?.message}
          hint={`${container.chemical.name} is on ${watchedBy}: your name and this reason are recorded.`}
        >
          {(c) => <Input {...c} autoComplete="off" {...register('note')} />}
        </Field>
      ) : (
        <Field label="Note" optional error={errors.note?.message} hint="e.g. what it was for">
          {(c) => <Input {...c} autoComplete="off" {...register('note')} />}
        </Field>
      )}
      <WasteContainerSelect
        value={toWaste}
        onChange={setToWaste}
        chemicalIds={[container.chemical.id]}
      />

      <div>
        <Button
          type="submit"
          variant="primary"
          busy={isSubmitting}
          icon={<CircleCheck aria-hidden="true" className="size-4" />}
        >
          Record draw
        </Button>
      </div>
      {confirmation.dialog}
    </form>
  );
}
