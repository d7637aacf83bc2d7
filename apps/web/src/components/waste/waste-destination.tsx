import { useQuery } from '@tanstack/react-query';
import { wasteContainerSchema } from '@lotwise/shared';
import { z } from 'zod';
import { api, withQuery } from '../../lib/api-client';
import { Field } from '../ui/field';
import { Input, Select } from '../ui/input';

/** What a form sends to a waste container (empty container id: no waste). */
export interface WasteValues {
  wasteContainerId: string;
  description: string;
  quantity: string;
  unit: string;
}

export const noWaste = (description: string, unit = 'mL'): WasteValues => ({
  wasteContainerId: '',
  description,
  quantity: '',
  unit,
});

/**
 * The open waste containers `chemicalIds` may go into: a container holding anything they
 * conflict with (the segregation table) is left out by the server.
 */
function useCompatibleWaste(chemicalIds: readonly number[]) {
  const compatibleWith = chemicalIds.length ? [...chemicalIds].sort().join(',') : undefined;
  return useQuery({
    queryKey: ['waste', 'open', compatibleWith ?? ''],
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/waste-containers', { compatibleWith }),
        z.array(wasteContainerSchema),
        signal,
      ),
  });
}

/** Choose an open waste container for washings, filtrates or residues, and the amount. */
export function WasteDestination({
  value,
  onChange,
  chemicalIds,
  legend = 'Waste',
}: {
  value: WasteValues;
  onChange: (next: WasteValues) => void;
  chemicalIds: readonly number[];
  legend?: string;
}) {
  const open = useCompatibleWaste(chemicalIds);
  const set = (patch: Partial<WasteValues>) => onChange({ ...value, ...patch });
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="text-sm font-medium text-ink-800">{legend}</legend>
      <Field
        label="Waste container"
        optional
        hint={
          open.isError
            ? 'The waste containers could not be loaded.'
            : 'Only containers whose contents may be mixed with these chemicals are offered.'
        }
      >
        {(control) => (
          <Select
            {...control}
            value={value.wasteContainerId}
            onChange={(e) => set({ wasteContainerId: e.target.value })}
          >
            <option value="">No waste to record</option>
            {(open.data ?? []).map((c) => (
              <option key={c.id} value={c.id}>
                {c.labelCode} {c.title} ({c.locationPath})
              </option>
            ))}
          </Select>
        )}
      </Field>
      {value.wasteContainerId && (
        <div className="grid gap-3 sm:grid-cols-[2fr_1fr_1fr]">
          <Field label="What goes in">
            {(control) => (
              <Input
                {...control}
                value={value.description}
                onChange={(e) => set({ description: e.target.value })}
              />
            )}
          </Field>
          <Field label="About how much">
            {(control) => (
              <Input
                {...control}
                inputMode="decimal"
                value={value.quantity}
                onChange={(e) => set({ quantity: e.target.value })}
              />
            )}
          </Field>
          <Field label="Unit">
            {(control) => (
              <Input
                {...control}
                value={value.unit}
                onChange={(e) => set({ unit: e.target.value })}
              />
            )}
          </Field>
        </div>
      )}
    </fieldset>
  );
}

/** Only the choice of an open waste container (a draw "to waste": the amount is the draw's). */
export function WasteContainerSelect({
  value,
  onChange,
  chemicalIds,
  label = 'To waste',
}: {
  value: string;
  onChange: (next: string) => void;
  chemicalIds: readonly number[];
  label?: string;
}) {
  const open = useCompatibleWaste(chemicalIds);
  return (
    <Field
      label={label}
      optional
      hint="Choose a waste container when what is drawn goes to waste; only compatible ones are offered."
    >
      {(control) => (
        <Select {...control} value={value} onChange={(e) => onChange(e.target.value)}>
          <option value="">Not to waste</option>
          {(open.data ?? []).map((c) => (
            <option key={c.id} value={c.id}>
              {c.labelCode} {c.title} ({c.locationPath})
            </option>
          ))}
        </Select>
      )}
    </Field>
  );
}
