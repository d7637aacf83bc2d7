import { useRef } from 'react';
import { Search, X } from 'lucide-react';
import {
  ghsCodes,
  ghsPictograms,
  physicalStates,
  storageGroupCodes,
  storageGroups,
  type GhsCode,
  type PhysicalState,
  type StorageGroup,
} from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Input, Select } from '../../../components/ui/input';
import { useSearchBox } from '../../../lib/use-search-box';
import { useSlashFocus } from '../../../lib/use-slash-focus';
import { physicalStateLabels } from '../labels';
import type { ChemicalFilterKey } from '../list-params';

interface ChemicalFiltersProps {
  q: string;
  storageGroup?: StorageGroup;
  pictogram?: GhsCode;
  physicalState?: PhysicalState;
  filtered: boolean;
  onSearch: (q: string) => void;
  onFilter: (key: ChemicalFilterKey, value: string | undefined) => void;
  onClear: () => void;
}

export function ChemicalFilters({
  q,
  storageGroup,
  pictogram,
  physicalState,
  filtered,
  onSearch,
  onFilter,
  onClear,
}: ChemicalFiltersProps) {
  const searchRef = useRef<HTMLInputElement>(null);
  useSlashFocus(searchRef);

  const [text, setText] = useSearchBox(q, onSearch);

  return (
    <div role="search" className="flex flex-wrap items-end gap-3">
      <div className="flex min-w-64 flex-1 flex-col gap-1">
        <label htmlFor="chemical-search" className="text-sm font-medium text-ink-800">
          Search
        </label>
        <div className="relative">
          <Search
            aria-hidden="true"
            className="pointer-events-none absolute top-2.5 left-2.5 size-4 text-ink-500"
          />
          <Input
            id="chemical-search"
            ref={searchRef}
            type="search"
            value={text}
            onChange={(event) => setText(event.target.value)}
            placeholder="Name, synonym, formula or CAS RN"
            aria-keyshortcuts="/"
            className="pr-9 pl-8"
          />
          <kbd
            aria-hidden="true"
            className="pointer-events-none absolute top-2 right-2 rounded border border-ink-300 bg-ink-50 px-1.5 text-xs text-ink-600"
          >
            /
          </kbd>
        </div>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="filter-storage-group" className="text-sm font-medium text-ink-800">
          Storage group
        </label>
        <Select
          id="filter-storage-group"
          className="w-48"
          value={storageGroup ?? ''}
          onChange={(event) => onFilter('storageGroup', event.target.value || undefined)}
        >
          <option value="">All storage groups</option>
          {storageGroupCodes.map((code) => (
            <option key={code} value={code}>
              {storageGroups[code].label}
            </option>
          ))}
        </Select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="filter-pictogram" className="text-sm font-medium text-ink-800">
          Pictogram
        </label>
        <Select
          id="filter-pictogram"
          className="w-56"
          value={pictogram ?? ''}
          onChange={(event) => onFilter('pictogram', event.target.value || undefined)}
        >
          <option value="">Any pictogram</option>
          {ghsCodes.map((code) => (
            <option key={code} value={code}>
              {code} {ghsPictograms[code].symbol}
            </option>
          ))}
        </Select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="filter-physical-state" className="text-sm font-medium text-ink-800">
          State
        </label>
        <Select
          id="filter-physical-state"
          className="w-32"
          value={physicalState ?? ''}
          onChange={(event) => onFilter('physicalState', event.target.value || undefined)}
        >
          <option value="">Any state</option>
          {physicalStates.map((state) => (
            <option key={state} value={state}>
              {physicalStateLabels[state]}
            </option>
          ))}
        </Select>
      </div>
      {filtered && (
        <Button
          variant="ghost"
          onClick={onClear}
          icon={<X aria-hidden="true" className="size-4" />}
        >
          Clear filters
        </Button>
      )}
    </div>
  );
}
