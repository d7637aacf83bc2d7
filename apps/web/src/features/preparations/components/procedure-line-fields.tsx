import { Controller, useWatch, type Control, type FieldErrors } from 'react-hook-form';
import { coefficientRoles, lineRoles } from '@lotwise/shared';
import { Trash2 } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Field, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Checkbox, Input, Select } from '../../../components/ui/input';
import { roleLabels } from '../labels';
import { LineChemicalPicker } from './line-chemical-picker';
import type { LineFormValues, ProcedureFormValues } from './procedure-form-values';

const units = ['g', 'mg', 'kg', 'mL', 'L', 'µL', 'mmol', 'mol'] as const;
const measuredUnits = ['g', 'mg', 'kg', 'mL', 'L'] as const;

/** One line of the procedure form: chemical, role, amount at base scale, how it is measured. */
export function LineFields({
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
