import { useId, useState, type KeyboardEvent } from 'react';
import { Search } from 'lucide-react';
import type { Chemical, LineChemical } from '@lotwise/shared';
import { Formula } from '../../../components/chem/formula';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { Button } from '../../../components/ui/button';
import { Input } from '../../../components/ui/input';
import { cn } from '../../../lib/cn';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { useChemicalSearch } from '../api';

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
  const [text, setText] = useState('');
  const [active, setActive] = useState(0);
  const [open, setOpen] = useState(false);
  const debounced = useDebouncedValue(text, 200);
  const search = useChemicalSearch(debounced);
  const listId = useId();
  const options = search.data?.items ?? [];

  if (value) {
    return (
      <div className="flex flex-wrap items-start justify-between gap-2 rounded-md border border-ink-200 bg-ink-50 px-2.5 py-1.5">
        <div className="flex flex-col gap-0.5">
          <p className="font-semibold text-ink-900">{value.name}</p>
          <p className="text-xs text-ink-600 tabular-nums">
            <Formula value={value.formula} />
            {value.molarMass !== null && <> · {value.molarMass.toFixed(3)} g/mol</>}
            {value.density !== null && <> · {value.density} g/mL</>}
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

  function choose(chemical: Chemical) {
    setText('');
    setOpen(false);
    onChange(toPicked(chemical));
  }

  function handleKeyDown(event: KeyboardEvent<HTMLInputElement>) {
    if (event.key === 'ArrowDown') {
      event.preventDefault();
      setOpen(true);
      setActive((i) => (options.length ? (i + 1) % options.length : 0));
    } else if (event.key === 'ArrowUp') {
      event.preventDefault();
      setActive((i) => (options.length ? (i - 1 + options.length) % options.length : 0));
    } else if (event.key === 'Enter') {
      event.preventDefault();
      const chosen = options[active];
      if (chosen && open) choose(chosen);
    } else if (event.key === 'Escape') {
      setOpen(false);
    }
  }

  const showList = open && debounced.trim().length > 0;
  return (
    <div className="relative">
      <Search
        aria-hidden="true"
        className="pointer-events-none absolute top-2.5 left-2.5 size-4 text-ink-500"
      />
      <Input
        id={id}
        role="combobox"
        autoComplete="off"
        aria-expanded={showList}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-activedescendant={showList && options[active] ? `${listId}-${active}` : undefined}
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        className="pl-8"
        placeholder="Name, synonym, CAS RN or formula"
        value={text}
        onChange={(event) => {
          setText(event.target.value);
          setActive(0);
          setOpen(true);
        }}
        onFocus={() => setOpen(true)}
        onBlur={() => setOpen(false)}
        onKeyDown={handleKeyDown}
      />
      {showList && (
        <ul
          id={listId}
          role="listbox"
          aria-label="Matching chemicals"
          className="absolute top-full right-0 left-0 z-30 mt-1 max-h-72 overflow-y-auto rounded-md border border-ink-200 bg-white py-1 shadow-lg"
        >
          {options.length === 0 ? (
            <li role="presentation" className="px-3 py-2 text-sm text-ink-600">
              {search.isFetching || debounced !== text
                ? 'Searching…'
                : 'No chemical matches. Add it to the chemicals list first.'}
            </li>
          ) : (
            options.map((chemical, index) => (
              <li
                key={chemical.id}
                id={`${listId}-${index}`}
                role="option"
                aria-selected={index === active}
                onMouseDown={(event) => event.preventDefault()}
                onClick={() => choose(chemical)}
                onMouseEnter={() => setActive(index)}
                className={cn(
                  'cursor-pointer px-3 py-1.5 text-sm',
                  index === active && 'bg-accent-50',
                )}
              >
                <span className="font-medium text-ink-900">{chemical.name}</span>
                <span className="ml-2 text-ink-600">
                  <Formula value={chemical.formula} />
                  {chemical.ghsPictograms.length > 0 && <> · {chemical.ghsPictograms.join(' ')}</>}
                </span>
              </li>
            ))
          )}
        </ul>
      )}
    </div>
  );
}
