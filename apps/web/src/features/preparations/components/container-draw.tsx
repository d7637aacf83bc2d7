import { useId } from 'react';
import { massToVolume, measuringDensity, weighByDifference } from '@lotwise/chem';
import type { Container } from '@lotwise/shared';
import { Calculator, CircleAlert, Trash2 } from 'lucide-react';
import { ContainerHolds } from '../../../components/holds/container-holds';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Select } from '../../../components/ui/input';
import { formatAmount } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';
import { useChemicalContainers } from '../api';

export interface DrawValues {
  key: string;
  containerId: string;
  mode: 'amount' | 'weighed';
  amount: string;
  unit: string;
  grossBefore: string;
  grossAfter: string;
  note: string;
}

let nextKey = 1;
export const newDraw = (containerId = '', unit = 'g'): DrawValues => ({
  key: `draw-${nextKey++}`,
  containerId,
  mode: 'amount',
  amount: '',
  unit,
  grossBefore: '',
  grossAfter: '',
  note: '',
});

/** The draw as `POST /api/runs/:id/record` takes it; null when nothing was entered. */
export function drawBody(draw: DrawValues) {
  const containerId = draw.containerId
    ? Number(draw.containerId)
    : (undefined as unknown as number);
  if (draw.mode === 'amount') {
    if (draw.amount.trim() === '' && !draw.containerId) return null;
    return {
      containerId,
      amount: parseDecimal(draw.amount) ?? (undefined as unknown as number),
      unit: draw.unit,
      note: draw.note,
    };
  }
  if (draw.grossAfter.trim() === '' && draw.grossBefore.trim() === '' && !draw.containerId)
    return null;
  const before = parseDecimal(draw.grossBefore);
  return {
    containerId,
    ...(before !== null && { grossMassBefore: before }),
    grossMassAfter: parseDecimal(draw.grossAfter) ?? (undefined as unknown as number),
    unit: 'g',
    note: draw.note,
  };
}

type Preview = { ok: true; drawn: number; unit: string } | { ok: false; message: string } | null;

/**
 * What a weighing means for the container, by @lotwise/chem `weighByDifference` — the
 * rule the server applies on save. Before and after: the tare cancels out (drawn = before −
 * after); after alone: contents = after − tare, drawn = balance − contents.
 */
function weighingPreview(draw: DrawValues, container: Container | undefined): Preview {
  if (!container) return null;
  const after = parseDecimal(draw.grossAfter);
  const before = parseDecimal(draw.grossBefore);
  if (after === null || Number.isNaN(after)) return null;
  const density = measuringDensity(container.chemical);
  const stockUnit = container.unit;
  let result;
  if (before !== null && !Number.isNaN(before)) {
    const balanceBefore =
      stockUnit === 'g' || density === null ? before : massToVolume(before, density);
    result = weighByDifference({
      grossMass: after,
      unit: 'g',
      tareMass: 0,
      balance: balanceBefore,
      stockUnit,
      density,
    });
  } else {
    result = weighByDifference({
      grossMass: after,
      unit: 'g',
      tareMass: container.tareMass,
      balance: container.quantity,
      stockUnit,
      density,
    });
  }
  if (result.ok) return { ok: true, drawn: result.drawn, unit: stockUnit };
  const messages: Record<typeof result.problem, string> = {
    no_tare:
      'This container has no tare recorded: weigh it before and after, or enter the amount taken.',
    not_a_mass: 'A gross mass is weighed in g.',
    below_tare: 'That is less than the tare: weigh again with the cap on.',
    no_density:
      'The chemical has no density recorded (for a solid: no bulk density), so a mass cannot be turned into mL.',
    above_balance: 'After is more than before: a draw cannot add stock.',
  };
  return { ok: false, message: messages[result.problem] };
}

function containerLabel(container: Container) {
  const held = container.holds.length > 0 ? ' · held for a plan' : '';
  return `${container.labelCode} · ${formatAmount(container.quantity, container.unit)} · ${container.location.path} (${container.status})${held}`;
}

/** One draw from a named container: an amount, or gross masses weighed on the balance. */
export function ContainerDraw({
  chemicalId,
  value,
  onChange,
  onRemove,
  label,
  plannedHint,
  planId = null,
}: {
  /** The plan the run is recorded from, whose own holds are taken without a question. */
  planId?: number | null;
  chemicalId: number;
  value: DrawValues;
  onChange: (next: DrawValues) => void;
  onRemove?: () => void;
  label: string;
  plannedHint?: string;
}) {
  const containers = useChemicalContainers(chemicalId);
  const container = containers.data?.find((c) => String(c.id) === value.containerId);
  const preview = value.mode === 'weighed' ? weighingPreview(value, container) : null;
  const modeName = useId();
  const set = (patch: Partial<DrawValues>) => onChange({ ...value, ...patch });

  return (
    <div
      role="group"
      aria-label={label}
      className="flex flex-col gap-2 rounded-md border border-ink-200 bg-ink-50/60 px-3 py-2"
    >
      <div className="flex flex-wrap items-end gap-3">
        <Field label="Container" className="min-w-72 flex-1">
          {(props) => (
            <Select
              {...props}
              value={value.containerId}
              onChange={(event) => {
                const chosen = containers.data?.find((c) => String(c.id) === event.target.value);
                set({ containerId: event.target.value, unit: chosen?.unit ?? value.unit });
              }}
            >
              <option value="">
                {containers.isPending ? 'Loading containers…' : 'Choose the container drawn from'}
              </option>
              {containers.data?.map((c) => (
                <option key={c.id} value={c.id}>
                  {containerLabel(c)}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <fieldset className="flex items-center gap-3 pb-2 text-sm">
          <legend className="sr-only">How it was measured</legend>
          <label className="flex items-center gap-1.5">
            <input
              type="radio"
              name={modeName}
              checked={value.mode === 'amount'}
              onChange={() => set({ mode: 'amount' })}
              className="accent-accent-600"
            />
            Amount taken
          </label>
          <label className="flex items-center gap-1.5">
            <input
              type="radio"
              name={modeName}
              checked={value.mode === 'weighed'}
              onChange={() => set({ mode: 'weighed' })}
              className="accent-accent-600"
            />
            Weighed the container
          </label>
        </fieldset>
        {onRemove && (
          <Button
            size="sm"
            variant="ghost"
            aria-label={`Remove ${label}`}
            icon={<Trash2 aria-hidden="true" className="size-4" />}
            onClick={onRemove}
          >
            Remove
          </Button>
        )}
      </div>
      {container && <ContainerHolds container={container} compact ownPlanId={planId} />}
      {value.mode === 'amount' ? (
        <div className="flex flex-wrap items-end gap-3">
          <Field label="Amount" hint={plannedHint} className="w-40">
            {(props) => (
              <AmountInput
                {...props}
                value={value.amount}
                onChange={(event) => set({ amount: event.target.value })}
              />
            )}
          </Field>
          <Field label="Unit" className="w-24">
            {(props) => (
              <Select
                {...props}
                value={value.unit}
                onChange={(event) => set({ unit: event.target.value })}
              >
                {['g', 'mg', 'kg', 'mL', 'L'].map((u) => (
                  <option key={u}>{u}</option>
                ))}
              </Select>
            )}
          </Field>
        </div>
      ) : (
        <div className="flex flex-wrap items-end gap-3">
          <Field label="Gross mass before (g)" optional className="w-44">
            {(props) => (
              <AmountInput
                {...props}
                value={value.grossBefore}
                onChange={(event) => set({ grossBefore: event.target.value })}
              />
            )}
          </Field>
          <Field label="Gross mass after (g)" className="w-44">
            {(props) => (
              <AmountInput
                {...props}
                value={value.grossAfter}
                onChange={(event) => set({ grossAfter: event.target.value })}
              />
            )}
          </Field>
          <p className="pb-2 text-sm text-ink-700 tabular-nums">
            Tare (empty, cap on):{' '}
            {container
              ? container.tareMass === null
                ? 'not recorded'
                : formatAmount(container.tareMass, 'g')
              : 'choose the container'}
          </p>
        </div>
      )}
      {preview && (
        <p
          aria-live="polite"
          className={
            preview.ok
              ? 'flex items-center gap-1.5 text-sm text-ink-800'
              : 'flex items-center gap-1.5 text-sm text-warn-700'
          }
        >
          {preview.ok ? (
            <>
              <Calculator aria-hidden="true" className="size-4 text-accent-600" />
              Drawn:{' '}
              <strong className="tabular-nums" data-testid="weighing-preview">
                {formatAmount(preview.drawn, preview.unit)}
              </strong>
            </>
          ) : (
            <>
              <CircleAlert aria-hidden="true" className="size-4" />
              {preview.message}
            </>
          )}
        </p>
      )}
    </div>
  );
}
