import { tryParseUnit, type Dimension } from '@lotwise/chem';
import { z } from 'zod';

/**
 * The largest amount Lotwise takes, in the unit it is given in and again after conversion to
 * the chemical's stock unit: ten tonnes or ten cubic metres is far beyond any stockroom, and
 * the bound keeps a barcode typed into a quantity field (4006381333931) out of the ledger.
 */
export const maxStockAmount = 10_000_000;

/**
 * The smallest amount Lotwise records: a millionth of the unit (1 µg of a g-counted chemical,
 * 1 µL of an mL-counted one). Quantities are stored as whole millionths, so anything smaller
 * would be stored as nothing.
 */
export const minStockAmount = 0.000001;

/** How an amount may be signed. */
export type AmountSign = 'positive' | 'nonNegative' | 'signed';

/** {@link maxStockAmount} as messages write it, kept on one line (no-break spaces). */
export const maxStockAmountText = '10,000,000';

/**
 * What is wrong with an amount, or null when it is fine: a finite number, within
 * {@link maxStockAmount}, and either 0 (where allowed) or at least {@link minStockAmount}.
 * The one rule behind every amount schema, the import rows and the service's check after a
 * unit conversion.
 */
export function amountProblem(value: unknown, sign: AmountSign, unit?: string): string | null {
  if (typeof value !== 'number' || !Number.isFinite(value)) return 'must be a number';
  const inUnit = unit ? ` ${unit}` : '';
  if (sign === 'positive' && value <= 0) return 'must be more than 0';
  if (sign === 'nonNegative' && value < 0) return 'cannot be negative';
  if (sign === 'signed' && value === 0) return 'cannot be 0';
  const size = Math.abs(value);
  if (size > maxStockAmount) {
    return `must be at most ${maxStockAmountText}${inUnit || ' in the unit given'}: no container holds more (was a code typed into the amount?)`;
  }
  if (size !== 0 && size < minStockAmount) {
    return `is too small: Lotwise records amounts down to 0.000001${inUnit || ' of the unit'}`;
  }
  return null;
}

/**
 * An amount of stock as the API takes it: a finite number within the bounds of
 * {@link amountProblem}. `what` starts the message ("amount must be more than 0").
 */
export function amountSchema(what: string, sign: AmountSign) {
  return z.number({ message: `${what} must be a number` }).superRefine((value, ctx) => {
    const problem = amountProblem(value, sign);
    if (problem) ctx.addIssue({ code: 'custom', message: `${what} ${problem}` });
  });
}

/** {@link amountSchema} for query strings ("?targetLimitingMass=2.5"). */
export function coercedAmountSchema(what: string, sign: AmountSign) {
  return z.coerce.number({ message: `${what} must be a number` }).superRefine((value, ctx) => {
    const problem = amountProblem(value, sign);
    if (problem) ctx.addIssue({ code: 'custom', message: `${what} ${problem}` });
  });
}

/**
 * A unit symbol typed by a person, surrounding spaces dropped (" g" is g), of one of the
 * `dimensions` (all of them when not given).
 */
export function unitSchema(dimensions?: readonly Dimension[], message?: string) {
  return z
    .string({ message: 'must be a unit such as g or mL' })
    .trim()
    .superRefine((unit, ctx) => {
      const parsed = tryParseUnit(unit);
      if (!parsed.ok) ctx.addIssue({ code: 'custom', message: parsed.error.message });
      else if (dimensions && !dimensions.includes(parsed.value.dimension)) {
        ctx.addIssue({ code: 'custom', message: message ?? 'is not a unit that fits here' });
      }
    });
}

/** A unit of mass or volume a person may enter (g, mg, kg, mL, L, µL…). */
export const quantityUnitSchema = unitSchema(
  ['mass', 'volume'],
  'must be a mass or volume unit such as g or mL',
);
