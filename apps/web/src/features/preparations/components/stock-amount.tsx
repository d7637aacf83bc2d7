import { formatAmount, formatTakeAmount } from '../../../lib/format';
import { fullPrecision } from './rounded';

/**
 * An amount of stock (what a container holds, what is available, short or drawn), written
 * by the one amount rule in its stock unit, with the full precision as a tooltip.
 */
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
  const text = formatAmount(value, unit);
  const exact = `${fullPrecision(value)} ${unit}`;
  return (
    <span className="tabular-nums" data-testid={testId} data-value={value}>
      <span title={`${exact} at full precision`} className="whitespace-nowrap">
        {text}
      </span>
      {secondary && Number(text.replace(/[^0-9.-]/g, '')) !== Number(fullPrecision(value)) && (
        <span className="ml-1 text-xs font-normal whitespace-nowrap text-ink-500 print:hidden">
          ({exact})
        </span>
      )}
    </span>
  );
}

/**
 * What to take from a container: never written larger than it holds; taking it all reads
 * "all (34.95 mL)".
 */
export function TakeAmount({
  take,
  holds,
  unit,
  testId,
}: {
  take: number;
  holds: number;
  unit: string;
  testId?: string;
}) {
  return (
    <span
      className="whitespace-nowrap tabular-nums"
      data-testid={testId}
      data-value={take}
      title={`${fullPrecision(take)} ${unit} of ${fullPrecision(holds)} ${unit}`}
    >
      {formatTakeAmount(take, holds, unit)}
    </span>
  );
}
