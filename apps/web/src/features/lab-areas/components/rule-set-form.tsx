import { useState } from 'react';
import { LIQUID_CLASSES } from '@lotwise/chem';
import {
  containerMaterialLabels,
  containerMaterials,
  floorAreaUnits,
  ruleSetCreateSchema,
  ruleSetKindLabels,
  volumeUnits,
  type FloorAreaUnit,
  type RuleSetCreate,
  type VolumeUnit,
} from '@lotwise/shared';
import { floorAreaUnitLabels } from '../../../components/room-rules/lab-unit-classes';
import { Button } from '../../../components/ui/button';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Checkbox, Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { TableScroll } from '../../../components/ui/table-scroll';
import { isApiError } from '../../../lib/api-client';
import { dataFrom, textsOf, type FigureTexts, type RuleSetData } from './rule-set-data';

type Errors = Record<string, string | undefined>;

export interface RuleSetFormValues {
  name: string;
  source: string;
  edition: string;
  reference: string;
  notes: string;
}

/** A number box in a table cell, named for screen readers by its row and column. */
function Cell({
  label,
  value,
  error,
  onChange,
}: {
  label: string;
  value: string;
  error?: string;
  onChange: (value: string) => void;
}) {
  return (
    <td className="py-1 pr-2 align-top">
      <Input
        aria-label={label}
        aria-invalid={error ? true : undefined}
        title={error}
        inputMode="decimal"
        className="w-24 text-right tabular-nums"
        value={value}
        onChange={(e) => onChange(e.target.value)}
      />
      {error && <p className="mt-0.5 max-w-24 text-xs text-danger-700">{error}</p>}
    </td>
  );
}

/**
 * A lab's own rule set: where the limits come from, and the figures as tables like the set's
 * page shows them. Errors, ours or the server's, show at their box; nothing is lost on an error.
 */
export function RuleSetForm({
  initial,
  initialData,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  initial: RuleSetFormValues;
  initialData: RuleSetData;
  submitLabel: string;
  onSubmit: (body: RuleSetCreate) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [values, setValues] = useState(initial);
  const [base, setBase] = useState<RuleSetData>(initialData);
  const [texts, setTexts] = useState<FigureTexts>(() => textsOf(initialData));
  const [keepExtras, setKeepExtras] = useState(true);
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const set = (key: keyof RuleSetFormValues) => (value: string) =>
    setValues((v) => ({ ...v, [key]: value }));
  const setText = (key: string) => (value: string) => setTexts((t) => ({ ...t, [key]: value }));
  const dataError = (key: string) => errors[`data.${key}`];

  /** Errors name a container-size limit by its place in the list sent; the form by its box. */
  function errorsOf(issues: { path: PropertyKey[]; message: string }[], sent: RuleSetData): Errors {
    const next: Errors = {};
    for (const issue of issues) {
      const path = issue.path.map(String);
      if (sent.kind === 'container-sizes' && path[0] === 'data' && path[1] === 'limits') {
        const limit = sent.data.limits[Number(path[2])];
        if (limit) {
          next[`data.limits.${limit.liquidClass}.${limit.material}`] ??= issue.message;
          continue;
        }
      }
      next[path.join('.')] ??= issue.message;
    }
    return next;
  }

  async function handleSubmit() {
    const sent = dataFrom(base, texts, keepExtras);
    const body = { ...values, ...sent } as RuleSetCreate;
    const checked = ruleSetCreateSchema.safeParse(body);
    if (!checked.success) {
      setErrors(errorsOf(checked.error.issues, sent));
      setFormError('Some figures need a look: see the boxes marked below. Nothing was saved.');
      return;
    }
    setErrors({});
    setFormError(null);
    setBusy(true);
    try {
      await onSubmit(body);
    } catch (error) {
      if (isApiError(error)) {
        setErrors(
          errorsOf(
            Object.entries(error.fields).map(([path, message]) => ({
              path: path.split('.'),
              message,
            })),
            sent,
          ),
        );
        setFormError(`${error.message} Nothing was saved.`);
      } else setFormError('Something went wrong. Nothing was saved; try again.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <form
      noValidate
      aria-label="Rule set"
      className="flex flex-col gap-4"
      onSubmit={(event) => {
        event.preventDefault();
        void handleSubmit();
      }}
    >
      {formError && (
        <Notice tone="danger" title="Not saved">
          {formError}
        </Notice>
      )}
      <p className="text-sm text-ink-700">{ruleSetKindLabels[base.kind]}</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Name" error={fieldMessage('Name', errors.name)}>
          {(c) => (
            <Input {...c} value={values.name} onChange={(e) => set('name')(e.target.value)} />
          )}
        </Field>
        <Field
          label="Where the limits come from"
          error={fieldMessage('Source', errors.source)}
          hint="Who publishes them: a standard, a regulation, your fire marshal's letter."
        >
          {(c) => (
            <Input {...c} value={values.source} onChange={(e) => set('source')(e.target.value)} />
          )}
        </Field>
        <Field label="Edition or date" optional error={fieldMessage('Edition', errors.edition)}>
          {(c) => (
            <Input {...c} value={values.edition} onChange={(e) => set('edition')(e.target.value)} />
          )}
        </Field>
        <Field
          label="Table or section"
          optional
          error={fieldMessage('Reference', errors.reference)}
        >
          {(c) => (
            <Input
              {...c}
              value={values.reference}
              onChange={(e) => set('reference')(e.target.value)}
            />
          )}
        </Field>
      </div>

      {base.kind === 'flammable-limits' && (
        <fieldset className="flex flex-col gap-3">
          <legend className="text-sm font-semibold text-ink-800">Figures</legend>
          <div className="grid gap-3 sm:grid-cols-3">
            <Field label="Unit" error={fieldMessage('Unit', dataError('unit'))}>
              {(c) => (
                <Select
                  {...c}
                  value={base.data.unit}
                  onChange={(e) =>
                    setBase({
                      ...base,
                      data: { ...base.data, unit: e.target.value as VolumeUnit },
                    })
                  }
                >
                  {volumeUnits.map((u) => (
                    <option key={u} value={u}>
                      {u}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field
              label="Figures are per floor area of"
              optional
              error={fieldMessage('Floor area', dataError('perFloorArea.value'))}
              hint="Leave empty when the figures are for the whole area, whatever its size."
            >
              {(c) => (
                <div className="flex gap-2">
                  <Input
                    {...c}
                    inputMode="decimal"
                    value={texts['perFloorArea.value']}
                    onChange={(e) => setText('perFloorArea.value')(e.target.value)}
                  />
                  <Select
                    aria-label="Floor area unit"
                    className="w-20"
                    value={base.data.perFloorArea?.unit ?? 'ft2'}
                    onChange={(e) =>
                      setBase({
                        ...base,
                        data: {
                          ...base.data,
                          perFloorArea: {
                            value: base.data.perFloorArea?.value ?? 100,
                            unit: e.target.value as FloorAreaUnit,
                          },
                        },
                      })
                    }
                  >
                    {floorAreaUnits.map((u) => (
                      <option key={u} value={u}>
                        {floorAreaUnitLabels[u]}
                      </option>
                    ))}
                  </Select>
                </div>
              )}
            </Field>
            <Field
              label="Share allowed outside cabinets and safety cans (%)"
              error={fieldMessage('Share', dataError('outsideStorageFactor'))}
            >
              {(c) => (
                <Input
                  {...c}
                  inputMode="decimal"
                  value={texts.outsideStorageFactor}
                  onChange={(e) => setText('outsideStorageFactor')(e.target.value)}
                />
              )}
            </Field>
          </div>
          <TableScroll label="Limits by lab-unit class">
            <table className="text-sm">
              <caption className="mb-1 text-left text-xs text-ink-600">
                Limits by lab-unit class, in {base.data.unit}; leave “most per unit” empty for no
                cap.
              </caption>
              <thead className="text-left text-xs text-ink-600">
                <tr>
                  <th scope="col" className="pr-2">
                    Lab-unit class
                  </th>
                  <th scope="col" className="pr-2">
                    Class I
                  </th>
                  <th scope="col" className="pr-2">
                    Classes I–IIIA
                  </th>
                  <th scope="col" className="pr-2">
                    Class I, most per unit
                  </th>
                  <th scope="col" className="pr-2">
                    Classes I–IIIA, most per unit
                  </th>
                </tr>
              </thead>
              <tbody>
                {base.data.byUnitClass.map((row, i) => (
                  <tr key={row.unitClass}>
                    <th scope="row" className="pr-2 text-left font-normal">
                      Class {row.unitClass}
                    </th>
                    {(
                      [
                        ['perArea.classI', 'Class I'],
                        ['perArea.classesIToIIIA', 'Classes I–IIIA'],
                        ['maxPerUnit.classI', 'Class I, most per unit'],
                        ['maxPerUnit.classesIToIIIA', 'Classes I–IIIA, most per unit'],
                      ] as const
                    ).map(([key, column]) => (
                      <Cell
                        key={key}
                        label={`Lab-unit class ${row.unitClass}: ${column}`}
                        value={texts[`byUnitClass.${i}.${key}`] ?? ''}
                        error={dataError(`byUnitClass.${i}.${key}`)}
                        onChange={setText(`byUnitClass.${i}.${key}`)}
                      />
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
          <Field
            label={`At most per approved cabinet (${base.data.unit})`}
            optional
            error={fieldMessage('Per cabinet', dataError('perCabinet'))}
          >
            {(c) => (
              <Input
                {...c}
                inputMode="decimal"
                className="w-32"
                value={texts.perCabinet}
                onChange={(e) => setText('perCabinet')(e.target.value)}
              />
            )}
          </Field>
          <label className="flex items-center gap-2 text-sm">
            <Checkbox
              checked={base.data.countsIgnitableWaste}
              onChange={(e) =>
                setBase({
                  ...base,
                  data: { ...base.data, countsIgnitableWaste: e.target.checked },
                })
              }
            />
            Waste ignitable liquids count toward the totals
          </label>
          {(base.data.instructional || base.data.storeyReductions.length > 0) && (
            <label className="flex items-start gap-2 text-sm">
              <Checkbox
                className="mt-0.5"
                checked={keepExtras}
                onChange={(e) => setKeepExtras(e.target.checked)}
              />
              <span>
                Keep the copied set&apos;s rules for instructional labs and upper storeys
                <span className="block text-xs text-ink-600">
                  Untick when your own figures already allow for them.
                </span>
              </span>
            </label>
          )}
        </fieldset>
      )}

      {base.kind === 'container-sizes' && (
        <fieldset className="flex flex-col gap-3">
          <legend className="text-sm font-semibold text-ink-800">Figures</legend>
          <Field label="Unit" className="w-32">
            {(c) => (
              <Select
                {...c}
                value={base.data.unit}
                onChange={(e) =>
                  setBase({ ...base, data: { ...base.data, unit: e.target.value as VolumeUnit } })
                }
              >
                {volumeUnits.map((u) => (
                  <option key={u} value={u}>
                    {u}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <TableScroll label="Largest container by liquid class and material">
            <table className="text-sm">
              <caption className="mb-1 text-left text-xs text-ink-600">
                Largest container in {base.data.unit}; leave a box empty for no limit.
              </caption>
              <thead className="text-left text-xs text-ink-600">
                <tr>
                  <th scope="col" className="pr-2">
                    Liquid class
                  </th>
                  {containerMaterials.map((m) => (
                    <th key={m} scope="col" className="pr-2">
                      {containerMaterialLabels[m]}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {LIQUID_CLASSES.map((liquidClass) => (
                  <tr key={liquidClass}>
                    <th scope="row" className="pr-2 text-left font-normal">
                      {liquidClass}
                    </th>
                    {containerMaterials.map((m) => (
                      <Cell
                        key={m}
                        label={`Class ${liquidClass} in ${containerMaterialLabels[m].toLowerCase()}`}
                        value={texts[`limits.${liquidClass}.${m}`] ?? ''}
                        error={dataError(`limits.${liquidClass}.${m}`)}
                        onChange={setText(`limits.${liquidClass}.${m}`)}
                      />
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        </fieldset>
      )}

      {base.kind === 'waste-accumulation' && (
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="text-sm font-semibold text-ink-800">Figures</legend>
          <Field
            label={`Hazardous waste, at most (${base.data.maxHazardous.unit})`}
            error={fieldMessage('Hazardous waste', dataError('maxHazardous.value'))}
          >
            {(c) => (
              <Input
                {...c}
                inputMode="decimal"
                value={texts['maxHazardous.value']}
                onChange={(e) => setText('maxHazardous.value')(e.target.value)}
              />
            )}
          </Field>
          <Field
            label={`Acutely hazardous waste, at most (${base.data.maxAcutelyHazardous.unit})`}
            error={fieldMessage('Acutely hazardous waste', dataError('maxAcutelyHazardous.value'))}
          >
            {(c) => (
              <Input
                {...c}
                inputMode="decimal"
                value={texts['maxAcutelyHazardous.value']}
                onChange={(e) => setText('maxAcutelyHazardous.value')(e.target.value)}
              />
            )}
          </Field>
          <Field
            label="Days to remove the excess once over"
            error={fieldMessage('Days', dataError('daysAllowedOnceExceeded'))}
          >
            {(c) => (
              <Input
                {...c}
                inputMode="numeric"
                value={texts.daysAllowedOnceExceeded}
                onChange={(e) => setText('daysAllowedOnceExceeded')(e.target.value)}
              />
            )}
          </Field>
          <Field
            label="Longest accumulation (days)"
            optional
            error={fieldMessage('Days', dataError('maxAccumulationDays'))}
          >
            {(c) => (
              <Input
                {...c}
                inputMode="numeric"
                value={texts.maxAccumulationDays}
                onChange={(e) => setText('maxAccumulationDays')(e.target.value)}
              />
            )}
          </Field>
          <Field
            label="Warn at (% of a limit)"
            error={fieldMessage('Warn at', dataError('nearFraction'))}
          >
            {(c) => (
              <Input
                {...c}
                inputMode="decimal"
                value={texts.nearFraction}
                onChange={(e) => setText('nearFraction')(e.target.value)}
              />
            )}
          </Field>
        </fieldset>
      )}

      <Field label="Notes" optional error={fieldMessage('Notes', errors.notes)}>
        {(c) => (
          <Textarea
            {...c}
            rows={3}
            value={values.notes}
            onChange={(e) => set('notes')(e.target.value)}
          />
        )}
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button variant="primary" type="submit" busy={busy}>
          {submitLabel}
        </Button>
        <Button onClick={onCancel} disabled={busy}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
