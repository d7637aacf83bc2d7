import { ChemError } from './errors';
import { molarMass as formulaMolarMass } from './molar-mass';
import {
  requireFinite,
  requireNonNegative,
  requirePercent,
  requirePositive,
  show,
} from './validation';

// Units in this module: volumes in mL, concentrations in mol/L, densities in g/mL,
// masses in g, molar masses in g/mol.

/**
 * Molarity (mol/L) of a solution given as % w/w with its density:
 * c = 10 × w% × ρ / M. HCl 37 % at 1.184 g/mL is 12.02 M.
 *
 * @throws ChemError `out_of_range` (percent), `not_positive`, `not_a_number`
 */
export function molarityFromPercentWw(input: {
  percentWw: number;
  densityGPerMl: number;
  molarMass: number;
}): number {
  requirePercent(input.percentWw, '% w/w');
  requirePositive(input.densityGPerMl, 'density');
  requirePositive(input.molarMass, 'molar mass');
  return (10 * input.percentWw * input.densityGPerMl) / input.molarMass;
}

/** A stock solution: either % w/w with its density, or a molarity (density optional). */
export type StockSolution =
  { percentWw: number; densityGPerMl: number } | { molarity: number; densityGPerMl?: number };

/** How much stock solution a target solution needs. */
export interface StockNeeded {
  /** Moles of solute in the target. */
  amountMol: number;
  /** Grams of pure solute in the target. */
  soluteMassG: number;
  /** Volume of stock to measure, mL. */
  volumeMl: number;
  /** Mass of stock to weigh, g; undefined for a molarity stock without density. */
  massG?: number;
}

/**
 * Stock solution needed for a target volume and molarity. 250 mL of 1.00 M HCl from 37 %
 * at 1.184 g/mL: 24.63 g = 20.81 mL of stock.
 *
 * @throws ChemError `impossible_dilution` when the stock is weaker than the target,
 *   `not_positive`, `out_of_range`, `negative_quantity`, `not_a_number`
 */
export function stockSolutionNeeded(input: {
  targetVolumeMl: number;
  targetMolarity: number;
  molarMass: number;
  stock: StockSolution;
}): StockNeeded {
  requireNonNegative(input.targetVolumeMl, 'target volume');
  requireNonNegative(input.targetMolarity, 'target concentration');
  requirePositive(input.molarMass, 'molar mass');
  const amountMol = (input.targetVolumeMl / 1000) * input.targetMolarity;
  const soluteMassG = amountMol * input.molarMass;
  const stock = input.stock;
  if ('percentWw' in stock) {
    const stockMolarity = molarityFromPercentWw({ ...stock, molarMass: input.molarMass });
    refuseWeakStock(stockMolarity, input.targetMolarity);
    const massG = soluteMassG / (stock.percentWw / 100);
    return { amountMol, soluteMassG, massG, volumeMl: massG / stock.densityGPerMl };
  }
  requirePositive(stock.molarity, 'stock concentration');
  refuseWeakStock(stock.molarity, input.targetMolarity);
  const volumeMl = (amountMol / stock.molarity) * 1000;
  const result: StockNeeded = { amountMol, soluteMassG, volumeMl };
  if (stock.densityGPerMl !== undefined) {
    result.massG = volumeMl * requirePositive(stock.densityGPerMl, 'density');
  }
  return result;
}

function refuseWeakStock(stockMolarity: number, targetMolarity: number): void {
  if (targetMolarity > stockMolarity) {
    throw new ChemError(
      'impossible_dilution',
      `the target (${show(targetMolarity)} M) is stronger than the stock (${show(stockMolarity)} M): a dilution cannot concentrate; use a stronger stock or weigh the solid`,
    );
  }
}

/** Mass of solid for a target solution. */
export interface SolidNeeded {
  /** Grams to weigh of the material named by the formula (hydrate included). */
  massG: number;
  /** Moles of formula units, = moles of solute. */
  amountMol: number;
  /** g/mol used: of what is weighed, water of crystallization included. */
  molarMass: number;
}

/**
 * Mass of solid to weigh for a target volume and molarity. Give the formula (or molar mass)
 * of what is actually weighed: for 100 mL of 0.100 M CuSO4 from the pentahydrate pass
 * "CuSO4·5H2O" and weigh 2.497 g (the anhydrous 1.596 g would be the classic mistake).
 *
 * @param input.formula formula of the weighed material; or `molarMass` instead
 * @param input.purityPercent mass % of the substance in the weighed material, default 100
 * @throws ChemError `conflicting_inputs` (both or neither of formula and molarMass),
 *   any formula error, `negative_quantity`, `not_positive`, `out_of_range`
 */
export function solidMassForSolution(input: {
  targetVolumeMl: number;
  targetMolarity: number;
  formula?: string;
  molarMass?: number;
  purityPercent?: number;
}): SolidNeeded {
  requireNonNegative(input.targetVolumeMl, 'target volume');
  requireNonNegative(input.targetMolarity, 'target concentration');
  const hasFormula = input.formula !== undefined;
  const hasMass = input.molarMass !== undefined;
  if (hasFormula === hasMass) {
    throw new ChemError(
      'conflicting_inputs',
      'give either the formula of what is weighed (e.g. CuSO4·5H2O) or its molar mass, not both and not neither',
    );
  }
  const molar =
    input.formula !== undefined
      ? formulaMolarMass(input.formula)
      : requirePositive(input.molarMass ?? NaN, 'molar mass');
  const purity = requirePercent(input.purityPercent ?? 100, 'purity');
  const amountMol = (input.targetVolumeMl / 1000) * input.targetMolarity;
  return { amountMol, molarMass: molar, massG: (amountMol * molar) / (purity / 100) };
}

/** Mass of solid for a % w/v solution (g per 100 mL): 250 mL of 0.9 % w/v is 2.25 g. */
export function massForPercentWv(input: { percentWv: number; volumeMl: number }): number {
  requireNonNegative(input.percentWv, '% w/v');
  requireNonNegative(input.volumeMl, 'volume');
  return (input.percentWv / 100) * input.volumeMl;
}

/** % w/v (g of solute per 100 mL of solution) of a mass dissolved to a volume. */
export function percentWv(input: { soluteMassG: number; volumeMl: number }): number {
  requireNonNegative(input.soluteMassG, 'solute mass');
  requirePositive(input.volumeMl, 'solution volume');
  return (input.soluteMassG / input.volumeMl) * 100;
}

/** Molarity (mol/L) of an amount dissolved to a volume. */
export function molarity(input: { amountMol: number; volumeMl: number }): number {
  requireNonNegative(input.amountMol, 'amount');
  requirePositive(input.volumeMl, 'solution volume');
  return input.amountMol / (input.volumeMl / 1000);
}

/** The four terms of C1V1 = C2V2 (any units, the same on both sides). */
export interface Dilution {
  /** Stock concentration. */
  c1: number;
  /** Stock volume to take. */
  v1: number;
  /** Final concentration. */
  c2: number;
  /** Final volume. */
  v2: number;
  /** v2 − v1: about how much solvent to add (volumes are not strictly additive). */
  solventVolume: number;
}

/**
 * Solve C1V1 = C2V2 for the one term left out. dilute({ c1: 12, c2: 1, v2: 250 }) gives
 * v1 = 20.83 (mL of 12 M stock for 250 mL of 1 M).
 *
 * @throws ChemError `conflicting_inputs` unless exactly one term is missing,
 *   `impossible_dilution` when the final concentration would exceed the stock's,
 *   `not_positive`, `negative_quantity`, `not_a_number`
 */
export function dilute(terms: { c1?: number; v1?: number; c2?: number; v2?: number }): Dilution {
  const names = ['c1', 'v1', 'c2', 'v2'] as const;
  const missing = names.filter((name) => terms[name] === undefined);
  if (missing.length !== 1) {
    throw new ChemError(
      'conflicting_inputs',
      `give exactly three of c1, v1, c2, v2 (C1V1 = C2V2); ${missing.length === 0 ? 'all four were given' : `missing: ${missing.join(', ')}`}`,
    );
  }
  for (const name of names) {
    const value = terms[name];
    if (value !== undefined) requireFinite(value, name);
  }
  const known = (name: (typeof names)[number]) => requirePositive(terms[name] ?? NaN, name);
  let { c1, v1, c2, v2 } = terms;
  switch (missing[0]) {
    case 'c1':
      c1 = (known('c2') * known('v2')) / known('v1');
      break;
    case 'v1':
      v1 = (known('c2') * known('v2')) / known('c1');
      break;
    case 'c2':
      c2 = (known('c1') * known('v1')) / known('v2');
      break;
    default:
      v2 = (known('c1') * known('v1')) / known('c2');
  }
  const result = { c1: c1 ?? NaN, v1: v1 ?? NaN, c2: c2 ?? NaN, v2: v2 ?? NaN };
  if (result.c2 > result.c1 * (1 + 1e-12)) {
    throw new ChemError(
      'impossible_dilution',
      `the final concentration (${show(result.c2)}) is above the stock's (${show(result.c1)}): a dilution cannot concentrate; check which value is the stock`,
    );
  }
  return { ...result, solventVolume: result.v2 - result.v1 };
}
