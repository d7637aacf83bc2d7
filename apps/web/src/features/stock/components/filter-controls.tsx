import { useRef, type ReactNode } from 'react';
import { Link } from 'react-router';
import { Search } from 'lucide-react';
import { storageGroupCodes, storageGroups, type StorageGroup } from '@lotwise/shared';
import { Input, Select } from '../../../components/ui/input';
import { cn } from '../../../lib/cn';
import { useSearchBox } from '../../../lib/use-search-box';
import { useSlashFocus } from '../../../lib/use-slash-focus';

export function FilterField({
  id,
  label,
  children,
  className,
}: {
  id: string;
  label: string;
  children: ReactNode;
  className?: string;
}) {
  return (
    <div className={cn('flex flex-col gap-1', className)}>
      <label htmlFor={id} className="text-sm font-medium text-ink-800">
        {label}
      </label>
      {children}
    </div>
  );
}

/** A list's search box: follows the URL, commits after typing pauses, `/` focuses it. */
export function ListSearch({
  id,
  q,
  onSearch,
  placeholder,
}: {
  id: string;
  q: string;
  onSearch: (q: string) => void;
  placeholder: string;
}) {
  const ref = useRef<HTMLInputElement>(null);
  useSlashFocus(ref);
  const [text, setText] = useSearchBox(q, onSearch);
  return (
    <FilterField id={id} label="Search" className="min-w-60 flex-1">
      <div className="relative">
        <Search
          aria-hidden="true"
          className="pointer-events-none absolute top-2.5 left-2.5 size-4 text-ink-500"
        />
        <Input
          id={id}
          ref={ref}
          type="search"
          value={text}
          onChange={(event) => setText(event.target.value)}
          placeholder={placeholder}
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
    </FilterField>
  );
}

export function StorageGroupSelect({
  id,
  value,
  onChange,
}: {
  id: string;
  value: StorageGroup | undefined;
  onChange: (value: string | undefined) => void;
}) {
  return (
    <FilterField id={id} label="Storage group">
      <Select
        id={id}
        className="w-48"
        value={value ?? ''}
        onChange={(event) => onChange(event.target.value || undefined)}
      >
        <option value="">All storage groups</option>
        {storageGroupCodes.map((code) => (
          <option key={code} value={code}>
            {storageGroups[code].label}
          </option>
        ))}
      </Select>
    </FilterField>
  );
}

const expiryChoices = [7, 30, 90, 180, 365];

/** "Expiring within N days" as a select; a number typed into the URL is kept as a choice. */
export function ExpiringSelect({
  id,
  value,
  onChange,
  monthDays,
}: {
  id: string;
  value: number | undefined;
  onChange: (value: string | undefined) => void;
  /** Days left in this month: offered as "By the end of this month". */
  monthDays: number;
}) {
  const choices = new Set(expiryChoices);
  return (
    <FilterField id={id} label="Expiring">
      <Select
        id={id}
        className="w-52"
        value={value ?? ''}
        onChange={(event) => onChange(event.target.value || undefined)}
      >
        <option value="">Any time</option>
        {!choices.has(monthDays) && <option value={monthDays}>By the end of this month</option>}
        {expiryChoices.map((days) => (
          <option key={days} value={days}>
            Within {days} days
          </option>
        ))}
        {value !== undefined && value !== monthDays && !choices.has(value) && (
          <option value={value}>Within {value} days</option>
        )}
      </Select>
    </FilterField>
  );
}

/** A quick filter that can be switched on and off; its state is announced. */
export function FilterChip({
  pressed,
  onToggle,
  icon,
  children,
}: {
  pressed: boolean;
  onToggle: () => void;
  icon: ReactNode;
  children: ReactNode;
}) {
  return (
    <button
      type="button"
      aria-pressed={pressed}
      onClick={onToggle}
      className={cn(
        'inline-flex h-8 items-center gap-1.5 rounded-full border px-3 text-sm transition-colors [&_svg]:size-4',
        pressed
          ? 'border-accent-600 bg-accent-50 font-medium text-accent-800'
          : 'border-ink-300 bg-white text-ink-700 hover:border-ink-400 hover:bg-ink-100',
      )}
    >
      {icon}
      {children}
    </button>
  );
}

/** A link to a ready-made view, for the questions people come to Stock with. */
export function QuickLink({
  to,
  icon,
  title,
  detail,
}: {
  to: string;
  icon: ReactNode;
  title: string;
  detail: ReactNode;
}) {
  return (
    <Link
      to={to}
      className="flex items-start gap-2.5 rounded-lg border border-ink-200 bg-white px-3 py-2.5 hover:border-accent-300 hover:bg-accent-50/60 [&>svg]:mt-0.5 [&>svg]:size-4 [&>svg]:shrink-0 [&>svg]:text-accent-600"
    >
      {icon}
      <span>
        <span className="block text-sm font-semibold text-ink-900">{title}</span>
        <span className="block text-xs text-ink-600">{detail}</span>
      </span>
    </Link>
  );
}
