import { useState } from 'react';
import { useNavigate } from 'react-router';
import {
  wasteCharacteristics,
  wasteContainerCreateSchema,
  wasteForms,
  type WasteCharacteristic,
  type WasteForm,
} from '@lotwise/shared';
import { AmountInput } from '../../../components/ui/amount-input';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Checkbox, Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { parseDecimal } from '../../../lib/numbers';
import { LocationSelect } from '../../stock/components/location-select';
import { useCreateWasteContainer } from '../api';

type Errors = Record<string, string | undefined>;

/** Units a waste container's capacity is given in: volume for liquids, mass for solids. */
const capacityUnits: Record<WasteForm, readonly string[]> = {
  liquid: ['L', 'mL'],
  solid: ['kg', 'g', 'L'],
};

const formLabels: Record<WasteForm, string> = {
  liquid: 'Liquid (solvents, washings, filtrates)',
  solid: 'Solid (residues, contaminated gloves and paper)',
};

/**
 * One plain line per hazardous-waste characteristic.
 * US EPA, 40 CFR 261.21–261.24, in the words of public summaries (from memory).
 */
export const wasteCharacteristicLines: Record<
  WasteCharacteristic,
  { label: string; line: string }
> = {
  ignitable: {
    label: 'Ignitable',
    // 40 CFR 261.21: liquids with a flash point below 60 °C (140 °F); from memory.
    line: 'Catches fire easily: liquids with a flash point below 60 °C, oxidizers.',
  },
  corrosive: {
    label: 'Corrosive',
    // 40 CFR 261.22: aqueous pH ≤ 2 or ≥ 12.5; from memory.
    line: 'Acids and bases: pH 2 or lower, or 12.5 or higher, or eats through steel.',
  },
  reactive: {
    label: 'Reactive',
    line: 'Unstable, reacts violently with water, or gives off toxic gas (cyanides, sulfides).',
  },
  toxic: {
    label: 'Toxic',
    line: 'Holds heavy metals, pesticides or other substances harmful when they leach out.',
  },
};

/**
 * A new waste container: what it collects, where it stands, its capacity, liquid or solid,
 * its characteristics and when accumulation started. Field errors (ours and the server's)
 * show at their field; on success the container's page opens.
 */
export function WasteContainerFormDialog({ onClose }: { onClose: () => void }) {
  const navigate = useNavigate();
  const create = useCreateWasteContainer();
  const [title, setTitle] = useState('');
  const [locationId, setLocationId] = useState<number | undefined>(undefined);
  const [capacity, setCapacity] = useState('');
  const [form, setForm] = useState<WasteForm>('liquid');
  const [capacityUnit, setCapacityUnit] = useState('L');
  const [characteristics, setCharacteristics] = useState<WasteCharacteristic[]>([]);
  const [acutelyHazardous, setAcutelyHazardous] = useState(false);
  const [accumulationStartOn, setAccumulationStartOn] = useState('');
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);

  function chooseForm(next: WasteForm) {
    setForm(next);
    if (!capacityUnits[next].includes(capacityUnit)) setCapacityUnit(capacityUnits[next][0]!);
  }

  async function handleSubmit() {
    const values = {
      title,
      locationId: locationId ?? 0,
      capacity: parseDecimal(capacity) ?? Number.NaN,
      capacityUnit,
      form,
      characteristics: wasteCharacteristics.filter((c) => characteristics.includes(c)),
      acutelyHazardous,
      accumulationStartOn: accumulationStartOn || null,
      notes,
    };
    const checked = wasteContainerCreateSchema.safeParse(values);
    if (!checked.success || locationId === undefined) {
      const next: Errors = {};
      for (const issue of checked.error?.issues ?? [])
        next[String(issue.path[0])] ??= issue.message;
      if (locationId === undefined) next.locationId = 'choose where the container stands';
      setErrors(next);
      return;
    }
    setErrors({});
    setFormError(null);
    try {
      const container = await create.mutateAsync(values);
      onClose();
      void navigate(paths.stockWasteContainer(container.id));
    } catch (error) {
      if (isApiError(error)) {
        setErrors(error.fields);
        setFormError(`${error.message} Nothing was saved.`);
      } else setFormError('Something went wrong. Nothing was saved; try again.');
    }
  }

  return (
    <Dialog
      open
      onClose={onClose}
      title="New waste container"
      description="A container that collects chemical waste until a contractor picks it up. Lotwise prints its label and counts it against its accumulation area's limits."
      footer={
        <>
          <Button onClick={onClose} disabled={create.isPending}>
            Cancel
          </Button>
          <Button
            variant="primary"
            type="submit"
            form="new-waste-container-form"
            busy={create.isPending}
          >
            Add the container
          </Button>
        </>
      }
    >
      <form
        id="new-waste-container-form"
        noValidate
        aria-label="New waste container"
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
          label="What it collects"
          error={fieldMessage('What it collects', errors.title)}
          hint="Printed on the label, e.g. “Halogenated solvent washings”."
        >
          {(c) => (
            <Input
              {...c}
              value={title}
              autoComplete="off"
              onChange={(e) => setTitle(e.target.value)}
            />
          )}
        </Field>
        <Field label="Where it stands" error={fieldMessage('Place', errors.locationId)}>
          {(c) => (
            <LocationSelect
              {...c}
              value={locationId}
              onChange={setLocationId}
              emptyLabel="Choose a place"
            />
          )}
        </Field>
        <fieldset>
          <legend className="text-sm font-medium text-ink-800">Liquid or solid</legend>
          <div className="mt-1 flex flex-col gap-1">
            {wasteForms.map((f) => (
              <label key={f} className="flex items-center gap-2 text-sm">
                <input
                  type="radio"
                  name="wasteForm"
                  value={f}
                  checked={form === f}
                  onChange={() => chooseForm(f)}
                  className="accent-accent-600"
                />
                {formLabels[f]}
              </label>
            ))}
          </div>
          {errors.form && (
            <p className="mt-1 text-sm text-danger-700">{fieldMessage('Form', errors.form)}</p>
          )}
        </fieldset>
        <div className="grid gap-3 sm:grid-cols-[1fr_7rem]">
          <Field label="Capacity" error={fieldMessage('Capacity', errors.capacity)}>
            {(c) => (
              <AmountInput {...c} value={capacity} onChange={(e) => setCapacity(e.target.value)} />
            )}
          </Field>
          <Field label="Unit" error={fieldMessage('Unit', errors.capacityUnit)}>
            {(c) => (
              <Select {...c} value={capacityUnit} onChange={(e) => setCapacityUnit(e.target.value)}>
                {capacityUnits[form].map((u) => (
                  <option key={u} value={u}>
                    {u}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        </div>
        <fieldset>
          <legend className="text-sm font-medium text-ink-800">Hazard characteristics</legend>
          <p className="text-xs text-ink-600">
            Tick every one that applies; the SDS of what goes in says which.
          </p>
          <div className="mt-2 flex flex-col gap-2">
            {wasteCharacteristics.map((c) => (
              <label key={c} className="flex items-start gap-2 text-sm">
                <Checkbox
                  className="mt-0.5"
                  checked={characteristics.includes(c)}
                  onChange={(e) =>
                    setCharacteristics((list) =>
                      e.target.checked ? [...list, c] : list.filter((x) => x !== c),
                    )
                  }
                />
                <span>
                  <span className="font-medium">{wasteCharacteristicLines[c].label}</span>
                  <span className="block text-xs text-ink-600">
                    {wasteCharacteristicLines[c].line}
                  </span>
                </span>
              </label>
            ))}
          </div>
          {errors.characteristics && (
            <p className="mt-1 text-sm text-danger-700">
              {fieldMessage('Characteristics', errors.characteristics)}
            </p>
          )}
        </fieldset>
        <label className="flex items-start gap-2 text-sm">
          <Checkbox
            className="mt-0.5"
            checked={acutelyHazardous}
            onChange={(e) => setAcutelyHazardous(e.target.checked)}
          />
          <span>
            Acutely hazardous
            <span className="block text-xs text-ink-600">
              Waste on the regulator&apos;s acutely hazardous list; its area limit is far smaller.
            </span>
          </span>
        </label>
        {errors.acutelyHazardous && (
          <p className="text-sm text-danger-700">
            {fieldMessage('Acutely hazardous', errors.acutelyHazardous)}
          </p>
        )}
        <Field
          label="Accumulation started on"
          optional
          error={fieldMessage('Start date', errors.accumulationStartOn)}
          hint="Leave empty to use the date of the first addition."
        >
          {(c) => (
            <Input
              {...c}
              type="date"
              value={accumulationStartOn}
              onChange={(e) => setAccumulationStartOn(e.target.value)}
            />
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
