import { ChemError } from './errors';
import {
  computeStoichiometry,
  lineAmounts,
  type LineResult,
  type ProcedureLine,
} from './stoichiometry';
import { type Quantity, toBaseUnit } from './units';
import { requireFinite, requirePercent, show } from './validation';

/** How masses are rounded for display. */
export const BALANCE_RULE =
  'Masses: below 1 g, 3 significant figures (finest 0.1 mg, an analytical balance); from 1 g to under 100 g, to 0.01 g; from 100 g to under 1000 g, to 0.1 g; from 1000 g, to 1 g.'; // common practice, no source

/** How volumes are rounded for display, after the glassware that measures them. */
export const GLASSWARE_RULE =
  'Volumes: below 1 mL, to 0.01 mL (1 mL graduated pipette or micropipette); from 1 mL to under 10 mL, to 0.1 mL (graduated pipette or 10 mL cylinder); from 10 mL to 50 mL, to 0.5 mL (50 mL cylinder); above 50 mL, to 1 mL.'; // common practice, no source

/** How amounts of substance are rounded for display. */
export const AMOUNT_RULE = 'Amounts: 3 significant figures, in mmol below 1 mol.'; // common practice, no source

/** A rounded value for display, with the rule that rounded it. Keep the exact value apart. */
export interface DisplayValue {
  /** Rounded number in `unit`. */
  value: number;
  /** g, mL, mmol or mol. */
  unit: string;
  /** e.g. "2.61 g", "12.5 mL", "9.52 mmol". */
  text: string;
  /** Decimals shown in `text`. */
  decimals: number;
  /** {@link BALANCE_RULE}, {@link GLASSWARE_RULE} or {@link AMOUNT_RULE}. */
  rule: string;
}

function display(value: number, decimals: number, unit: string, rule: string): DisplayValue {
  const text = value.toFixed(decimals);
  return { value: Number(text), unit, text: `${text} ${unit}`, decimals, rule };
}

function significantDecimals(value: number, figures: number): number {
  if (value === 0) return 0;
  return Math.max(0, figures - 1 - Math.floor(Math.log10(Math.abs(value))));
}

/**
 * Round a mass in g for display by {@link BALANCE_RULE}: 0.24683 -> "0.247 g",
 * 2.6087 -> "2.61 g", 123.456 -> "123.5 g". // common practice, no source
 */
export function roundMassForDisplay(massG: number): DisplayValue {
  requireFinite(massG, 'mass');
  const size = Math.abs(massG);
  let decimals: number;
  if (size === 0) decimals = 0;
  else if (size < 1) {
    // 3 significant figures, but never finer than 0.1 mg; re-check after rounding up to 1 g.
    decimals = Math.min(4, significantDecimals(massG, 3));
    if (Math.abs(Number(massG.toFixed(decimals))) >= 1) decimals = 2;
  } else if (size < 100) decimals = 2;
  else if (size < 1000) decimals = 1;
  else decimals = 0;
  return display(massG, decimals, 'g', BALANCE_RULE);
}

/**
 * Round a volume in mL for display by {@link GLASSWARE_RULE}: 0.7 -> "0.70 mL",
 * 5.03 -> "5.0 mL", 12.3 -> "12.5 mL", 68.3 -> "68 mL". // common practice, no source
 */
export function roundVolumeForDisplay(volumeMl: number): DisplayValue {
  requireFinite(volumeMl, 'volume');
  const size = Math.abs(volumeMl);
  let step: number;
  let decimals: number;
  if (size < 1) [step, decimals] = [0.01, 2];
  else if (size < 10) [step, decimals] = [0.1, 1];
  else if (size <= 50) [step, decimals] = [0.5, 1];
  else [step, decimals] = [1, 0];
  const rounded = Math.round(volumeMl / step) * step;
  return display(rounded, decimals, 'mL', GLASSWARE_RULE);
}

/**
 * Round an amount in mol for display by {@link AMOUNT_RULE}: 0.0095214 -> "9.52 mmol",
 * 1.234 -> "1.23 mol". // common practice, no source
 */
export function roundAmountForDisplay(amountMol: number): DisplayValue {
  requireFinite(amountMol, 'amount');
  // 0.99999 mol rounds to 1000 mmol: show it as 1.00 mol instead.
  const inMmol = Math.abs(Number(amountMol.toPrecision(3))) < 1;
  const value = inMmol ? amountMol * 1000 : amountMol;
  const decimals = significantDecimals(Number(value.toPrecision(3)), 3);
  return display(value, decimals, inMmol ? 'mmol' : 'mol', AMOUNT_RULE);
}

/** Round any quantity for display by the rule of its dimension (shown in g, mL, mmol/mol). */
export function displayQuantity(quantity: Quantity): DisplayValue {
  const base = toBaseUnit(quantity);
  if (base.dimension === 'mass') return roundMassForDisplay(base.value);
  if (base.dimension === 'volume') return roundVolumeForDisplay(base.value);
  return roundAmountForDisplay(base.value);
}

/**
 * Check a scale factor: finite and greater than 0.
 *
 * @throws ChemError `invalid_factor`
 */
export function checkScaleFactor(factor: number): number {
  if (typeof factor !== 'number' || !Number.isFinite(factor) || factor <= 0) {
    throw new ChemError(
      'invalid_factor',
      `scale factor must be a number greater than 0 (got ${String(factor)}): use 0.5 to halve, 2 to double`,
    );
  }
  return factor;
}

/**
 * Read a scale factor typed by a person: "2", "0.5", "1/6", "2,5" (decimal comma),
 * "x2" or "×2".
 *
 * @throws ChemError `invalid_factor`
 */
export function parseScaleFactor(text: string): number {
  const cleaned = String(text)
    .trim()
    .replace(/^[x×]\s*/i, '')
    .replace(',', '.');
  const fraction = /^(\d+(?:\.\d+)?)\s*\/\s*(\d+(?:\.\d+)?)$/.exec(cleaned);
  let value = Number.NaN;
  if (fraction) value = Number(fraction[1]) / Number(fraction[2]);
  else if (/^\d*\.?\d+(?:e[+-]?\d+)?$/i.test(cleaned)) value = Number(cleaned);
  if (!Number.isFinite(value) || value <= 0) {
    throw new ChemError(
      'invalid_factor',
      `"${text}" is not a scale factor: write a number above 0 such as 2, 0.5 or 1/6`,
    );
  }
  return value;
}

/** The finest mass the balance reads, in g: 0.1 mg ({@link BALANCE_RULE}). */
export const FINEST_MASS_G = 0.0001;
/** The finest volume the glassware reads, in mL: 0.01 mL ({@link GLASSWARE_RULE}). */
export const FINEST_VOLUME_ML = 0.01;

/** What a line has a person measure at base scale: a mass on the balance or a volume. */
function measured(line: ProcedureLine): { massG?: number; volumeMl?: number } | null {
  if (line.role === 'product' || !line.quantity) return null;
  const base = toBaseUnit(line.quantity);
  if (base.value <= 0) return null;
  if (base.dimension === 'mass') return { massG: base.value };
  if (base.dimension === 'volume') return { volumeMl: base.value };
  // Given in mol: what is weighed or poured for it, when that can be worked out.
  const amounts = lineAmounts(line);
  if (amounts.massG !== undefined && amounts.massG > 0) return { massG: amounts.massG };
  if (amounts.volumeMl !== undefined && amounts.volumeMl > 0) return { volumeMl: amounts.volumeMl };
  return null;
}

function roundsToZero(amount: { massG?: number; volumeMl?: number }, factor: number): boolean {
  return amount.massG !== undefined
    ? roundMassForDisplay(amount.massG * factor).value === 0
    : roundVolumeForDisplay((amount.volumeMl ?? 0) * factor).value === 0;
}

/** Up to two significant figures, rounded up: a floor a person can type. */
function upTo2(value: number): number {
  const magnitude = 10 ** (Math.floor(Math.log10(value)) - 1);
  return Number((Math.ceil(value / magnitude - 1e-9) * magnitude).toPrecision(2));
}

/** The lowest scale factors the balance and glassware allow, see {@link scaleFloor}. */
export interface ScaleFloor {
  /** Below this, every measured line rounds to zero: nothing could be weighed or poured. */
  anyLine: number;
  /** From this, every measured line reads at least one step (0.1 mg or 0.01 mL). */
  everyLine: number;
}

/**
 * The lowest factors at which procedure lines (at base scale) can be measured with the
 * balance (finest 0.1 mg) and glassware (finest 0.01 mL) of {@link BALANCE_RULE} and
 * {@link GLASSWARE_RULE}, rounded up to two significant figures. Products and lines without
 * a measurable amount are left out; null when no line is left.
 */
export function scaleFloor(lines: readonly ProcedureLine[]): ScaleFloor | null {
  const floors = lines
    .map((line) => measured(line))
    .filter((amount): amount is { massG?: number; volumeMl?: number } => amount !== null)
    .map((amount) =>
      amount.massG !== undefined
        ? FINEST_MASS_G / amount.massG
        : FINEST_VOLUME_ML / (amount.volumeMl ?? 1),
    );
  if (floors.length === 0) return null;
  return { anyLine: upTo2(Math.min(...floors)), everyLine: upTo2(Math.max(...floors)) };
}

/**
 * Refuse a scale factor at which every measured line rounds to zero on the balance and the
 * glassware, stating the lowest factor they allow. Lines at base scale.
 *
 * @throws ChemError `factor_too_small`, and as {@link checkScaleFactor}
 */
export function checkMeasurableFactor(lines: readonly ProcedureLine[], factor: number): number {
  checkScaleFactor(factor);
  const amounts = lines
    .map((line) => measured(line))
    .filter((amount): amount is { massG?: number; volumeMl?: number } => amount !== null);
  const floor = scaleFloor(lines);
  if (floor === null || !amounts.every((amount) => roundsToZero(amount, factor))) return factor;
  const every =
    floor.everyLine > floor.anyLine
      ? `; from ×${show(floor.everyLine)} every line can be measured`
      : '';
  throw new ChemError(
    'factor_too_small',
    `at ×${show(Number(factor.toPrecision(3)))} every amount rounds to zero on the balance (finest 0.1 mg) and the glassware (finest 0.01 mL): the lowest factor they allow is ×${show(floor.anyLine)}${every}`,
  );
}

/** A quantity times a factor, at full precision, in the same unit. */
export function scaleQuantity(quantity: Quantity, factor: number): Quantity {
  checkScaleFactor(factor);
  requireFinite(quantity.value, 'quantity');
  return { value: quantity.value * factor, unit: quantity.unit };
}

/** A scaled line: the quantity at full precision, the original, and a rounded display. */
export type ScaledLine<T> = T & {
  quantity?: Quantity;
  /** The quantity before scaling. */
  originalQuantity?: Quantity;
  /** The scaled quantity rounded by the balance, glassware or amount rule. */
  display?: DisplayValue;
};

/**
 * Scale every line's quantity by a factor (1/6, 0.5, 2…). Full precision stays in
 * `quantity`; `display` is rounded for the person at the bench. Other fields are copied.
 *
 * @throws ChemError `invalid_factor`, `unknown_unit`, `not_a_number`
 */
export function scaleLines<T extends { quantity?: Quantity }>(
  lines: readonly T[],
  factor: number,
): ScaledLine<T>[] {
  checkScaleFactor(factor);
  return lines.map((line) => {
    if (!line.quantity) return { ...line };
    const quantity = scaleQuantity(line.quantity, factor);
    return {
      ...line,
      quantity,
      originalQuantity: line.quantity,
      display: displayQuantity(quantity),
    };
  });
}

/**
 * Factor that turns a current amount into a target amount (same unit): target ÷ current.
 *
 * @throws ChemError `invalid_factor` when either is not above 0
 */
export function scaleFactorFor(current: number, target: number): number {
  if (!Number.isFinite(current) || current <= 0) {
    throw new ChemError(
      'invalid_factor',
      `cannot scale from ${show(current)}: the current amount must be above 0`,
    );
  }
  if (!Number.isFinite(target) || target <= 0) {
    throw new ChemError('invalid_factor', `target must be above 0 (got ${show(target)})`);
  }
  return target / current;
}

function pick(
  values: { massG?: number; volumeMl?: number; amountMol?: number },
  target: Quantity,
  what: string,
): { current: number; target: number } {
  const base = toBaseUnit(target);
  const current =
    base.dimension === 'mass'
      ? values.massG
      : base.dimension === 'volume'
        ? values.volumeMl
        : values.amountMol;
  if (current === undefined) {
    const need =
      base.dimension === 'amount'
        ? 'its molar mass'
        : base.dimension === 'volume'
          ? 'its density'
          : 'its molar mass or density';
    throw new ChemError(
      base.dimension === 'volume' ? 'density_missing' : 'molar_mass_missing',
      `cannot scale to ${show(target.value)} ${target.unit} of ${what}: give ${need}`,
    );
  }
  return { current, target: base.value };
}

function limitingOf(lines: readonly ProcedureLine[]): LineResult {
  const result = computeStoichiometry(lines);
  const limiting = result.limitingIndex === null ? undefined : result.lines[result.limitingIndex];
  if (!limiting) {
    throw new ChemError(
      'no_limiting_reagent',
      'no limiting reagent: give a reagent a quantity that can be turned into moles',
    );
  }
  return limiting;
}

/**
 * Factor so that the limiting reagent reaches a target quantity (mass, volume or amount):
 * the aspirin procedure with 2.0 g salicylic acid scaled to 5.0 g gives 2.5.
 *
 * @throws ChemError `no_limiting_reagent`, `density_missing`, `molar_mass_missing`,
 *   `invalid_factor`, any {@link computeStoichiometry} error
 */
export function factorForLimitingReagent(
  lines: readonly ProcedureLine[],
  target: Quantity,
): number {
  const limiting = limitingOf(lines);
  const { current, target: wanted } = pick(
    limiting,
    target,
    limiting.name ?? 'the limiting reagent',
  );
  return scaleFactorFor(current, wanted);
}

/**
 * Factor so that a product's theoretical yield (optionally times an expected percent yield)
 * reaches a target quantity.
 *
 * @param options.productIndex line index of the product; default the first product line
 * @param options.expectedYieldPercent plan for this yield, (0, 100]; default 100
 * @throws ChemError `no_limiting_reagent`, `quantity_missing` (no product line),
 *   `molar_mass_missing`, `density_missing`, `invalid_factor`
 */
export function factorForProduct(
  lines: readonly ProcedureLine[],
  target: Quantity,
  options: { productIndex?: number; expectedYieldPercent?: number } = {},
): number {
  const result = computeStoichiometry(lines);
  const product =
    options.productIndex === undefined
      ? result.lines.find((line) => line.role === 'product')
      : result.lines[options.productIndex];
  if (!product || product.role !== 'product') {
    throw new ChemError(
      'quantity_missing',
      options.productIndex === undefined
        ? 'the procedure has no product line to scale to'
        : `line ${options.productIndex + 1} is not a product line`,
    );
  }
  if (!product.theoretical) {
    throw new ChemError(
      'no_limiting_reagent',
      'no theoretical yield: give a reagent a quantity that can be turned into moles',
    );
  }
  const yieldFraction = requirePercent(options.expectedYieldPercent ?? 100, 'expected yield') / 100;
  const expected = {
    amountMol: product.theoretical.amountMol * yieldFraction,
    ...(product.theoretical.massG === undefined
      ? {}
      : { massG: product.theoretical.massG * yieldFraction }),
    ...(product.theoretical.volumeMl === undefined
      ? {}
      : { volumeMl: product.theoretical.volumeMl * yieldFraction }),
  };
  const { current, target: wanted } = pick(expected, target, product.name ?? 'the product');
  return scaleFactorFor(current, wanted);
}
