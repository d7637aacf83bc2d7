import type { SelectHTMLAttributes } from 'react';
import { Select } from '../../../components/ui/input';
import { useLocations } from '../api';

interface LocationSelectProps extends Omit<
  SelectHTMLAttributes<HTMLSelectElement>,
  'value' | 'onChange'
> {
  value: number | undefined;
  onChange: (id: number | undefined) => void;
  /** Text of the empty choice; leave out to force a choice. */
  emptyLabel?: string;
  /** Locations that may not be chosen (e.g. a place and everything below it when moving it). */
  exclude?: ReadonlySet<number>;
}

/** Every location by its full path. */
export function LocationSelect({
  value,
  onChange,
  emptyLabel,
  exclude,
  ...rest
}: LocationSelectProps) {
  const locations = useLocations();
  const items = locations.data?.items ?? [];
  return (
    <Select
      {...rest}
      value={value ?? ''}
      onChange={(event) => onChange(event.target.value ? Number(event.target.value) : undefined)}
      disabled={rest.disabled || locations.isPending}
    >
      <option value="">
        {locations.isPending ? 'Loading locations…' : (emptyLabel ?? 'Choose a location')}
      </option>
      {items
        .filter((location) => !exclude?.has(location.id))
        .map((location) => (
          <option key={location.id} value={location.id}>
            {location.path}
          </option>
        ))}
    </Select>
  );
}
