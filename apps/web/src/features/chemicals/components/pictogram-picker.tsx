import { ghsCodes, ghsPictograms, type GhsCode } from '@lotwise/shared';
import { PictogramSymbol } from '../../../components/hazards/pictogram-symbols';
import { FieldError } from '../../../components/ui/field';
import { cn } from '../../../lib/cn';

interface PictogramPickerProps {
  value: readonly GhsCode[];
  onChange: (value: GhsCode[]) => void;
  onBlur?: () => void;
  error?: string;
}

/** Nine checkboxes, each with its drawn pictogram, code, symbol name and meaning. */
export function PictogramPicker({ value, onChange, onBlur, error }: PictogramPickerProps) {
  function toggle(code: GhsCode, checked: boolean) {
    const next = checked ? [...value, code] : value.filter((c) => c !== code);
    // Keep the standard's order, whatever order they were ticked in.
    onChange(ghsCodes.filter((c) => next.includes(c)));
  }

  return (
    <fieldset
      aria-describedby={error ? 'pictograms-error' : undefined}
      className="flex flex-col gap-2"
    >
      <legend className="mb-1 text-sm font-medium text-ink-800">GHS pictograms</legend>
      <div className="grid gap-2 sm:grid-cols-2 xl:grid-cols-3">
        {ghsCodes.map((code) => {
          const checked = value.includes(code);
          const { symbol, meaning } = ghsPictograms[code];
          return (
            <label
              key={code}
              className={cn(
                'flex cursor-pointer items-start gap-2.5 rounded-md border p-2 transition-colors has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent-600',
                checked
                  ? 'border-accent-600 bg-accent-50'
                  : 'border-ink-200 bg-white hover:border-ink-400',
              )}
            >
              <input
                type="checkbox"
                className="mt-1 size-4 shrink-0 accent-accent-600 focus-visible:outline-none"
                checked={checked}
                onChange={(event) => toggle(code, event.target.checked)}
                onBlur={onBlur}
              />
              <PictogramSymbol code={code} size={40} className="shrink-0" />
              <span className="flex flex-col text-sm leading-5">
                <span>
                  <span className="font-semibold tabular-nums">{code}</span> {symbol}
                </span>
                <span className="text-xs text-ink-600">{meaning}</span>
              </span>
            </label>
          );
        })}
      </div>
      {error && <FieldError id="pictograms-error">{error}</FieldError>}
    </fieldset>
  );
}
