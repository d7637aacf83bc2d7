import { ChemError } from './errors';

// Internal guards shared by the calculation modules; not part of the package entry point.

/** Format a number for an error message without float noise. */
export function show(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  return String(Number(value.toPrecision(6)));
}

/** Throws `not_a_number` unless `value` is a finite number. */
export function requireFinite(value: number, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ChemError(
      'not_a_number',
      `${what} must be a finite number, got ${String(value)}: enter a number such as 2.5`,
    );
  }
  return value;
}

/** Throws unless `value` is finite and zero or more. */
export function requireNonNegative(value: number, what: string): number {
  requireFinite(value, what);
  if (value < 0) {
    throw new ChemError(
      'negative_quantity',
      `${what} cannot be negative (got ${show(value)}): enter the amount as a positive number`,
    );
  }
  return value;
}

/** Throws unless `value` is finite and greater than zero. */
export function requirePositive(value: number, what: string): number {
  requireFinite(value, what);
  if (value <= 0) {
    throw new ChemError('not_positive', `${what} must be greater than 0 (got ${show(value)})`);
  }
  return value;
}

/** Throws unless `value` is a percentage in (0, 100]. */
export function requirePercent(value: number, what: string): number {
  requireFinite(value, what);
  if (value <= 0 || value > 100) {
    throw new ChemError(
      'out_of_range',
      `${what} must be more than 0 % and at most 100 % (got ${show(value)} %)`,
    );
  }
  return value;
}
