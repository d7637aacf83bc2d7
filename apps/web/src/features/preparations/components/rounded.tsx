import { roundAmountForDisplay, roundMassForDisplay, roundVolumeForDisplay } from '@lotwise/chem';
import { formatFullPrecision } from '@lotwise/shared';
import { formatFixed, formatRoundedAmount } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';

/** Enough digits to check a hand calculation, without float noise. */
export function fullPrecision(value: number): string {
  return formatFullPrecision(value);
}

/**
 * A value rounded for the bench (by @lotwise/chem's rule), with the full-precision value as
 * a tooltip and as small secondary text, so the rounding is never mistaken for the number.
 */
export function Rounded({
  text,
  value,
  unit,
  rule,
  secondary = true,
  testId,
  inline = false,
}: {
  /** In a sentence: the full precision follows in brackets instead of under it. */
  inline?: boolean;
  /** The rounded text, e.g. "2.61 g". */
  text: string;
  /** Full precision, in `unit`. */
  value: number;
  unit: string;
  rule?: string;
  secondary?: boolean;
  testId?: string;
}) {
  const exact = `${fullPrecision(value)} ${unit}`;
  const title = rule ? `${exact} at full precision. ${rule}` : `${exact} at full precision`;
  // Only when rounding changed the number (not for "44.0 mL" against 44).
  const rounded = parseDecimal(text.split(' ')[0]) !== Number(fullPrecision(value));
  return (
    <span
      className={inline ? 'tabular-nums' : 'inline-flex flex-col leading-tight'}
      data-value={value}
      data-testid={testId}
    >
      <span title={title} className="whitespace-nowrap tabular-nums">
        {text}
      </span>
      {secondary && rounded && (
        <span className="text-xs font-normal whitespace-nowrap text-ink-600 tabular-nums print:hidden">
          {inline ? ` (${exact})` : exact}
        </span>
      )}
    </span>
  );
}

/** A mass in g rounded by the balance rule. */
export function Mass({
  g,
  testId,
  secondary = true,
  inline,
}: {
  g: number | null | undefined;
  testId?: string;
  secondary?: boolean;
  inline?: boolean;
}) {
  if (g === null || g === undefined) return <span className="text-ink-500">—</span>;
  const d = roundMassForDisplay(g);
  return (
    <Rounded
      text={formatRoundedAmount(d)}
      value={g}
      unit="g"
      rule={d.rule}
      testId={testId}
      secondary={secondary}
      inline={inline}
    />
  );
}

/** A volume in mL rounded by the glassware rule. */
export function Volume({
  mL,
  testId,
  secondary = true,
}: {
  mL: number | null | undefined;
  testId?: string;
  secondary?: boolean;
}) {
  if (mL === null || mL === undefined) return <span className="text-ink-500">—</span>;
  const d = roundVolumeForDisplay(mL);
  return (
    <Rounded
      text={formatRoundedAmount(d)}
      value={mL}
      unit="mL"
      rule={d.rule}
      testId={testId}
      secondary={secondary}
    />
  );
}

/** An amount in mol, shown in mmol or mol to 3 significant figures. */
export function Moles({
  mol,
  testId,
  inline,
  secondary = true,
}: {
  mol: number | null | undefined;
  testId?: string;
  inline?: boolean;
  secondary?: boolean;
}) {
  if (mol === null || mol === undefined) return <span className="text-ink-500">—</span>;
  const d = roundAmountForDisplay(mol);
  const inUnit = d.unit === 'mmol' ? mol * 1000 : mol;
  return (
    <Rounded
      text={formatRoundedAmount(d)}
      value={inUnit}
      unit={d.unit}
      rule={d.rule}
      testId={testId}
      inline={inline}
      secondary={secondary}
    />
  );
}

/** Equivalents relative to the limiting reagent, 2 decimals. */
export function Equivalents({ value }: { value: number | null | undefined }) {
  if (value === null || value === undefined) return <span className="text-ink-500">—</span>;
  return (
    <span className="tabular-nums" title={`${fullPrecision(value)} equivalents`}>
      {formatFixed(value, 2)}
    </span>
  );
}
