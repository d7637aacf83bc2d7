import { ChemError, type Result, toResult } from './errors';
import { requireFinite } from './validation';

/** What a unit measures. Base units: g (mass), mL (volume), mol (amount of substance). */
export type Dimension = 'mass' | 'volume' | 'amount';

/** Canonical unit symbols, smallest first within each dimension. "µ" is U+00B5. */
export const UNIT_SYMBOLS = [
  'µg',
  'mg',
  'g',
  'kg',
  'µL',
  'mL',
  'L',
  'µmol',
  'mmol',
  'mol',
] as const;

/** One of {@link UNIT_SYMBOLS}. */
export type UnitSymbol = (typeof UNIT_SYMBOLS)[number];

/** The base unit of each dimension: every conversion goes through it. */
export const BASE_UNITS: Readonly<Record<Dimension, UnitSymbol>> = {
  mass: 'g',
  volume: 'mL',
  amount: 'mol',
};

/** A parsed unit. */
export interface Unit {
  /** Canonical symbol, e.g. "mL" for "ml". */
  symbol: UnitSymbol;
  dimension: Dimension;
  /** Multiply a value in this unit by `factor` to get the base unit (mg: 0.001 g). */
  factor: number;
  /** factor = 10^exponent; conversions use the exponent to avoid float noise. */
  exponent: number;
}

/** A number with its unit, e.g. { value: 5, unit: 'mL' }. */
export interface Quantity {
  value: number;
  /** Any spelling {@link parseUnit} accepts. */
  unit: string;
}

const DEFINITIONS: Record<UnitSymbol, { dimension: Dimension; exponent: number }> = {
  µg: { dimension: 'mass', exponent: -6 },
  mg: { dimension: 'mass', exponent: -3 },
  g: { dimension: 'mass', exponent: 0 },
  kg: { dimension: 'mass', exponent: 3 },
  µL: { dimension: 'volume', exponent: -3 },
  mL: { dimension: 'volume', exponent: 0 },
  L: { dimension: 'volume', exponent: 3 },
  µmol: { dimension: 'amount', exponent: -6 },
  mmol: { dimension: 'amount', exponent: -3 },
  mol: { dimension: 'amount', exponent: 0 },
};

// Spellings people type: "u" for micro, Greek mu (U+03BC) as well as the micro sign, and a
// lowercase "l" for litre.
const ALIASES: Record<string, UnitSymbol> = {
  ug: 'µg',
  μg: 'µg',
  uL: 'µL',
  ul: 'µL',
  µl: 'µL',
  μL: 'µL',
  μl: 'µL',
  ml: 'mL',
  l: 'L',
  umol: 'µmol',
  μmol: 'µmol',
};

const DIMENSION_WORD: Record<Dimension, string> = {
  mass: 'a mass',
  volume: 'a volume',
  amount: 'an amount of substance',
};

/**
 * Parse a unit string: "mg", "ml", "µL", "uL", "mmol"… Leading and trailing spaces are
 * ignored; letter case matters otherwise ("ML" is not accepted).
 *
 * @throws ChemError `unknown_unit`, whose message lists the valid units
 */
export function parseUnit(text: string): Unit {
  const trimmed = typeof text === 'string' ? text.trim() : '';
  const symbol: UnitSymbol | undefined =
    trimmed in DEFINITIONS ? (trimmed as UnitSymbol) : ALIASES[trimmed];
  if (symbol === undefined) {
    throw new ChemError(
      'unknown_unit',
      `unknown unit "${String(text)}": use one of ${UNIT_SYMBOLS.join(', ')} (ug, uL, ml, l and umol are also accepted)`,
    );
  }
  const { dimension, exponent } = DEFINITIONS[symbol];
  return { symbol, dimension, exponent, factor: 10 ** exponent };
}

/** {@link parseUnit} as a {@link Result}. */
export function tryParseUnit(text: string): Result<Unit> {
  return toResult(() => parseUnit(text));
}

/** True when {@link parseUnit} accepts `text`. */
export function isUnit(text: string): boolean {
  return tryParseUnit(text).ok;
}

/** Canonical units of one dimension, smallest first. */
export function unitsOf(dimension: Dimension): UnitSymbol[] {
  return UNIT_SYMBOLS.filter((symbol) => DEFINITIONS[symbol].dimension === dimension);
}

function scale(value: number, exponent: number): number {
  // Dividing by an exact power of ten keeps 5 mg -> 0.005 g instead of 0.005000000000000001.
  return exponent >= 0 ? value * 10 ** exponent : value / 10 ** -exponent;
}

/**
 * Convert a value between two units of the same dimension: convert(250, 'mL', 'L') = 0.25.
 * Negative values are allowed here (a ledger correction is negative); the
 * chemistry conversions refuse them.
 *
 * @throws ChemError `unknown_unit`, `not_a_number`, `incompatible_units` (mass to volume
 *   needs a density: use {@link toVolume} from conversions)
 */
export function convert(value: number, from: string, to: string): number {
  requireFinite(value, 'value');
  const source = parseUnit(from);
  const target = parseUnit(to);
  if (source.dimension !== target.dimension) {
    throw new ChemError(
      'incompatible_units',
      `cannot convert ${source.symbol} (${DIMENSION_WORD[source.dimension]}) to ${target.symbol} (${DIMENSION_WORD[target.dimension]}) by units alone: ${crossHint(source.dimension, target.dimension)}`,
    );
  }
  return scale(value, source.exponent - target.exponent);
}

function crossHint(from: Dimension, to: Dimension): string {
  const pair = new Set([from, to]);
  if (pair.has('mass') && pair.has('volume')) return 'give the density (g/mL)';
  if (pair.has('mass') && pair.has('amount')) return 'give the molar mass (g/mol)';
  return 'give the density and the molar mass';
}

/** A value expressed in the base unit of its dimension. */
export interface BaseQuantity {
  value: number;
  dimension: Dimension;
  /** g, mL or mol. */
  unit: UnitSymbol;
}

/**
 * A quantity in the base unit of its dimension: { value: 250, unit: 'mg' } ->
 * { value: 0.25, dimension: 'mass', unit: 'g' }.
 *
 * @throws ChemError `unknown_unit`, `not_a_number`
 */
export function toBaseUnit(quantity: Quantity): BaseQuantity {
  const unit = parseUnit(quantity.unit);
  requireFinite(quantity.value, 'value');
  return {
    value: scale(quantity.value, unit.exponent),
    dimension: unit.dimension,
    unit: BASE_UNITS[unit.dimension],
  };
}

/** The dimension of a unit string. @throws ChemError `unknown_unit` */
export function dimensionOf(unit: string): Dimension {
  return parseUnit(unit).dimension;
}
