import { useId, useState, type KeyboardEvent } from 'react';
import { useNavigate } from 'react-router';
import { Boxes, FlaskConical, Search } from 'lucide-react';
import { Formula } from '../../../components/chem/formula';
import { cn } from '../../../lib/cn';
import { labelCodeFromScan } from '../../../lib/label-scan';
import { globalSearchId, useSearchHint } from '../../../lib/shortcuts';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { paths } from '../../../config/paths';
import { useGlobalSearch } from '../api';

interface Option {
  key: string;
  to: string;
  kind: 'container' | 'chemical';
  title: string;
  detail: string;
  formula?: string | null;
}

/**
 * The top bar's search: chemicals and containers. A label code typed or scanned, then
 * Enter, opens that container straight away. Arrow keys move through the results, Enter
 * opens one, Escape closes the list.
 */
export function GlobalSearch() {
  const navigate = useNavigate();
  const [text, setText] = useState('');
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);
  const debounced = useDebouncedValue(text, 200);
  const search = useGlobalSearch(debounced);
  const listId = useId();
  const hintId = useId();
  // Why the cursor was put here (e.g. by the `d` shortcut), until the field is left.
  const [hint, clearHint] = useSearchHint();

  const options: Option[] = debounced.trim()
    ? [
        ...(search.data?.containers ?? []).map((c) => ({
          key: `container-${c.id}`,
          to: paths.stockContainer(c.id),
          kind: 'container' as const,
          title: c.labelCode,
          detail: `${c.chemicalName} · ${c.locationPath}`,
        })),
        ...(search.data?.chemicals ?? []).map((c) => ({
          key: `chemical-${c.id}`,
          to: paths.stockChemical(c.id),
          kind: 'chemical' as const,
          title: c.name,
          detail: [
            c.matchedSynonym && `also “${c.matchedSynonym}”`,
            c.casNumber && `CAS RN ${c.casNumber}`,
          ]
            .filter(Boolean)
            .join(' · '),
          formula: c.formula,
        })),
      ]
    : [];
  const showList = open && text.trim().length > 0;

  function go(to: string) {
    setOpen(false);
    setActive(-1);
    setText('');
    navigate(to);
  }

  function handleKeyDown(event: KeyboardEvent<HTMLInputElement>) {
    if (event.key === 'ArrowDown') {
      event.preventDefault();
      setOpen(true);
      setActive((index) => (options.length === 0 ? -1 : (index + 1) % options.length));
    } else if (event.key === 'ArrowUp') {
      event.preventDefault();
      setActive((index) =>
        options.length === 0 ? -1 : index <= 0 ? options.length - 1 : index - 1,
      );
    } else if (event.key === 'Escape') {
      if (open) {
        event.preventDefault();
        setOpen(false);
        setActive(-1);
      } else setText('');
    } else if (event.key === 'Enter') {
      event.preventDefault();
      const chosen = active >= 0 ? options[active] : undefined;
      if (chosen) return go(chosen.to);
      // A scanner types the code (or the label's QR address) and Enter at once: jump
      // without waiting for results.
      const labelCode = labelCodeFromScan(text);
      if (labelCode) return go(paths.stockContainerByLabel(labelCode));
      if (options[0] && debounced === text) go(options[0].to);
    }
  }

  return (
    <div className="relative w-full max-w-md">
      <label htmlFor={globalSearchId} className="sr-only">
        Search chemicals and containers
      </label>
      <Search
        aria-hidden="true"
        className="pointer-events-none absolute top-2.5 left-2.5 size-4 text-ink-500"
      />
      <input
        id={globalSearchId}
        type="search"
        role="combobox"
        autoComplete="off"
        spellCheck={false}
        aria-expanded={showList}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-describedby={hint ? hintId : undefined}
        aria-activedescendant={showList && active >= 0 ? `${listId}-${active}` : undefined}
        placeholder="Find a chemical or scan a label (LW-00042)"
        value={text}
        onChange={(event) => {
          setText(event.target.value);
          setOpen(true);
          setActive(-1);
        }}
        onFocus={() => setOpen(true)}
        onBlur={() => {
          setOpen(false);
          clearHint();
        }}
        onKeyDown={handleKeyDown}
        className="h-9 w-full rounded-md border border-ink-300 bg-ink-50 pr-2.5 pl-8 text-sm text-ink-900 placeholder:text-ink-500 hover:border-ink-400 focus:bg-white"
      />
      {hint && !showList && (
        <p
          id={hintId}
          className="absolute top-full right-0 left-0 z-30 mt-1 rounded-md border border-accent-200 bg-accent-50 px-3 py-2 text-sm text-ink-900 shadow-lg"
        >
          {hint}
        </p>
      )}
      {showList && (
        <ul
          id={listId}
          role="listbox"
          aria-label="Search results"
          className="absolute top-full right-0 left-0 z-30 mt-1 max-h-96 overflow-y-auto rounded-md border border-ink-200 bg-white py-1 shadow-lg"
        >
          {options.length === 0 ? (
            <li role="presentation" className="px-3 py-2 text-sm text-ink-600">
              {search.isFetching || debounced !== text
                ? 'Searching…'
                : labelCodeFromScan(text)
                  ? `Press Enter to open ${labelCodeFromScan(text)}`
                  : 'Nothing found. Try a CAS RN, a formula or a label code.'}
            </li>
          ) : (
            options.map((option, index) => {
              const Icon = option.kind === 'container' ? Boxes : FlaskConical;
              return (
                <li
                  key={option.key}
                  id={`${listId}-${index}`}
                  role="option"
                  aria-selected={index === active}
                  // Keep focus in the input so the list does not close before the click lands.
                  onMouseDown={(event) => event.preventDefault()}
                  onClick={() => go(option.to)}
                  onMouseEnter={() => setActive(index)}
                  className={cn(
                    'flex cursor-pointer items-start gap-2 px-3 py-1.5 text-sm',
                    index === active && 'bg-accent-50',
                  )}
                >
                  <Icon aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-ink-500" />
                  <span className="min-w-0">
                    <span
                      className={cn(
                        'block font-medium text-ink-900',
                        option.kind === 'container' && 'font-mono',
                      )}
                    >
                      {option.title}
                      {option.formula && (
                        <span className="ml-2 font-normal text-ink-600">
                          <Formula value={option.formula} />
                        </span>
                      )}
                    </span>
                    {option.detail && (
                      <span className="block truncate text-xs text-ink-600">{option.detail}</span>
                    )}
                  </span>
                  <span className="sr-only">
                    {option.kind === 'container' ? ', container' : ', chemical'}
                  </span>
                </li>
              );
            })
          )}
        </ul>
      )}
    </div>
  );
}
