import { useMemo } from 'react';
import { canonicalFormula, tryMolarMass } from '@lotwise/chem';
import { Calculator, CircleAlert } from 'lucide-react';
import { Formula } from '../../../components/chem/formula';
import { formatMolarMass } from '../../../lib/format';

/**
 * The molar mass as the formula is typed, computed by packages/chem — the same function
 * the server uses, so the preview and the saved value agree — and the one form the formula
 * is stored in when that differs from what was typed.
 */
export function MolarMassPreview({ formula }: { formula: string | null | undefined }) {
  const trimmed = formula?.trim() ?? '';
  const result = useMemo(() => (trimmed ? tryMolarMass(trimmed) : null), [trimmed]);

  if (!result) {
    return <span className="text-ink-600">Molar mass is computed from the formula.</span>;
  }
  if (!result.ok) {
    return (
      <span className="flex items-start gap-1.5 text-warn-700">
        <CircleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
        <span>
          No molar mass yet: <span data-testid="molar-mass-error">{result.error.message}</span>
        </span>
      </span>
    );
  }
  const stored = canonicalFormula(trimmed);
  return (
    <span className="flex items-center gap-1.5 text-ink-800">
      <Calculator aria-hidden="true" className="size-4 shrink-0 text-accent-600" />
      <span>
        <Formula value={stored} /> ·{' '}
        <strong className="font-semibold tabular-nums" data-testid="molar-mass">
          {formatMolarMass(result.value)}
        </strong>
        {stored !== trimmed && (
          <span className="block text-xs text-ink-600" data-testid="formula-stored-as">
            saved as {stored}
          </span>
        )}
      </span>
    </span>
  );
}
