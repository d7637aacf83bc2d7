import { useId, useState, type KeyboardEvent } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { Search } from 'lucide-react';
import { chemicalSchema, pageSchema, type Chemical } from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';
import { cn } from '../../lib/cn';
import { useDebouncedValue } from '../../lib/use-debounced-value';
import { Input } from '../ui/input';
import { Formula } from './formula';

const chemicalPageSchema = pageSchema(chemicalSchema);

function useChemicalSearch(q: string) {
  const trimmed = q.trim();
  return useQuery({
    queryKey: ['chemicals', 'search', trimmed],
    enabled: trimmed.length > 0,
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/chemicals', { q: trimmed, pageSize: 12, sort: 'name.asc' }),
        chemicalPageSchema,
        signal,
      ),
    placeholderData: keepPreviousData,
    staleTime: 10_000,
  });
}

/**
 * A search box that finds a chemical by part of its name, a synonym, its CAS RN or formula.
 * Arrow keys move through the matches, Enter or a click takes one, Escape closes the list.
 */
export function ChemicalSearchBox({
  id,
  onChoose,
  invalid,
  describedBy,
}: {
  id: string;
  onChoose: (chemical: Chemical) => void;
  invalid?: boolean;
  describedBy?: string;
}) {
  const [text, setText] = useState('');
  const [active, setActive] = useState(0);
  const [open, setOpen] = useState(false);
  const debounced = useDebouncedValue(text, 200);
  const search = useChemicalSearch(debounced);
  const listId = useId();
  const options = search.data?.items ?? [];

  function choose(chemical: Chemical) {
    setText('');
    setOpen(false);
    onChoose(chemical);
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
    <div className="relative max-w-xl">
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
          className="absolute top-full right-0 left-0 z-30 mt-1 max-h-80 overflow-y-auto rounded-md border border-ink-200 bg-white py-1 shadow-lg"
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
                  {chemical.casNumber && <> · {chemical.casNumber}</>}
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
