import { useState } from 'react';
import type { WasteArea } from '@lotwise/shared';
import { useRuleSets } from '../../../components/room-rules/api';
import { citationOf } from '../../../components/room-rules/lab-unit-classes';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { Select } from '../../../components/ui/input';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { LocationSelect } from '../../stock/components/location-select';
import { useDeleteWasteArea, usePutWasteArea } from '../api';

type Errors = Record<string, string | undefined>;

/**
 * Marking a place as a waste accumulation area (place and rule set), or changing an area's
 * rule set. The chosen set's citation shows under the choice.
 */
export function WasteAreaFormDialog({
  area,
  exclude,
  onClose,
}: {
  /** The area to change; leave out to mark a place. */
  area?: WasteArea;
  /** Places that already are accumulation areas. */
  exclude?: ReadonlySet<number>;
  onClose: () => void;
}) {
  const put = usePutWasteArea();
  const sets = useRuleSets('waste-accumulation');
  const items = sets.data?.items ?? [];
  const [locationId, setLocationId] = useState<number | undefined>(area?.locationId);
  const [ruleSetId, setRuleSetId] = useState<number | undefined>(area?.ruleSetId);
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);
  // Until the person chooses, the first built-in set is the one shown.
  const chosenId = ruleSetId ?? items.find((s) => s.builtIn)?.id ?? items[0]?.id;
  const chosen = items.find((s) => s.id === chosenId);

  async function handleSubmit() {
    if (locationId === undefined) {
      setErrors({ locationId: 'choose the place' });
      return;
    }
    setErrors({});
    setFormError(null);
    try {
      await put.mutateAsync({ locationId, ruleSetId: chosenId ?? null });
      onClose();
    } catch (error) {
      if (isApiError(error)) {
        setErrors(error.fields);
        setFormError(`${error.message} Nothing was saved.`);
      } else setFormError('Something went wrong. Nothing was saved; try again.');
    }
  }

  const formId = area ? 'edit-waste-area-form' : 'new-waste-area-form';
  const label = area
    ? `Change the rules of ${area.locationPath}`
    : 'Mark a place as a waste accumulation area';
  return (
    <Dialog
      open
      onClose={onClose}
      title={label}
      description="Lotwise adds up the waste in this place and everything inside it, and compares the litres with the limits of the rule set you choose."
      footer={
        <>
          <Button onClick={onClose} disabled={put.isPending}>
            Cancel
          </Button>
          <Button variant="primary" type="submit" form={formId} busy={put.isPending}>
            {area ? 'Save changes' : 'Mark as an accumulation area'}
          </Button>
        </>
      }
    >
      <form
        id={formId}
        noValidate
        aria-label={label}
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
        {!area && (
          <Field
            label="Place"
            error={fieldMessage('Place', errors.locationId)}
            hint="A room, bench or cabinet where waste containers stand until pickup."
          >
            {(c) => (
              <LocationSelect
                {...c}
                value={locationId}
                onChange={setLocationId}
                emptyLabel="Choose a place"
                exclude={exclude}
              />
            )}
          </Field>
        )}
        <Field
          label="Accumulation limits"
          error={fieldMessage('Rule set', errors.ruleSetId)}
          hint={
            chosen
              ? `Limits from ${citationOf(chosen)}. Copy a set under Rule sets to enter the ones your authority set.`
              : 'The rule set your authority adopted; copy one under Rule sets to enter your own.'
          }
        >
          {(c) => (
            <Select
              {...c}
              value={chosenId ?? ''}
              disabled={sets.isPending}
              onChange={(e) => setRuleSetId(Number(e.target.value))}
            >
              {sets.isPending && <option value="">Loading rule sets…</option>}
              {items.map((set) => (
                <option key={set.id} value={set.id}>
                  {set.name} — {citationOf(set)}
                </option>
              ))}
            </Select>
          )}
        </Field>
      </form>
    </Dialog>
  );
}

/** Asks before a place stops being a waste accumulation area. */
export function UnmarkWasteAreaDialog({ area, onClose }: { area: WasteArea; onClose: () => void }) {
  const remove = useDeleteWasteArea(area.locationId);
  return (
    <Dialog
      open
      onClose={onClose}
      title={`Unmark ${area.locationPath} as an accumulation area?`}
      description="The place and its waste containers stay; Lotwise stops adding up the waste here against limits."
      size="sm"
      footer={
        <>
          <Button onClick={onClose} disabled={remove.isPending}>
            Keep it
          </Button>
          <Button
            variant="danger"
            busy={remove.isPending}
            onClick={() => remove.mutate(undefined, { onSuccess: onClose })}
          >
            Unmark
          </Button>
        </>
      }
    >
      {remove.isError ? (
        <Notice tone="danger" title="Not unmarked">
          {errorMessage(remove.error)}
        </Notice>
      ) : (
        <p className="text-sm text-ink-700">You can mark it again at any time.</p>
      )}
    </Dialog>
  );
}
