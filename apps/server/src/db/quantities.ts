import type { ValueTransformer } from 'typeorm';

/**
 * Stock quantities (container balances, ledger entries, reservations) are stored as whole
 * millionths of the stock unit (µg of a g-counted chemical, µL of an mL-counted one) in
 * `bigint` columns, so a balance is exactly the integer sum of its entries. The rest of the
 * code and the API keep plain numbers in g or mL; the conversion happens here, at the
 * repository boundary.
 */
export const microPerUnit = 1_000_000;

/** g or mL -> whole millionths, rounded half away from zero (so a draw and its undo match). */
export function toMicro(value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`A stock quantity must be a finite number, not ${String(value)}.`);
  }
  const micro = Math.sign(value) * Math.round(Math.abs(value) * microPerUnit);
  if (!Number.isSafeInteger(micro)) {
    throw new RangeError(`The stock quantity ${value} is too large to store exactly.`);
  }
  return micro === 0 ? 0 : micro;
}

/**
 * Whole millionths as the database answers them (a number from better-sqlite3, a string
 * from PostgreSQL's bigint, or a bigint) -> g or mL.
 */
export function fromMicro(raw: unknown): number {
  const micro = typeof raw === 'bigint' ? Number(raw) : Number(raw ?? 0);
  const value = micro / microPerUnit;
  return value === 0 ? 0 : value;
}

/** g or mL rounded to what is stored: a whole millionth. */
export function roundToStored(value: number): number {
  return fromMicro(toMicro(value));
}

/** Column transformer: the entity holds g or mL, the column whole millionths. */
export const microQuantity: ValueTransformer = {
  to: (value: unknown) =>
    value === null || value === undefined ? value : toMicro(value as number),
  from: (value: unknown) => (value === null || value === undefined ? value : fromMicro(value)),
};
