import { useState, type FormEvent } from 'react';
import { todayIso, type WasteContainer } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Checkbox, Input } from '../../../components/ui/input';
import { errorMessage } from '../../../lib/api-client';
import { useRecordPickup } from '../api';
import { fillText } from './waste-table';

/** Choose the containers a contractor took away, with the date and the manifest number. */
export function PickupForm({ containers }: { containers: readonly WasteContainer[] }) {
  const [chosen, setChosen] = useState<number[]>([]);
  const [pickedUpOn, setPickedUpOn] = useState(todayIso());
  const [contractor, setContractor] = useState('');
  const [manifestNumber, setManifestNumber] = useState('');
  const [done, setDone] = useState<string | null>(null);
  const record = useRecordPickup();

  function handleSubmit(event: FormEvent) {
    event.preventDefault();
    setDone(null);
    record.mutate(
      { pickedUpOn, contractor, manifestNumber, wasteContainerIds: chosen },
      {
        onSuccess: (pickup) => {
          setDone(
            `Pickup recorded: ${pickup.containers.map((c) => c.labelCode).join(', ')} (manifest ${pickup.manifestNumber}).`,
          );
          setChosen([]);
          setManifestNumber('');
        },
      },
    );
  }

  return (
    <form onSubmit={handleSubmit} className="flex flex-col gap-4" aria-label="Record a pickup">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-medium text-ink-800">Containers taken away</legend>
        {containers.length === 0 && (
          <p className="text-sm text-ink-600">No waste container is waiting for a pickup.</p>
        )}
        {containers.map((c) => (
          <label key={c.id} className="flex items-center gap-2 text-sm text-ink-800">
            <Checkbox
              checked={chosen.includes(c.id)}
              onChange={(e) =>
                setChosen((list) =>
                  e.target.checked ? [...list, c.id] : list.filter((id) => id !== c.id),
                )
              }
            />
            <span className="font-mono">{c.labelCode}</span> {c.title} — {fillText(c)}
          </label>
        ))}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-3">
        <Field label="Picked up on">
          {(control) => (
            <Input
              {...control}
              type="date"
              required
              value={pickedUpOn}
              onChange={(e) => setPickedUpOn(e.target.value)}
            />
          )}
        </Field>
        <Field label="Contractor">
          {(control) => (
            <Input
              {...control}
              required
              value={contractor}
              onChange={(e) => setContractor(e.target.value)}
            />
          )}
        </Field>
        <Field label="Manifest number">
          {(control) => (
            <Input
              {...control}
              required
              value={manifestNumber}
              onChange={(e) => setManifestNumber(e.target.value)}
            />
          )}
        </Field>
      </div>
      {record.isError && (
        <p role="alert" className="text-sm text-danger-700">
          {errorMessage(record.error)}
        </p>
      )}
      {done && (
        <p role="status" className="text-sm text-ok-700">
          {done}
        </p>
      )}
      <div>
        <Button type="submit" variant="primary" busy={record.isPending} disabled={!chosen.length}>
          Record the pickup
        </Button>
      </div>
    </form>
  );
}
