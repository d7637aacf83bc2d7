import type { Chemical } from '@lotwise/shared';
import { Formula } from '../../../components/chem/formula';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { Button } from '../../../components/ui/button';
import { ChemicalSearchBox } from '../../../components/chem/chemical-search-box';

/**
 * Choose one chemical by typing part of its name, a synonym, its CAS RN or formula. Arrow
 * keys move through the matches, Enter takes one. Once chosen, it shows with its hazards.
 */
export function ChemicalPicker({
  id,
  value,
  onChange,
  invalid,
  describedBy,
}: {
  id: string;
  value: Chemical | null;
  onChange: (chemical: Chemical | null) => void;
  invalid?: boolean;
  describedBy?: string;
}) {
  if (value) {
    return (
      <div className="flex flex-wrap items-start justify-between gap-3 rounded-md border border-ink-200 bg-ink-50 px-3 py-2.5">
        <div className="flex flex-col gap-1">
          <p className="font-semibold text-ink-900">{value.name}</p>
          <p className="text-sm text-ink-600 tabular-nums">
            <Formula value={value.formula} />
            {value.casNumber && <> · CAS RN {value.casNumber}</>} · counted in {value.stockUnit}
          </p>
          <HazardCodes pictograms={value.ghsPictograms} statements={value.hazardStatements} />
          <span className="text-sm text-ink-700">
            <StorageGroupLabel group={value.storageGroup} />
          </span>
        </div>
        <Button size="sm" onClick={() => onChange(null)}>
          Choose another
        </Button>
      </div>
    );
  }

  return (
    <ChemicalSearchBox id={id} onChoose={onChange} invalid={invalid} describedBy={describedBy} />
  );
}
