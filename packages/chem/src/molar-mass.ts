import { findElement } from './elements';
import { ChemError, type Result, toResult } from './errors';
import { type ParsedFormula, parseFormula } from './formula';

/**
 * Standard atomic weight of an element (CIAAW 2021 abridged), in g/mol.
 *
 * @throws ChemError `unknown_element` for a symbol that is not an element,
 *   `no_standard_atomic_weight` for an element such as Tc, Pm or Po.
 */
export function atomicWeight(symbol: string): number {
  const element = findElement(symbol);
  if (!element) {
    throw new ChemError('unknown_element', `unknown element "${symbol}"`);
  }
  if (element.atomicWeight === null) throw noWeight(element.symbol, element.name);
  return element.atomicWeight;
}

function noWeight(symbol: string, name: string, position?: number): ChemError {
  const where = position === undefined ? '' : ` at position ${position}`;
  return new ChemError(
    'no_standard_atomic_weight',
    `${name} (${symbol})${where} has no standard atomic weight: it has no stable isotope, so enter the molar mass of the isotope you have`,
    position === undefined ? {} : { position },
  );
}

function parsed(formula: string | ParsedFormula): ParsedFormula {
  return typeof formula === 'string' ? parseFormula(formula) : formula;
}

/**
 * Molar mass of a formula in g/mol, from CIAAW 2021 abridged standard atomic weights, at
 * full floating-point precision (round only for display). Hydrate water counts:
 * molarMass("CuSO4·5H2O") is 249.677, molarMass("CuSO4") 159.602.
 *
 * @param formula text as accepted by {@link parseFormula}, or its result
 * @throws ChemError any {@link parseFormula} error, or `no_standard_atomic_weight`
 */
export function molarMass(formula: string | ParsedFormula): number {
  const { elements, firstPosition } = parsed(formula);
  let total = 0;
  for (const [symbol, count] of Object.entries(elements)) {
    const element = findElement(symbol);
    if (!element) throw new ChemError('unknown_element', `unknown element "${symbol}"`);
    if (element.atomicWeight === null) {
      throw noWeight(element.symbol, element.name, firstPosition[symbol]);
    }
    total += count * element.atomicWeight;
  }
  return total;
}

/**
 * {@link molarMass} as a {@link Result}: `{ ok: true, value: g/mol }` or the
 * {@link ChemError} (its message names the problem and its position).
 */
export function tryMolarMass(formula: string): Result<number> {
  return toResult(() => molarMass(formula));
}

/** One element's share of a formula's mass. */
export interface ElementShare {
  symbol: string;
  name: string;
  /** Atoms per formula unit. */
  count: number;
  /** count × atomic weight, g/mol. */
  mass: number;
  /** mass / molar mass, 0..1. */
  massFraction: number;
  /** massFraction × 100. */
  percent: number;
}

/**
 * Mass composition of a formula, one row per element in Hill order:
 * water is H 11.19 %, O 88.81 %.
 *
 * @throws ChemError as {@link molarMass}
 */
export function massComposition(formula: string | ParsedFormula): ElementShare[] {
  const formulaParsed = parsed(formula);
  const total = molarMass(formulaParsed);
  return Object.entries(formulaParsed.elements).map(([symbol, count]) => {
    const element = findElement(symbol);
    const mass = count * (element?.atomicWeight ?? 0);
    return {
      symbol,
      name: element?.name ?? symbol,
      count,
      mass,
      massFraction: mass / total,
      percent: (mass / total) * 100,
    };
  });
}

/** Mass fraction (0..1) of one element in a formula; 0 when the element is absent. */
export function elementMassFraction(formula: string | ParsedFormula, symbol: string): number {
  return massComposition(formula).find((share) => share.symbol === symbol)?.massFraction ?? 0;
}

/** Water of crystallization in a hydrate, from its "·nH2O" parts. */
export interface WaterContent {
  /** Molecules of H2O per formula unit (5 for CuSO4·5H2O; 0 for an anhydrous salt). */
  waterPerFormulaUnit: number;
  /** Mass of that water per mole of the hydrate, g/mol. */
  waterMass: number;
  /** Molar mass without the water parts, g/mol (159.602 for CuSO4·5H2O). */
  anhydrousMolarMass: number;
  /** Molar mass of the hydrate as written, g/mol. */
  molarMass: number;
  /** waterMass / molarMass, 0..1. */
  massFraction: number;
  /** massFraction × 100: 36.08 for CuSO4·5H2O. */
  percent: number;
}

/**
 * Water content of a hydrate: the parts of the formula that are exactly H2O (with their
 * multipliers) over the whole molar mass. Hydrogen and oxygen in the salt itself do not
 * count: CuSO4·5H2O is 36.08 % water.
 *
 * @throws ChemError as {@link molarMass}
 */
export function waterOfCrystallization(formula: string | ParsedFormula): WaterContent {
  const formulaParsed = parsed(formula);
  const total = molarMass(formulaParsed);
  let water = 0;
  // A lone "H2O" is water, not water of crystallization: only adduct parts count.
  const parts = formulaParsed.parts.length > 1 ? formulaParsed.parts : [];
  for (const part of parts) {
    const symbols = Object.keys(part.composition);
    const h = part.composition.H ?? 0;
    const o = part.composition.O ?? 0;
    if (symbols.length === 2 && o > 0 && h === 2 * o) water += o;
  }
  const waterMass = water * (2 * atomicWeight('H') + atomicWeight('O'));
  return {
    waterPerFormulaUnit: water,
    waterMass,
    anhydrousMolarMass: total - waterMass,
    molarMass: total,
    massFraction: waterMass / total,
    percent: (waterMass / total) * 100,
  };
}
