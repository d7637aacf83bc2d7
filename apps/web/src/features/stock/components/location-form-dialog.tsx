import { useMemo, useState } from 'react';
import {
  flammableStorageKinds,
  flammableStorageLabels,
  locationCreateSchema,
  locationKinds,
  locationPatchSchema,
  storageGroupCodes,
  storageGroups,
  type FlammableStorageKind,
  type Location,
  type LocationKind,
  type StorageGroup,
} from '@lotwise/shared';
import { storageGroupIcons } from '../../../components/hazards/storage-group-label';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Checkbox, Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { useCreateLocation, useLocations, useUpdateLocation } from '../api';
import { locationKindLabels } from '../labels';
import { LocationSelect } from './location-select';

type Errors = Record<string, string | undefined>;

/** A place and every place below it: they cannot become its parent. */
function selfAndBelow(location: Location, all: readonly Location[]): Set<number> {
  const excluded = new Set([location.id]);
  let grew = true;
  while (grew) {
    grew = false;
    for (const other of all) {
      if (other.parentId !== null && excluded.has(other.parentId) && !excluded.has(other.id)) {
        excluded.add(other.id);
        grew = true;
      }
    }
  }
  return excluded;
}

const childKind: Partial<Record<LocationKind, LocationKind>> = {
  room: 'cabinet',
  cabinet: 'shelf',
  fridge: 'shelf',
};

/**
 * Add a place (optionally inside another) or change one: rename, re-purpose its storage
 * groups, or move it under another parent. The server refuses a move under itself (409).
 */
export function LocationFormDialog({
  location,
  parent,
  onClose,
  onSaved,
}: {
  /** The place to edit; leave out to add one. */
  location?: Location;
  /** Where a new place goes. */
  parent?: Location | null;
  onClose: () => void;
  onSaved?: (location: Location) => void;
}) {
  const create = useCreateLocation();
  const update = useUpdateLocation(location?.id ?? 0);
  const allLocations = useLocations().data;
  const [name, setName] = useState(location?.name ?? '');
  const [kind, setKind] = useState<LocationKind>(
    location?.kind ?? (parent ? (childKind[parent.kind] ?? 'other') : 'room'),
  );
  const [parentId, setParentId] = useState<number | undefined>(
    location ? (location.parentId ?? undefined) : (parent?.id ?? undefined),
  );
  const [groups, setGroups] = useState<StorageGroup[]>(location?.storageGroups ?? []);
  const [notes, setNotes] = useState(location?.notes ?? '');
  const [flammableStorage, setFlammableStorage] = useState<FlammableStorageKind | null>(
    location?.flammableStorage ?? null,
  );
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const excluded = useMemo(
    () => (location ? selfAndBelow(location, allLocations?.items ?? []) : undefined),
    [location, allLocations],
  );
  const busy = create.isPending || update.isPending;

  function toggleGroup(group: StorageGroup) {
    setGroups((current) =>
      current.includes(group) ? current.filter((g) => g !== group) : [...current, group],
    );
  }

  async function handleSubmit() {
    const values = {
      name,
      kind,
      parentId: parentId ?? null,
      storageGroups: groups,
      notes,
      flammableStorage,
    };
    const schema = location ? locationPatchSchema : locationCreateSchema;
    const checked = schema.safeParse(values);
    if (!checked.success) {
      const next: Errors = {};
      for (const issue of checked.error.issues) next[String(issue.path[0])] ??= issue.message;
      setErrors(next);
      return;
    }
    setErrors({});
    setFormError(null);
    try {
      const saved = location ? await update.mutateAsync(values) : await create.mutateAsync(values);
      onSaved?.(saved);
      onClose();
    } catch (error) {
      if (isApiError(error)) {
        setErrors(error.fields);
        setFormError(`${error.message} Nothing was saved.`);
      } else setFormError('Something went wrong. Nothing was saved; try again.');
    }
  }

  const formId = location ? 'edit-location-form' : 'new-location-form';
  return (
    <Dialog
      open
      onClose={onClose}
      title={
        location
          ? `Change ${location.name}`
          : parent
            ? `Add a place in ${parent.name}`
            : 'Add a place'
      }
      description="Rooms hold cabinets, cabinets hold shelves — any depth."
      footer={
        <>
          <Button onClick={onClose} disabled={busy}>
            Cancel
          </Button>
          <Button variant="primary" type="submit" form={formId} busy={busy}>
            {location ? 'Save changes' : 'Add place'}
          </Button>
        </>
      }
    >
      <form
        id={formId}
        noValidate
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
        <div className="grid gap-3 sm:grid-cols-[1fr_10rem]">
          <Field label="Name" error={fieldMessage('Name', errors.name)}>
            {(c) => (
              <Input
                {...c}
                value={name}
                autoComplete="off"
                onChange={(e) => setName(e.target.value)}
              />
            )}
          </Field>
          <Field label="Kind" error={fieldMessage('Kind', errors.kind)}>
            {(c) => (
              <Select {...c} value={kind} onChange={(e) => setKind(e.target.value as LocationKind)}>
                {locationKinds.map((k) => (
                  <option key={k} value={k}>
                    {locationKindLabels[k]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        </div>
        <Field
          label="Inside"
          error={fieldMessage('Inside', errors.parentId)}
          hint={
            location ? 'Choose another place to move it there, with everything in it.' : undefined
          }
        >
          {(c) => (
            <LocationSelect
              {...c}
              value={parentId}
              onChange={setParentId}
              exclude={excluded}
              emptyLabel="Nothing — a room or other top-level place"
            />
          )}
        </Field>
        <fieldset>
          <legend className="text-sm font-medium text-ink-800">
            Meant for these storage groups
          </legend>
          <p className="text-xs text-ink-600">
            Lotwise warns when a container of another group is put here. Leave all unticked if the
            place is not set aside for anything.
          </p>
          <div className="mt-2 grid gap-1.5 sm:grid-cols-2">
            {storageGroupCodes.map((group) => {
              const Icon = storageGroupIcons[group];
              return (
                <label key={group} className="flex items-center gap-2 text-sm">
                  <Checkbox checked={groups.includes(group)} onChange={() => toggleGroup(group)} />
                  <Icon aria-hidden="true" className="size-4 text-ink-600" />
                  {storageGroups[group].label}
                </label>
              );
            })}
          </div>
          {errors.storageGroups && (
            <p className="mt-1 text-sm text-danger-700">
              {fieldMessage('Storage groups', errors.storageGroups)}
            </p>
          )}
        </fieldset>
        <Field
          label="Approved flammable storage"
          error={fieldMessage('Flammable storage', errors.flammableStorage)}
          hint="Liquids in an approved cabinet or safety cans count under a lab area's higher figures."
        >
          {(c) => (
            <Select
              {...c}
              value={flammableStorage ?? ''}
              onChange={(e) =>
                setFlammableStorage((e.target.value || null) as FlammableStorageKind | null)
              }
            >
              <option value="">Neither</option>
              {flammableStorageKinds.map((k) => (
                <option key={k} value={k}>
                  {flammableStorageLabels[k]}
                </option>
              ))}
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
