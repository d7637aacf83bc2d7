import { useMemo } from 'react';
import {
  Controller,
  useForm,
  useWatch,
  type DefaultValues,
  type FieldPath,
  type Resolver,
} from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { validateCasNumber } from '@lotwise/chem';
import {
  chemicalCreateSchema,
  chemicalPatchSchema,
  hazardStatementTexts,
  peroxideClasses,
  physicalStates,
  stockUnits,
  storageGroupCodes,
  storageGroups,
  type PeroxideClass,
} from '@lotwise/shared';
import { CircleCheck, Save } from 'lucide-react';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { Field, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Checkbox, Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { physicalStateLabels } from '../labels';
import { ListTextInput } from './list-text-input';
import { MolarMassPreview } from './molar-mass-preview';
import { PictogramPicker } from './pictogram-picker';
import {
  emptyToNull,
  fieldNames,
  joinCodes,
  joinLines,
  labels,
  schemaOptions,
  splitCodes,
  splitLines,
  toNumber,
  type ChemicalFormValues,
} from './chemical-form-values';

export {
  chemicalToFormValues,
  emptyChemical,
  type ChemicalFormValues,
} from './chemical-form-values';

interface ChemicalFormProps {
  mode: 'create' | 'edit';
  defaultValues: DefaultValues<ChemicalFormValues>;
  submitLabel: string;
  onSubmit: (values: ChemicalFormValues, changed: Partial<ChemicalFormValues>) => Promise<unknown>;
  onCancel: () => void;
}

/**
 * Create or edit a chemical. Validation is the shared schema the server also applies;
 * server answers (400 with fields, 409 duplicate CAS RN) land on the fields they name.
 */
export function ChemicalForm({
  mode,
  defaultValues,
  submitLabel,
  onSubmit,
  onCancel,
}: ChemicalFormProps) {
  // Both schemas check each field the same way; the patch one has no defaults to fill.
  const resolver = useMemo(
    () =>
      (mode === 'create'
        ? zodResolver(chemicalCreateSchema, schemaOptions)
        : zodResolver(
            chemicalPatchSchema,
            schemaOptions,
          )) as unknown as Resolver<ChemicalFormValues>,
    [mode],
  );
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting, touchedFields },
  } = useForm<ChemicalFormValues>({ resolver, defaultValues, mode: 'onTouched' });

  const [formula, stockUnit, storageGroup, casNumber, hazardStatements] = useWatch({
    control,
    name: ['formula', 'stockUnit', 'storageGroup', 'casNumber', 'hazardStatements'],
  });
  const casOk = Boolean(
    casNumber &&
    touchedFields.casNumber &&
    !errors.casNumber &&
    validateCasNumber(casNumber.trim()).valid,
  );

  const message = (name: keyof ChemicalFormValues) =>
    fieldMessage(labels[name], errors[name]?.message as string | undefined);

  const submit = handleSubmit(async (values) => {
    const changed: Partial<ChemicalFormValues> = {};
    for (const name of fieldNames) {
      if (JSON.stringify(values[name]) !== JSON.stringify(defaultValues[name])) {
        (changed as Record<string, unknown>)[name] = values[name];
      }
    }
    try {
      await onSubmit(values, changed);
    } catch (error) {
      if (!isApiError(error)) {
        setError('root.server', {
          message: 'Something went wrong. Your changes are still here; try again.',
        });
        return;
      }
      let placed = 0;
      for (const [path, text] of Object.entries(error.fields)) {
        const name = path.split('.')[0] as keyof ChemicalFormValues;
        if (fieldNames.includes(name)) {
          setError(
            name as FieldPath<ChemicalFormValues>,
            { type: 'server', message: text },
            { shouldFocus: placed === 0 },
          );
          placed += 1;
        }
      }
      if (error.code === 'conflict' && placed === 0) {
        // The only conflict a chemical can meet on save is a CAS RN already in use.
        setError('casNumber', { type: 'server', message: error.message }, { shouldFocus: true });
        placed += 1;
      }
      setError('root.server', {
        message:
          placed > 0
            ? `${error.message} Nothing was saved; the fields marked below need a look.`
            : `${error.message} Nothing was saved; your changes are still here.`,
      });
    }
  });

  const hint = (name: keyof ChemicalFormValues) => ({ error: message(name) });

  return (
    <form
      onSubmit={submit}
      noValidate
      className="flex flex-col gap-6"
      aria-label={mode === 'create' ? 'New chemical' : 'Edit chemical'}
    >
      {errors.root?.server && (
        <Notice tone="danger" title="Not saved">
          {errors.root.server.message}
        </Notice>
      )}

      <section
        className="rounded-lg border border-ink-200 bg-white p-4"
        aria-labelledby="identity-heading"
      >
        <h2 id="identity-heading" className="mb-3 text-base font-semibold">
          Identity
        </h2>
        <div className="grid gap-4 md:grid-cols-2">
          <Field label="Name" {...hint('name')} className="md:col-span-2">
            {(c) => <Input {...c} autoComplete="off" {...register('name')} />}
          </Field>
          <Field
            label="Formula"
            optional
            {...hint('formula')}
            hint="Hill or common notation; hydrates with ·, a spaced . or * (e.g. CuSO4·5H2O, CuSO4 . 5H2O)."
            live={errors.formula ? undefined : <MolarMassPreview formula={formula} />}
          >
            {(c) => (
              <Input
                {...c}
                autoComplete="off"
                spellCheck={false}
                {...register('formula', { setValueAs: emptyToNull })}
              />
            )}
          </Field>
          <Field
            label="CAS RN"
            optional
            {...hint('casNumber')}
            hint="Checked against its check digit when you leave the field."
            live={
              casOk ? (
                <span className="flex items-center gap-1.5 text-ok-700">
                  <CircleCheck aria-hidden="true" className="size-4" />
                  Check digit is right
                </span>
              ) : undefined
            }
          >
            {(c) => (
              <Input
                {...c}
                autoComplete="off"
                inputMode="numeric"
                placeholder="e.g. 64-19-7"
                className="tabular-nums"
                {...register('casNumber', { setValueAs: emptyToNull })}
              />
            )}
          </Field>
          <Field
            label="Synonyms"
            optional
            {...hint('synonyms')}
            hint="One per line."
            className="md:col-span-2"
          >
            {(c) => (
              <Controller
                control={control}
                name="synonyms"
                render={({ field }) => (
                  <ListTextInput
                    {...c}
                    multiline
                    value={field.value}
                    onChange={field.onChange}
                    onBlur={field.onBlur}
                    split={splitLines}
                    join={joinLines}
                  />
                )}
              />
            )}
          </Field>
        </div>
      </section>

      <section
        className="rounded-lg border border-ink-200 bg-white p-4"
        aria-labelledby="hazards-form-heading"
      >
        <h2 id="hazards-form-heading" className="mb-1 text-base font-semibold">
          Hazards and storage
        </h2>
        <p className="mb-3 text-sm text-ink-600">
          Copy these from the supplier’s SDS for the product you hold.
        </p>
        <div className="flex flex-col gap-5">
          <Controller
            control={control}
            name="ghsPictograms"
            render={({ field }) => (
              <PictogramPicker
                value={field.value}
                onChange={field.onChange}
                onBlur={field.onBlur}
                error={message('ghsPictograms')}
              />
            )}
          />
          <Field
            label="Hazard statements"
            optional
            {...hint('hazardStatements')}
            hint="H-codes separated by commas or spaces, e.g. H225, H319, H336."
          >
            {(c) => (
              <Controller
                control={control}
                name="hazardStatements"
                render={({ field }) => (
                  <ListTextInput
                    {...c}
                    value={field.value}
                    onChange={field.onChange}
                    onBlur={field.onBlur}
                    split={splitCodes}
                    join={joinCodes}
                    placeholder="H225, H319"
                  />
                )}
              />
            )}
          </Field>
          {hazardStatements.length > 0 && (
            <ul
              aria-label="Hazard statement texts"
              className="-mt-3 flex flex-col gap-0.5 rounded-md bg-ink-50 px-3 py-2 text-sm"
            >
              {hazardStatements.map((code) => (
                <li key={code} className="flex gap-3">
                  <span className="w-14 shrink-0 font-semibold tabular-nums">{code}</span>
                  <span
                    className={hazardStatementTexts[code] ? 'text-ink-800' : 'text-ink-600 italic'}
                  >
                    {hazardStatementTexts[code] ?? 'Not in Lotwise’s list — see SDS'}
                  </span>
                </li>
              ))}
            </ul>
          )}
          <div className="grid gap-4 md:grid-cols-2">
            <Field
              label="Storage group"
              {...hint('storageGroup')}
              hint={storageGroups[storageGroup].hint}
            >
              {(c) => (
                <Select {...c} {...register('storageGroup')}>
                  {storageGroupCodes.map((code) => (
                    <option key={code} value={code}>
                      {storageGroups[code].label}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field
              label="Peroxide-former class"
              {...hint('peroxideClass')}
              hint="Only for substances that form peroxides on storage."
            >
              {(c) => (
                <Select {...c} {...register('peroxideClass', { setValueAs: emptyToNull })}>
                  <option value="">Not a peroxide former</option>
                  {(Object.keys(peroxideClasses) as PeroxideClass[]).map((cls) => (
                    <option key={cls} value={cls}>
                      Class {cls} — {peroxideClasses[cls].split(':')[0]}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
          </div>
          <label className="flex items-start gap-2.5 text-sm">
            <Checkbox className="mt-1" {...register('restricted')} />
            <span>
              <span className="font-medium text-ink-800">Restricted</span>
              <span className="block text-ink-600">
                Orders of this chemical need a manager’s approval.
              </span>
            </span>
          </label>
          <SafetyCaution compact />
        </div>
      </section>

      <section
        className="rounded-lg border border-ink-200 bg-white p-4"
        aria-labelledby="physical-heading"
      >
        <h2 id="physical-heading" className="mb-3 text-base font-semibold">
          Physical data and stock
        </h2>
        <div className="grid gap-4 md:grid-cols-3">
          <Field label="Physical state" {...hint('physicalState')}>
            {(c) => (
              <Select {...c} {...register('physicalState')}>
                <option value="">Choose…</option>
                {physicalStates.map((state) => (
                  <option key={state} value={state}>
                    {physicalStateLabels[state]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field
            label="Density (g/mL at 20 °C)"
            optional
            {...hint('density')}
            hint="Lets Lotwise convert between mass and volume of a liquid or solution. For a solid, the density of the crystal: never used to measure it by volume."
          >
            {(c) => <AmountInput {...c} {...register('density', { setValueAs: toNumber })} />}
          </Field>
          <Field
            label="Bulk density of the poured solid (g/mL)"
            optional
            {...hint('bulkDensity')}
            hint="Solids only: the mass of a loosely poured millilitre, air included. Without it a solid is weighed, never measured by volume."
          >
            {(c) => <AmountInput {...c} {...register('bulkDensity', { setValueAs: toNumber })} />}
          </Field>
          <Field
            label="Default purity (%)"
            {...hint('defaultPurityPercent')}
            hint="Given to new lots unless their certificate says otherwise."
          >
            {(c) => (
              <AmountInput {...c} {...register('defaultPurityPercent', { setValueAs: toNumber })} />
            )}
          </Field>
          <Field
            label="Stock unit"
            {...hint('stockUnit')}
            hint="What containers of it are counted in."
          >
            {(c) => (
              <Select {...c} {...register('stockUnit')}>
                {stockUnits.map((unit) => (
                  <option key={unit} value={unit}>
                    {unit === 'g' ? 'g (mass)' : 'mL (volume)'}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field
            label={`Reorder point (${stockUnit})`}
            optional
            {...hint('reorderPoint')}
            hint="Lotwise warns when stock falls to this."
          >
            {(c) => <AmountInput {...c} {...register('reorderPoint', { setValueAs: toNumber })} />}
          </Field>
          <Field
            label={`Reorder quantity (${stockUnit})`}
            optional
            {...hint('reorderQuantity')}
            hint="How much to buy at a time."
          >
            {(c) => (
              <AmountInput {...c} {...register('reorderQuantity', { setValueAs: toNumber })} />
            )}
          </Field>
        </div>
      </section>

      <section
        className="rounded-lg border border-ink-200 bg-white p-4"
        aria-labelledby="notes-heading"
      >
        <h2 id="notes-heading" className="sr-only">
          Notes
        </h2>
        <Field label="Notes" optional {...hint('notes')}>
          {(c) => <Textarea {...c} rows={3} {...register('notes')} />}
        </Field>
      </section>

      <div className="sticky bottom-0 -mx-1 flex justify-end gap-2 border-t border-ink-200 bg-ink-50/95 px-1 py-3 backdrop-blur">
        <Button onClick={onCancel} disabled={isSubmitting}>
          Cancel
        </Button>
        <Button
          type="submit"
          variant="primary"
          busy={isSubmitting}
          icon={<Save aria-hidden="true" className="size-4" />}
        >
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
