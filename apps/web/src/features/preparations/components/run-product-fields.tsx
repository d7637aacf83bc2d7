import { Plus } from 'lucide-react';
import type { ProcedureLineView } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Select } from '../../../components/ui/input';
import { useLocations } from '../api';
import { Section } from './page-parts';
import { newPortion, type PortionValues } from './run-record-body';

/** "What was obtained": the crude mass and each portion put into stock. */
export function RunProductFields({
  product,
  crude,
  setCrude,
  portions,
  setPortions,
}: {
  product: ProcedureLineView;
  crude: string;
  setCrude: (value: string) => void;
  portions: PortionValues[];
  setPortions: (update: (all: PortionValues[]) => PortionValues[]) => void;
}) {
  const locations = useLocations();
  const productUnit = product.chemical.stockUnit;
  const setPortion = (key: string, patch: Partial<PortionValues>) =>
    setPortions((all) => all.map((p) => (p.key === key ? { ...p, ...patch } : p)));
  return (
    <Section id="product-heading" title={`What was obtained: ${product.chemical.name}`}>
      <p className="text-sm text-ink-600">
        Each portion put into stock becomes its own prepared lot in a new labelled container, linked
        to this run and to the lots it was made from.
      </p>
      <Field label="Crude mass (g), before purifying" optional className="w-60">
        {(props) => (
          <AmountInput
            {...props}
            value={crude}
            onChange={(event) => setCrude(event.target.value)}
          />
        )}
      </Field>
      <ol className="flex flex-col gap-2">
        {portions.map((portion, index) => (
          <li
            key={portion.key}
            aria-label={`Portion ${index + 1}`}
            className="grid gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3 md:grid-cols-[2fr_1fr_0.7fr_3fr_1fr_auto] md:items-end"
          >
            <Field label="Portion">
              {(props) => (
                <Input
                  {...props}
                  value={portion.label}
                  onChange={(event) => setPortion(portion.key, { label: event.target.value })}
                />
              )}
            </Field>
            <Field label="Amount">
              {(props) => (
                <AmountInput
                  {...props}
                  value={portion.quantity}
                  onChange={(event) => setPortion(portion.key, { quantity: event.target.value })}
                />
              )}
            </Field>
            <Field label="Unit">
              {(props) => (
                <Select
                  {...props}
                  value={portion.unit}
                  onChange={(event) => setPortion(portion.key, { unit: event.target.value })}
                >
                  {['g', 'mg', 'mL'].map((u) => (
                    <option key={u}>{u}</option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="Location">
              {(props) => (
                <Select
                  {...props}
                  value={portion.locationId}
                  onChange={(event) => setPortion(portion.key, { locationId: event.target.value })}
                >
                  <option value="">
                    {locations.isPending ? 'Loading locations…' : 'Choose a location'}
                  </option>
                  {locations.data?.items.map((location) => (
                    <option key={location.id} value={location.id}>
                      {location.path}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="Container tare (g)" optional>
              {(props) => (
                <AmountInput
                  {...props}
                  value={portion.tareMass}
                  onChange={(event) => setPortion(portion.key, { tareMass: event.target.value })}
                />
              )}
            </Field>
            {portions.length > 1 ? (
              <Button
                size="sm"
                variant="ghost"
                onClick={() => setPortions((all) => all.filter((p) => p.key !== portion.key))}
              >
                Remove
              </Button>
            ) : (
              <span />
            )}
          </li>
        ))}
      </ol>
      <Button
        size="sm"
        className="self-start"
        icon={<Plus aria-hidden="true" className="size-4" />}
        onClick={() =>
          setPortions((all) => [
            ...all,
            newPortion(
              all.length === 1 ? 'second crop (from the mother liquor)' : `crop ${all.length + 1}`,
              productUnit,
              all[all.length - 1]?.locationId ?? '',
            ),
          ])
        }
      >
        {portions.length === 1 ? 'Add a second crop' : 'Add another portion'}
      </Button>
    </Section>
  );
}
