import { useState } from 'react';
import {
  floorAreaUnits,
  labAreaCreateSchema,
  labAreaKinds,
  labAreaPatchSchema,
  labUnitClasses,
  type FloorAreaUnit,
  type LabArea,
  type LabAreaKind,
  type LabUnitClass,
} from '@lotwise/shared';
import { Button } from '../ui/button';
import { Dialog } from '../ui/dialog';
import { Field, fieldMessage } from '../ui/field';
import { Checkbox, Input, Select, Textarea } from '../ui/input';
import { Notice } from '../ui/notice';
import { isApiError } from '../../lib/api-client';
import { parseDecimal } from '../../lib/numbers';
import { formatFixed } from '../../lib/format';
import { useCreateLabArea, useRuleSets, useUpdateLabArea } from './api';
import {
  citationOf,
  floorAreaUnitLabels,
  labAreaKindHints,
  labAreaKindLabels,
  labUnitClassHints,
  unitClassFigures,
} from './lab-unit-classes';

type Errors = Record<string, string | undefined>;

function numberOrNaN(text: string): number {
  return parseDecimal(text) ?? Number.NaN;
}

/**
 * Marking a place as a lab area, or changing one: kind, lab-unit class, floor area, storey,
 * instructional, and the rule sets it is counted against. Field errors (ours and the
 * server's) show at their field; nothing is saved until all are right.
 */
export function LabAreaFormDialog({
  location,
  area,
  onClose,
}: {
  location: { id: number; name: string };
  /** The area to change; leave out to mark the place. */
  area?: LabArea;
  onClose: () => void;
}) {
  const create = useCreateLabArea();
  const update = useUpdateLabArea(area?.id ?? 0);
  const flammableSets = useRuleSets('flammable-limits');
  const sizeSets = useRuleSets('container-sizes');
  const [kind, setKind] = useState<LabAreaKind>(area?.kind ?? 'lab-unit');
  const [unitClass, setUnitClass] = useState<LabUnitClass>(area?.unitClass ?? 'B');
  const [floorArea, setFloorArea] = useState(area ? formatFixed(area.floorArea, 1) : '');
  const [floorAreaUnit, setFloorAreaUnit] = useState<FloorAreaUnit>(area?.floorAreaUnit ?? 'm2');
  const [storey, setStorey] = useState(String(area?.storey ?? 1));
  const [instructional, setInstructional] = useState(area?.instructional ?? false);
  const flammableItems = flammableSets.data?.items ?? [];
  const sizeItems = sizeSets.data?.items ?? [];
  const [flammableRuleSetId, setFlammableRuleSetId] = useState<number | undefined>(
    area?.flammableRuleSet.id,
  );
  const [sizeChoice, setSizeChoice] = useState<string | undefined>(
    area ? String(area.containerSizeRuleSet?.id ?? 'none') : undefined,
  );
  const [notes, setNotes] = useState(area?.notes ?? '');
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const busy = create.isPending || update.isPending;

  // Until the person chooses, the first built-in set of each kind is the one shown.
  const chosenFlammableId =
    flammableRuleSetId ?? flammableItems.find((s) => s.builtIn)?.id ?? flammableItems[0]?.id;
  const chosenSize =
    sizeChoice ?? String(sizeItems.find((s) => s.builtIn)?.id ?? sizeItems[0]?.id ?? 'none');
  const chosenFlammable = flammableItems.find((s) => s.id === chosenFlammableId);

  async function handleSubmit() {
    const values = {
      kind,
      unitClass,
      floorArea: numberOrNaN(floorArea),
      floorAreaUnit,
      storey: numberOrNaN(storey),
      instructional,
      ...(chosenFlammableId === undefined ? {} : { flammableRuleSetId: chosenFlammableId }),
      containerSizeRuleSetId: chosenSize === 'none' ? null : Number(chosenSize),
      notes,
    };
    const checked = area
      ? labAreaPatchSchema.safeParse(values)
      : labAreaCreateSchema.safeParse({ locationId: location.id, ...values });
    if (!checked.success) {
      const next: Errors = {};
      for (const issue of checked.error.issues) next[String(issue.path[0])] ??= issue.message;
      setErrors(next);
      return;
    }
    setErrors({});
    setFormError(null);
    try {
      if (area) await update.mutateAsync(values);
      else await create.mutateAsync({ locationId: location.id, ...values });
      onClose();
    } catch (error) {
      if (isApiError(error)) {
        setErrors(error.fields);
        setFormError(`${error.message} Nothing was saved.`);
      } else setFormError('Something went wrong. Nothing was saved; try again.');
    }
  }

  const formId = area ? 'edit-lab-area-form' : 'new-lab-area-form';
  return (
    <Dialog
      open
      onClose={onClose}
      title={area ? `Change the lab area ${location.name}` : `Mark ${location.name} as a lab area`}
      description="Lotwise counts the flammable and combustible liquids here and in every place inside against the limits of the rule set you choose."
      footer={
        <>
          <Button onClick={onClose} disabled={busy}>
            Cancel
          </Button>
          <Button variant="primary" type="submit" form={formId} busy={busy}>
            {area ? 'Save changes' : 'Mark as a lab area'}
          </Button>
        </>
      }
    >
      <form
        id={formId}
        noValidate
        aria-label={area ? 'Change the lab area' : 'Mark as a lab area'}
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
        <Field
          label="Kind of area"
          error={fieldMessage('Kind', errors.kind)}
          hint={labAreaKindHints[kind]}
        >
          {(c) => (
            <Select {...c} value={kind} onChange={(e) => setKind(e.target.value as LabAreaKind)}>
              {labAreaKinds.map((k) => (
                <option key={k} value={k}>
                  {labAreaKindLabels[k]}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field
          label="Flammable-liquid limits"
          error={fieldMessage('Rule set', errors.flammableRuleSetId)}
          hint="The rule set your authority adopted; copy one under Rule sets to enter your own."
        >
          {(c) => (
            <Select
              {...c}
              value={chosenFlammableId ?? ''}
              onChange={(e) => setFlammableRuleSetId(Number(e.target.value))}
            >
              {flammableItems.map((set) => (
                <option key={set.id} value={set.id}>
                  {set.name} — {citationOf(set)}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <fieldset>
          <legend className="text-sm font-medium text-ink-800">Lab-unit class</legend>
          <p className="text-xs text-ink-600">
            {chosenFlammable
              ? `Figures from ${citationOf(chosenFlammable)}.`
              : 'The figures come from the rule set chosen above.'}
          </p>
          <div className="mt-2 flex flex-col gap-2">
            {labUnitClasses.map((c) => {
              const figures =
                chosenFlammable?.kind === 'flammable-limits'
                  ? unitClassFigures(chosenFlammable.data, c)
                  : null;
              return (
                <label key={c} className="flex items-start gap-2 text-sm">
                  <input
                    type="radio"
                    name="unitClass"
                    value={c}
                    checked={unitClass === c}
                    onChange={() => setUnitClass(c)}
                    className="mt-1 accent-accent-600"
                  />
                  <span>
                    <span className="font-medium">Class {c}</span> — {labUnitClassHints[c]}
                    {figures && (
                      <span className="block text-xs text-ink-600 tabular-nums">{figures}</span>
                    )}
                  </span>
                </label>
              );
            })}
          </div>
          {errors.unitClass && (
            <p className="mt-1 text-sm text-danger-700">
              {fieldMessage('Lab-unit class', errors.unitClass)}
            </p>
          )}
        </fieldset>
        <div className="grid gap-3 sm:grid-cols-[1fr_7rem_7rem]">
          <Field label="Floor area" error={fieldMessage('Floor area', errors.floorArea)}>
            {(c) => (
              <Input
                {...c}
                inputMode="decimal"
                value={floorArea}
                autoComplete="off"
                onChange={(e) => setFloorArea(e.target.value)}
              />
            )}
          </Field>
          <Field label="Unit" error={fieldMessage('Unit', errors.floorAreaUnit)}>
            {(c) => (
              <Select
                {...c}
                value={floorAreaUnit}
                onChange={(e) => setFloorAreaUnit(e.target.value as FloorAreaUnit)}
              >
                {floorAreaUnits.map((u) => (
                  <option key={u} value={u}>
                    {floorAreaUnitLabels[u]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field
            label="Storey"
            error={fieldMessage('Storey', errors.storey)}
            hint="1 is the ground floor."
          >
            {(c) => (
              <Input
                {...c}
                inputMode="numeric"
                value={storey}
                autoComplete="off"
                onChange={(e) => setStorey(e.target.value)}
              />
            )}
          </Field>
        </div>
        <label className="flex items-start gap-2 text-sm">
          <Checkbox
            className="mt-0.5"
            checked={instructional}
            onChange={(e) => setInstructional(e.target.checked)}
          />
          <span>
            Instructional (a teaching lab)
            <span className="block text-xs text-ink-600">
              Teaching labs are Class C or D and get a share of Class C&apos;s figures, as the rule
              set says.
            </span>
          </span>
        </label>
        {errors.instructional && (
          <p className="text-sm text-danger-700">
            {fieldMessage('Instructional', errors.instructional)}
          </p>
        )}
        <Field
          label="Container sizes"
          error={fieldMessage('Container-size rule set', errors.containerSizeRuleSetId)}
          hint="Lotwise warns when a liquid sits in a container larger than its class and material allow."
        >
          {(c) => (
            <Select {...c} value={chosenSize} onChange={(e) => setSizeChoice(e.target.value)}>
              {sizeItems.map((set) => (
                <option key={set.id} value={set.id}>
                  {set.name} — {citationOf(set)}
                </option>
              ))}
              <option value="none">Do not check container sizes</option>
            </Select>
          )}
        </Field>
        <Field label="Notes" optional error={fieldMessage('Notes', errors.notes)}>
          {(c) => (
            <Textarea {...c} rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} />
          )}
        </Field>
      </form>
    </Dialog>
  );
}
