import { ChemError, type Result, toResult } from './errors';
import { type Quantity, toBaseUnit } from './units';
import { requirePercent, requirePositive, show } from './validation';

/** What a line of a procedure is for. */
export const LINE_ROLES = [
  'limiting-reagent',
  'reagent',
  'solvent',
  'catalyst',
  'work-up',
  'product',
] as const;

/** One of {@link LINE_ROLES}. */
export type LineRole = (typeof LINE_ROLES)[number];

/**
 * Concentration of a line measured as a solution (e.g. 10 mL of 2.0 M NaOH). The line's
 * `density` is then the solution's and its `molarMass` the solute's.
 */
export type SolutionConcentration = { molarity: number } | { percentWw: number };

/** One line of a procedure, as the stoichiometry needs it. */
export interface ProcedureLine {
  /** Shown in warnings and errors, e.g. "acetone". */
  name?: string;
  role: LineRole;
  /**
   * How much is used (or, on a product line, how much was obtained). Optional on products
   * and on lines still being planned.
   */
  quantity?: Quantity;
  /** Stoichiometric coefficient ν in the balanced equation, > 0; default 1. */
  coefficient?: number;
  /** g/mol of the substance (the solute for a solution). */
  molarMass?: number;
  /**
   * g/mL of what is measured (the solution for a solution; for a solid, its bulk density —
   * see `solid`).
   */
  density?: number;
  /**
   * A solid: `density` is its bulk (poured) density, and a volume without one asks for the
   * bulk density rather than the density.
   */
  solid?: boolean;
  /** Mass % of the substance in a neat material; default 100. Not used with `concentration`. */
  purityPercent?: number;
  /** Set when the line is measured as a solution. */
  concentration?: SolutionConcentration;
}

/** Codes of the warnings the stoichiometry and yield calculations produce. */
export const CHEM_WARNING_CODES = [
  'marked_limiting_not_limiting',
  'several_limiting_marked',
  'limiting_amount_unknown',
  'no_limiting_reagent',
  'amount_unknown',
  'quantity_missing',
  'molar_mass_missing',
  'density_missing',
  'yield_above_100',
] as const;

/** One of {@link CHEM_WARNING_CODES}. */
export type ChemWarningCode = (typeof CHEM_WARNING_CODES)[number];

/** Something a person should look at; the calculation still produced a result. */
export interface ChemWarning {
  code: ChemWarningCode;
  message: string;
  /** 0-based index of the line concerned. */
  lineIndex?: number;
}

/** Mass, volume and moles of one line, each when it can be worked out. */
export interface LineAmounts {
  /** g of what is measured (material as weighed, or the solution). */
  massG?: number;
  /** mL of what is measured. */
  volumeMl?: number;
  /** mol of the substance itself (purity and concentration applied). */
  amountMol?: number;
  /**
   * g of the pure substance itself: the solute of a solution (88 mL of 1 M NaOH holds
   * 3.52 g of NaOH), the pure part of a neat material at its purity.
   */
  pureMassG?: number;
  /** What is missing to work out the moles (empty when amountMol is known or no quantity). */
  missing: LineMissing[];
}

/** A fact a line lacks to be worked out. */
export type LineMissing = 'density' | 'bulk density' | 'molar mass';

/** Theoretical yield of a product line. */
export interface TheoreticalYield {
  amountMol: number;
  /**
   * Needs the product's molar mass. For a solution product (`concentration` given) this is
   * the mass of the solution holding `amountMol` (needs its density, or a % w/w).
   */
  massG?: number;
  /**
   * Needs the product's molar mass and density. For a solution product, the volume of
   * solution holding `amountMol` (from the molarity, or % w/w and density).
   */
  volumeMl?: number;
}

/** Result for one line. */
export interface LineResult {
  index: number;
  name?: string;
  role: LineRole;
  coefficient: number;
  /** As measured (for a product: as obtained), when known. */
  massG?: number;
  volumeMl?: number;
  amountMol?: number;
  /** (n/ν) ÷ (n_lim/ν_lim), for reagents, the limiting reagent and catalysts. */
  equivalents?: number;
  /** Product lines, when a limiting reagent is known. */
  theoretical?: TheoreticalYield;
  /**
   * Product lines with an obtained quantity and a theoretical mass: actual ÷ theoretical × 100
   * (for a solution product: moles held ÷ theoretical moles × 100).
   */
  percentYield?: number;
}

/** What {@link computeStoichiometry} returns. */
export interface StoichiometryResult {
  lines: LineResult[];
  /** Index of the limiting reagent used for equivalents and yields, or null. */
  limitingIndex: number | null;
  /** Index of the reagent with the smallest n/ν (may differ from a marked one), or null. */
  detectedLimitingIndex: number | null;
  warnings: ChemWarning[];
}

/** Advice attached to a yield above 100 %. */
export const YIELD_ABOVE_100_ADVICE =
  'probably wet or impure: dry or recrystallize and weigh again'; // common practice, no source

/** Percent yield with its warnings. */
export interface PercentYield {
  percent: number;
  warnings: ChemWarning[];
}

/**
 * Percent yield = actual ÷ theoretical × 100. Above 100 % a `yield_above_100` warning
 * says the product is {@link YIELD_ABOVE_100_ADVICE}.
 *
 * @throws ChemError `negative_quantity`, `not_positive` (theoretical), `not_a_number`
 */
export function percentYield(actualG: number, theoreticalG: number): PercentYield {
  if (typeof actualG !== 'number' || !Number.isFinite(actualG)) {
    throw new ChemError(
      'not_a_number',
      `mass obtained must be a finite number, got ${String(actualG)}`,
    );
  }
  if (actualG < 0) {
    throw new ChemError(
      'negative_quantity',
      `mass obtained cannot be negative (got ${show(actualG)} g): weigh the product and enter its mass`,
    );
  }
  requirePositive(theoreticalG, 'theoretical yield');
  const percent = (actualG / theoreticalG) * 100;
  const warnings: ChemWarning[] = [];
  // common practice, no source: over 100 % means solvent or impurities are being weighed
  if (percent > 100) {
    warnings.push({
      code: 'yield_above_100',
      message: `yield ${show(Number(percent.toFixed(1)))} % is above 100 %: the product is ${YIELD_ABOVE_100_ADVICE}`,
    });
  }
  return { percent, warnings };
}

function label(line: ProcedureLine, index: number): string {
  return `line ${index + 1}${line.name ? ` (${line.name})` : ''}`;
}

function atLine<T>(line: ProcedureLine, index: number, fn: () => T): T {
  try {
    return fn();
  } catch (error) {
    if (error instanceof ChemError) {
      throw new ChemError(error.code, `${label(line, index)}: ${error.message}`, {
        lineIndex: index,
      });
    }
    throw error;
  }
}

/**
 * Mass, volume and moles of one procedure line, each as far as the given data allow
 * (what is missing is listed in `missing`).
 *
 * @throws ChemError `negative_quantity`, `not_a_number`, `not_positive`, `out_of_range`,
 *   `unknown_unit`, `conflicting_inputs` (purity below 100 % together with a concentration)
 */
export function lineAmounts(line: ProcedureLine): LineAmounts {
  const missing = new Set<LineMissing>();
  const densityName = line.solid ? 'bulk density' : 'density';
  const result: LineAmounts = { missing: [] };
  if (!line.quantity) return result;
  const base = toBaseUnit(line.quantity);
  if (base.value < 0) {
    throw new ChemError(
      'negative_quantity',
      `quantity cannot be negative (got ${show(line.quantity.value)} ${line.quantity.unit}): enter how much as a positive number`,
    );
  }
  const density = line.density === undefined ? undefined : requirePositive(line.density, 'density');
  const molar =
    line.molarMass === undefined ? undefined : requirePositive(line.molarMass, 'molar mass');
  const concentration = line.concentration;
  if (concentration && line.purityPercent !== undefined && line.purityPercent !== 100) {
    throw new ChemError(
      'conflicting_inputs',
      'a solution line takes its strength from the concentration: leave purity out (or at 100 %)',
    );
  }
  // Fraction of the measured mass that is the substance (neat material or % w/w solution).
  let massFraction: number | undefined;
  let molarity: number | undefined;
  if (!concentration) massFraction = requirePercent(line.purityPercent ?? 100, 'purity') / 100;
  else if ('percentWw' in concentration) {
    massFraction = requirePercent(concentration.percentWw, '% w/w') / 100;
  } else molarity = requirePositive(concentration.molarity, 'concentration (mol/L)');

  let massG: number | undefined;
  let volumeMl: number | undefined;
  let amountMol: number | undefined;
  if (base.dimension === 'mass') massG = base.value;
  else if (base.dimension === 'volume') volumeMl = base.value;
  else amountMol = base.value;

  if (massG === undefined && volumeMl !== undefined && density !== undefined) {
    massG = volumeMl * density;
  }
  if (amountMol === undefined) {
    if (molarity !== undefined) {
      if (volumeMl === undefined && massG !== undefined && density !== undefined) {
        volumeMl = massG / density;
      }
      if (volumeMl !== undefined) amountMol = (volumeMl / 1000) * molarity;
      else missing.add(densityName);
    } else if (massFraction !== undefined) {
      if (massG === undefined) missing.add(densityName);
      if (molar === undefined) missing.add('molar mass');
      if (massG !== undefined && molar !== undefined) amountMol = (massG * massFraction) / molar;
    }
  } else {
    // Given as an amount: find what to measure.
    if (molarity !== undefined) volumeMl = (amountMol / molarity) * 1000;
    else if (massFraction !== undefined) {
      if (molar !== undefined) massG = (amountMol * molar) / massFraction;
      else missing.add('molar mass');
    }
    if (massG === undefined && volumeMl !== undefined && density !== undefined) {
      massG = volumeMl * density;
    }
  }
  if (volumeMl === undefined && massG !== undefined) {
    if (density !== undefined) volumeMl = massG / density;
  }
  if (massG !== undefined) result.massG = massG;
  if (volumeMl !== undefined) result.volumeMl = volumeMl;
  if (amountMol !== undefined) result.amountMol = amountMol;
  // The pure substance: what the mass fraction leaves of the material, or for a solution
  // of known molarity the solute its moles weigh — never the mass of the solution.
  if (massFraction !== undefined && massG !== undefined) result.pureMassG = massG * massFraction;
  else if (amountMol !== undefined && molar !== undefined) result.pureMassG = amountMol * molar;
  result.missing = [...missing];
  return result;
}

const COUNTED_ROLES = new Set<LineRole>(['limiting-reagent', 'reagent']);
const EQUIVALENT_ROLES = new Set<LineRole>(['limiting-reagent', 'reagent', 'catalyst']);
// n/ν equal within this relative margin counts as a tie (stoichiometric amounts).
const TIE = 1e-9;

/**
 * Work out a procedure: mass, volume and moles of each line; equivalents relative to the
 * limiting reagent, (n/ν) ÷ (n_lim/ν_lim); the limiting reagent (smallest n/ν among
 * reagents; a line marked `limiting-reagent` is honoured, with a warning when another
 * reagent is actually limiting); the theoretical yield of each product (moles, grams,
 * mL) and its percent yield when an obtained quantity is given.
 *
 * Missing data (a density, a molar mass) give warnings, not errors; invalid data (negative
 * or non-finite numbers, coefficient ≤ 0, unknown unit) throw.
 *
 * @throws ChemError with `lineIndex` and a message starting "line N (name): "
 */
export function computeStoichiometry(lines: readonly ProcedureLine[]): StoichiometryResult {
  const warnings: ChemWarning[] = [];
  const results: LineResult[] = [];
  const amounts: LineAmounts[] = [];
  lines.forEach((line, index) => {
    const coefficient = atLine(line, index, () =>
      requirePositive(line.coefficient ?? 1, 'coefficient'),
    );
    const lineAmount = atLine(line, index, () => lineAmounts(line));
    amounts.push(lineAmount);
    const result: LineResult = { index, role: line.role, coefficient };
    if (line.name !== undefined) result.name = line.name;
    if (lineAmount.massG !== undefined) result.massG = lineAmount.massG;
    if (lineAmount.volumeMl !== undefined) result.volumeMl = lineAmount.volumeMl;
    if (lineAmount.amountMol !== undefined) result.amountMol = lineAmount.amountMol;
    results.push(result);
    if (!EQUIVALENT_ROLES.has(line.role)) return;
    if (!line.quantity) {
      warnings.push({
        code: 'quantity_missing',
        message: `${label(line, index)}: no quantity given, so no moles or equivalents`,
        lineIndex: index,
      });
    } else if (lineAmount.amountMol === undefined) {
      const needs = lineAmount.missing.map((what) =>
        what === 'density'
          ? 'the density (g/mL)'
          : what === 'bulk density'
            ? 'the bulk (poured) density (g/mL) of this solid'
            : 'the molar mass (g/mol)',
      );
      warnings.push({
        code: 'amount_unknown',
        message: `${label(line, index)}: moles unknown: give ${needs.join(' and ')} to turn ${show(line.quantity.value)} ${line.quantity.unit} into moles`,
        lineIndex: index,
      });
    }
  });

  const perCoefficient = (index: number): number | undefined => {
    const n = results[index]?.amountMol;
    const nu = results[index]?.coefficient;
    return n === undefined || nu === undefined ? undefined : n / nu;
  };

  let detected: number | null = null;
  for (const result of results) {
    if (!COUNTED_ROLES.has(result.role)) continue;
    const ratio = perCoefficient(result.index);
    if (ratio === undefined) continue;
    const best = detected === null ? undefined : perCoefficient(detected);
    if (best === undefined || ratio < best * (1 - TIE)) detected = result.index;
  }

  const marked = results.filter((result) => result.role === 'limiting-reagent');
  const firstMarked = marked[0];
  if (marked.length > 1 && firstMarked) {
    warnings.push({
      code: 'several_limiting_marked',
      message: `${marked.length} lines are marked as the limiting reagent; ${label(lines[firstMarked.index] ?? { role: 'reagent' }, firstMarked.index)} is used: mark only one`,
      lineIndex: firstMarked.index,
    });
  }
  let limiting: number | null = detected;
  if (firstMarked) {
    const markedLine = lines[firstMarked.index] ?? { role: 'limiting-reagent' };
    const markedRatio = perCoefficient(firstMarked.index);
    if (markedRatio === undefined) {
      warnings.push({
        code: 'limiting_amount_unknown',
        message: `${label(markedLine, firstMarked.index)} is marked as the limiting reagent but its moles are unknown${detected === null ? '' : `; ${label(lines[detected] ?? markedLine, detected)} is used instead`}`,
        lineIndex: firstMarked.index,
      });
    } else {
      limiting = firstMarked.index;
      const detectedRatio = detected === null ? undefined : perCoefficient(detected);
      if (
        detected !== null &&
        detected !== limiting &&
        detectedRatio !== undefined &&
        detectedRatio < markedRatio * (1 - TIE)
      ) {
        const realLine = lines[detected] ?? markedLine;
        warnings.push({
          code: 'marked_limiting_not_limiting',
          message: `${label(realLine, detected)} is actually limiting: it allows ${show(detectedRatio * 1000)} mmol of reaction (n/ν) against ${show(markedRatio * 1000)} mmol for the marked ${label(markedLine, firstMarked.index)}; results use the marked line, so check the quantities or mark ${label(realLine, detected)}`,
          lineIndex: detected,
        });
      }
    }
  }

  const hasProducts = results.some((result) => result.role === 'product');
  const limitingRatio = limiting === null ? undefined : perCoefficient(limiting);
  if (limitingRatio === undefined) {
    if (hasProducts || results.some((result) => EQUIVALENT_ROLES.has(result.role))) {
      warnings.push({
        code: 'no_limiting_reagent',
        message:
          'no limiting reagent: give at least one reagent with a quantity it can be turned into moles, so equivalents and yields can be worked out',
      });
    }
    return { lines: results, limitingIndex: null, detectedLimitingIndex: detected, warnings };
  }

  for (const result of results) {
    const line = lines[result.index];
    if (!line) continue;
    const ratio = perCoefficient(result.index);
    if (EQUIVALENT_ROLES.has(result.role) && ratio !== undefined) {
      result.equivalents = ratio / limitingRatio;
    }
    if (result.role !== 'product') continue;
    const theoretical: TheoreticalYield = { amountMol: limitingRatio * result.coefficient };
    if (line.concentration) {
      // A solution product (e.g. 1 M NaOH): the theoretical yield is the solution that
      // holds the moles; mass and volume are the solution's, as far as the data allow.
      const solution = atLine(line, result.index, () =>
        lineAmounts({ ...line, quantity: { value: theoretical.amountMol, unit: 'mol' } }),
      );
      if (solution.massG !== undefined) theoretical.massG = solution.massG;
      if (solution.volumeMl !== undefined) theoretical.volumeMl = solution.volumeMl;
    } else if (line.molarMass !== undefined) {
      theoretical.massG = theoretical.amountMol * line.molarMass;
      if (line.density !== undefined) theoretical.volumeMl = theoretical.massG / line.density;
    } else {
      warnings.push({
        code: 'molar_mass_missing',
        message: `${label(line, result.index)}: give the product's molar mass to get the theoretical yield in grams`,
        lineIndex: result.index,
      });
    }
    result.theoretical = theoretical;
    if (!line.quantity) continue;
    if (line.concentration && result.amountMol !== undefined && theoretical.amountMol > 0) {
      // A solution is compared by the moles it holds, not by its mass.
      const yieldResult = percentYield(result.amountMol, theoretical.amountMol);
      result.percentYield = yieldResult.percent;
      for (const warning of yieldResult.warnings) {
        warnings.push({
          ...warning,
          message: `${label(line, result.index)}: ${warning.message}`,
          lineIndex: result.index,
        });
      }
      continue;
    }
    if (result.massG === undefined) {
      const lineMissing = amounts[result.index]?.missing ?? [];
      warnings.push({
        code: lineMissing.includes('density') ? 'density_missing' : 'molar_mass_missing',
        message: `${label(line, result.index)}: give the ${lineMissing.includes('density') ? 'density' : 'molar mass'} to turn ${show(line.quantity.value)} ${line.quantity.unit} obtained into grams for the percent yield`,
        lineIndex: result.index,
      });
    } else if (theoretical.massG !== undefined && theoretical.massG > 0) {
      const yieldResult = percentYield(result.massG, theoretical.massG);
      result.percentYield = yieldResult.percent;
      for (const warning of yieldResult.warnings) {
        warnings.push({
          ...warning,
          message: `${label(line, result.index)}: ${warning.message}`,
          lineIndex: result.index,
        });
      }
    }
  }
  return { lines: results, limitingIndex: limiting, detectedLimitingIndex: detected, warnings };
}

/** {@link computeStoichiometry} as a {@link Result}. */
export function tryComputeStoichiometry(
  lines: readonly ProcedureLine[],
): Result<StoichiometryResult> {
  return toResult(() => computeStoichiometry(lines));
}

/** Which yield of a product: weighed before purifying, or what was put into stock after. */
export type YieldKind = 'crude' | 'purified';

/** One yield with its own flag (set above 100 %) and warnings. */
export interface FlaggedYield {
  kind: YieldKind;
  percent: number;
  /** A sentence for the run page and history, or null when nothing needs a look. */
  flag: string | null;
  warnings: ChemWarning[];
}

/**
 * The flag a yield carries: above 100 % the product weighed is {@link YIELD_ABOVE_100_ADVICE}.
 * A crude yield is judged on its own, whether or not purified crops were recorded too.
 */
export function yieldFlag(kind: YieldKind, percent: number): string | null {
  // common practice, no source: over 100 % means solvent or impurities are being weighed
  if (!(percent > 100)) return null;
  const what = kind === 'crude' ? 'Crude yield' : 'Yield';
  return `${what} ${show(Number(percent.toFixed(1)))} % is above 100 %: the ${kind === 'crude' ? 'crude ' : ''}product is ${YIELD_ABOVE_100_ADVICE}.`;
}

/** A percent yield (already worked out, e.g. by moles for a solution) with its flag. */
export function flagYield(kind: YieldKind, percent: number): FlaggedYield {
  const flag = yieldFlag(kind, percent);
  return {
    kind,
    percent,
    flag,
    warnings: flag === null ? [] : [{ code: 'yield_above_100', message: flag }],
  };
}

/**
 * Crude and purified yields of one product against the same theoretical mass, each with
 * its own flag: a wet crude above 100 % is flagged even when the purified crops are fine.
 *
 * @throws ChemError as {@link percentYield}
 */
export function productYields(input: {
  theoreticalG: number;
  crudeG?: number | null;
  purifiedG?: number | null;
}): { crude: FlaggedYield | null; purified: FlaggedYield | null } {
  const of = (kind: YieldKind, grams: number | null | undefined) =>
    grams === null || grams === undefined
      ? null
      : flagYield(kind, percentYield(grams, input.theoreticalG).percent);
  return { crude: of('crude', input.crudeG), purified: of('purified', input.purifiedG) };
}
