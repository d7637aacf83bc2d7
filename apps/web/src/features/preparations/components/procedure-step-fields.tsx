import {
  Controller,
  useFieldArray,
  useWatch,
  type Control,
  type FieldErrors,
  type UseFormRegister,
} from 'react-hook-form';
import { STEP_CAUTIONS } from '@lotwise/shared';
import { ArrowDown, ArrowUp, CircleAlert, Plus, Trash2 } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Field, FieldError, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Select, Textarea } from '../../../components/ui/input';
import { cautionMeta } from './preparation-safety';
import { emptyStep, type ProcedureFormValues, type StepFormValues } from './procedure-form-values';

/** After a move the buttons are drawn again: keep the keyboard on the moved step. */
function focusMoveButton(index: number, direction: 'up' | 'down') {
  requestAnimationFrame(() => {
    const wanted = document.getElementById(`step-${index}-${direction}`) as HTMLButtonElement;
    const other = document.getElementById(
      `step-${index}-${direction === 'up' ? 'down' : 'up'}`,
    ) as HTMLButtonElement | null;
    (wanted && !wanted.disabled ? wanted : other)?.focus();
  });
}

function StepFields({
  control,
  register,
  index,
  count,
  errors,
  onMove,
  onRemove,
}: {
  control: Control<ProcedureFormValues>;
  register: UseFormRegister<ProcedureFormValues>;
  index: number;
  count: number;
  errors: FieldErrors<StepFormValues> | undefined;
  onMove: (to: number) => void;
  onRemove: () => void;
}) {
  const lines = useWatch({ control, name: 'lines' });
  const lineKey = useWatch({ control, name: `steps.${index}.lineKey` });
  const lost = lineKey !== '' && !lines.some((line) => line.key === lineKey);
  const label = `Step ${index + 1}`;
  const err = (name: keyof StepFormValues, field: string) =>
    fieldMessage(field, errors?.[name]?.message as string | undefined);
  const name = <K extends keyof StepFormValues>(field: K) => `steps.${index}.${field}` as const;

  return (
    <li
      aria-label={label}
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-sm font-semibold text-ink-900">{label}</h3>
        <div className="flex flex-wrap gap-1">
          <Button
            id={`step-${index}-up`}
            size="sm"
            variant="ghost"
            icon={<ArrowUp aria-hidden="true" className="size-4" />}
            aria-label={`Move ${label} up`}
            disabled={index === 0}
            onClick={() => {
              onMove(index - 1);
              focusMoveButton(index - 1, 'up');
            }}
          >
            Up
          </Button>
          <Button
            id={`step-${index}-down`}
            size="sm"
            variant="ghost"
            icon={<ArrowDown aria-hidden="true" className="size-4" />}
            aria-label={`Move ${label} down`}
            disabled={index === count - 1}
            onClick={() => {
              onMove(index + 1);
              focusMoveButton(index + 1, 'down');
            }}
          >
            Down
          </Button>
          <Button
            size="sm"
            variant="ghost"
            icon={<Trash2 aria-hidden="true" className="size-4" />}
            aria-label={`Remove ${label}`}
            onClick={onRemove}
          >
            Remove
          </Button>
        </div>
      </div>
      <Field label="What to do" error={err('text', 'The step')}>
        {(props) => <Textarea {...props} rows={2} {...register(name('text'))} />}
      </Field>
      <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        <Field
          label="Keep from (°C)"
          hint="Empty: no lower limit"
          error={err('temperatureLowC', 'It')}
        >
          {(props) => <AmountInput {...props} {...register(name('temperatureLowC'))} />}
        </Field>
        <Field
          label="Keep up to (°C)"
          hint="Empty: no upper limit"
          error={err('temperatureHighC', 'It')}
        >
          {(props) => <AmountInput {...props} {...register(name('temperatureHighC'))} />}
        </Field>
        <Field
          label="If the temperature leaves the window"
          hint="e.g. stop the addition and add ice to the bath"
          error={err('outsideWindow', 'It')}
          className="col-span-2"
        >
          {(props) => <Input {...props} {...register(name('outsideWindow'))} />}
        </Field>
      </div>
      <div className="grid grid-cols-[7rem_minmax(0,1fr)] gap-3 lg:grid-cols-4">
        <Field
          label="Time (min)"
          hint="Not scaled: the same for any batch"
          error={err('durationMinutes', 'The time')}
        >
          {(props) => <AmountInput {...props} {...register(name('durationMinutes'))} />}
        </Field>
        <Field label="Caution" error={err('caution', 'Caution')}>
          {(props) => (
            <Select {...props} {...register(name('caution'))}>
              <option value="">None</option>
              {STEP_CAUTIONS.map((caution) => (
                <option key={caution} value={caution}>
                  {cautionMeta[caution].label}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field
          label="Hold point: do not go on until …"
          hint="Finish the sentence, e.g. “all the solid has dissolved”. Empty: no hold point."
          error={err('holdPoint', 'The hold point')}
          className="col-span-2"
        >
          {(props) => <Input {...props} {...register(name('holdPoint'))} />}
        </Field>
      </div>
      <div className="grid gap-3 md:grid-cols-2">
        <Field
          label="Line added in this step"
          hint={lost ? undefined : 'Its amount follows the plan’s scale on the plan and the sheet'}
          error={err('lineKey', 'The line')}
        >
          {(props) => (
            <Controller
              control={control}
              name={name('lineKey')}
              render={({ field }) => (
                <Select
                  {...props}
                  name={field.name}
                  ref={field.ref}
                  value={lost ? '' : field.value}
                  onChange={field.onChange}
                  onBlur={field.onBlur}
                >
                  <option value="">No line</option>
                  {lines.map((line, lineIndex) => (
                    <option key={line.key} value={line.key}>
                      Line {lineIndex + 1}: {line.chemical?.name ?? 'no chemical chosen yet'}
                    </option>
                  ))}
                </Select>
              )}
            />
          )}
        </Field>
        <Field
          label="How it is added"
          hint="e.g. dropwise over about 20 min; in three portions"
          error={err('addition', 'It')}
        >
          {(props) => <Input {...props} {...register(name('addition'))} />}
        </Field>
      </div>
      {lost && (
        <p
          role="status"
          className="flex items-start gap-1.5 rounded-md bg-warn-50 px-3 py-2 text-sm text-warn-700"
        >
          <CircleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
          The line this step added was removed, so the step adds no line now. Choose another line or
          leave it at “No line”.
        </p>
      )}
    </li>
  );
}

/** The procedure's steps, in order: add, move up or down, remove. */
export function StepsEditor({
  control,
  register,
  errors,
}: {
  control: Control<ProcedureFormValues>;
  register: UseFormRegister<ProcedureFormValues>;
  errors: FieldErrors<ProcedureFormValues>['steps'];
}) {
  const { fields, append, remove, move } = useFieldArray({ control, name: 'steps' });
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-1 text-base font-semibold">Steps</legend>
      <p className="text-sm text-ink-600">
        What to do at the bench, in order. Each step prints on the plan and on every bench page of
        the dispensing sheet, with its time, temperature window, caution and hold point. Only “What
        to do” is needed: leave the rest empty when it does not apply.
      </p>
      {fields.length > 0 && (
        <ol className="flex flex-col gap-3">
          {fields.map((field, index) => (
            <StepFields
              key={field.id}
              control={control}
              register={register}
              index={index}
              count={fields.length}
              errors={errors?.[index]}
              onMove={(to) => move(index, to)}
              onRemove={() => remove(index)}
            />
          ))}
        </ol>
      )}
      {errors?.root?.message && <FieldError>{errors.root.message}</FieldError>}
      <Button
        className="self-start"
        icon={<Plus aria-hidden="true" className="size-4" />}
        onClick={() => append(emptyStep())}
      >
        Add a step
      </Button>
    </fieldset>
  );
}
