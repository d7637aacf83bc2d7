import type { ReceivingLine } from '@lotwise/shared';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { Select } from '../../../components/ui/input';
import { formatAmount } from '../../../lib/format';
import { usePlaces } from '../api';

/** A storage place by its full path. */
export function PlaceSelect({
  id,
  value,
  onChange,
  emptyLabel,
  ...rest
}: {
  id?: string;
  value: string;
  onChange: (value: string) => void;
  emptyLabel: string;
  'aria-label'?: string;
  'aria-describedby'?: string;
  'aria-invalid'?: boolean;
}) {
  const places = usePlaces();
  return (
    <Select
      id={id}
      value={value}
      onChange={(event) => onChange(event.target.value)}
      disabled={places.isPending}
      {...rest}
    >
      <option value="">{places.isPending ? 'Loading places…' : emptyLabel}</option>
      {(places.data?.items ?? []).map((place) => (
        <option key={place.id} value={place.id}>
          {place.path}
        </option>
      ))}
    </Select>
  );
}

/** An order line's chemical, pack and hazards. */
export function ChemicalCell({ line, named = true }: { line: ReceivingLine; named?: boolean }) {
  return (
    <div className="flex flex-col gap-1">
      {named && <p className="font-semibold text-ink-900">{line.chemical.name}</p>}
      <p className="text-xs text-ink-600">
        <span className="font-mono">{line.sku}</span> · {line.packs} ×{' '}
        {formatAmount(line.packSize, line.packUnit)}
        {line.grade ? ` · ${line.grade}` : ''}
        {line.hazardous ? ' · ships as hazardous goods' : ''}
      </p>
      <HazardCodes
        pictograms={line.chemical.ghsPictograms}
        statements={line.chemical.hazardStatements}
      />
    </div>
  );
}
