import { formatAmount } from '../../../lib/format';
import { Mass, Volume } from './rounded';

/** An amount in a stock unit, rounded by the balance (g) or glassware (mL) rule. */
export function StockAmount({
  value,
  unit,
  testId,
  secondary = false,
}: {
  value: number | null | undefined;
  unit: string;
  testId?: string;
  /** Full precision as small text too (always in the tooltip). */
  secondary?: boolean;
}) {
  if (value === null || value === undefined) return <span className="text-ink-500">—</span>;
  if (unit === 'g') return <Mass g={value} testId={testId} secondary={secondary} />;
  if (unit === 'mL') return <Volume mL={value} testId={testId} secondary={secondary} />;
  return (
    <span className="tabular-nums" data-testid={testId}>
      {formatAmount(value, unit)}
    </span>
  );
}
