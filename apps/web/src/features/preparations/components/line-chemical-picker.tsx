import type { Chemical, LineChemical } from '@lotwise/shared';
import { formatDensity, formatMolarMass } from '../../../lib/format';
import { Formula } from '../../../components/chem/formula';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { Button } from '../../../components/ui/button';
import { ChemicalSearchBox } from '../../../components/chem/chemical-search-box';

/** What a procedure line keeps of its chemical: enough to calculate and to show hazards. */
export type PickedChemical = LineChemical;

export function toPicked(chemical: Chemical): PickedChemical {
  return {
    id: chemical.id,
    name: chemical.name,
    formula: chemical.formula,
    molarMass: chemical.molarMass,
    density: chemical.density,
    defaultPurityPercent: chemical.defaultPurityPercent,
    physicalState: chemical.physicalState,
    bulkDensity: chemical.bulkDensity,
    stockUnit: chemical.stockUnit,
    ghsPictograms: chemical.ghsPictograms,
    hazardStatements: chemical.hazardStatements,
  };
}

/**
 * Choose the chemical of a procedure line by typing part of its name, a synonym, CAS RN or
 * formula; arrow keys and Enter work. Once chosen it shows with its hazards and the facts
 * the calculation uses.
 */
export function LineChemicalPicker({
  id,
  value,
  onChange,
  invalid,
  describedBy,
  label,
}: {
  id: string;
  value: PickedChemical | null;
  onChange: (chemical: PickedChemical | null) => void;
  invalid?: boolean;
  describedBy?: string;
  label: string;
}) {
  if (value) {
    return (
      <div className="flex flex-wrap items-start justify-between gap-2 rounded-md border border-ink-200 bg-ink-50 px-2.5 py-1.5">
        <div className="flex flex-col gap-0.5">
          <p className="font-semibold text-ink-900">{value.name}</p>
          <p className="text-xs text-ink-600 tabular-nums">
            <Formula value={value.formula} />
            {value.molarMass !== null && <> · {formatMolarMass(value.molarMass)}</>}
            {value.density !== null && <> · {formatDensity(value.density)}</>}
            {value.defaultPurityPercent !== 100 && <> · {value.defaultPurityPercent} %</>}
          </p>
          <HazardCodes pictograms={value.ghsPictograms} statements={value.hazardStatements} />
        </div>
        <Button
          size="sm"
          aria-label={`Change the chemical of ${label}`}
          onClick={() => onChange(null)}
        >
          Change
        </Button>
      </div>
    );
  }

  return (
    <ChemicalSearchBox
      id={id}
      onChoose={(chemical) => onChange(toPicked(chemical))}
      invalid={invalid}
      describedBy={describedBy}
    />
  );
}
