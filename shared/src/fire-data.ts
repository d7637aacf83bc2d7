import {
  ghsFlammableCategoryOf,
  liquidClassOf,
  type GhsFlammableCategory,
  type LiquidClass,
} from '@lotwise/chem';
import { z } from 'zod';

/**
 * A chemical's fire data: flash point and boiling point (°C) with where each figure came from,
 * and what Lotwise works out from them. The rules themselves live in @lotwise/chem
 * (`liquidClassOf`, `ghsFlammableCategoryOf`); this file only says when they apply and how the
 * answer is worded.
 */

/** Absolute zero to well above any liquid's boiling point. */
export const minTemperatureC = -273.15;
export const maxTemperatureC = 2000;

export const temperatureCSchema = z
  .number({ message: 'must be a temperature in °C' })
  .min(minTemperatureC, `cannot be below ${minTemperatureC} °C (absolute zero)`)
  .max(maxTemperatureC, `cannot be above ${maxTemperatureC} °C`);

/** Where a figure came from: "NIOSH Pocket Guide", "SDS of lot 2291", "from memory". */
export const figureSourceSchema = z.string().trim().max(120, 'is at most 120 characters');

/** The message when a flash point is not below the boiling point. */
export const flashAboveBoilingMessage = 'must be below the boiling point';

/**
 * The field error of a pair of figures, or null: a liquid flashes below the temperature it
 * boils at, so a flash point at or above the boiling point is a typing slip.
 */
export function fireDataProblem(
  flashPointC: number | null | undefined,
  boilingPointC: number | null | undefined,
): string | null {
  if (flashPointC === null || flashPointC === undefined) return null;
  if (boilingPointC === null || boilingPointC === undefined) return null;
  return flashPointC < boilingPointC ? null : flashAboveBoilingMessage;
}

/** Liquids and solutions get a liquid class; a solid's or gas's flash point gives none. */
export function hasLiquidClass(physicalState: string): boolean {
  return physicalState === 'liquid' || physicalState === 'solution';
}

export interface FireClass {
  liquidClass: LiquidClass | null;
  ghsFlammableCategory: GhsFlammableCategory | null;
}

/** What the figures of a chemical give, as the server sends it with every chemical. */
export function fireClassOf(chemical: {
  physicalState: string;
  flashPointC: number | null;
  boilingPointC: number | null;
}): FireClass {
  if (!hasLiquidClass(chemical.physicalState)) {
    return { liquidClass: null, ghsFlammableCategory: null };
  }
  return {
    liquidClass: liquidClassOf(chemical.flashPointC, chemical.boilingPointC),
    ghsFlammableCategory: ghsFlammableCategoryOf(chemical.flashPointC, chemical.boilingPointC),
  };
}

/** The boundaries of each NFPA 30 class, in words (NFPA 30 (2024) §4.3.1–4.3.3). */
export const liquidClassMeanings: Record<LiquidClass, string> = {
  IA: 'flash point below 22.8 °C, boiling point below 37.8 °C',
  IB: 'flash point below 22.8 °C, boiling point 37.8 °C or above',
  IC: 'flash point 22.8 °C to below 37.8 °C',
  II: 'flash point 37.8 °C to below 60 °C',
  IIIA: 'flash point 60 °C to below 93 °C',
  IIIB: 'flash point 93 °C or above',
};

export const liquidClassCitation = 'NFPA 30 (2024) §4.3';
export const ghsCategoryCitation = 'GHS Rev. 10 Table 2.6.1';

/** The H-statement each flammable-liquid category carries (GHS Rev. 10 Table 2.6.1). */
export const ghsFlammableHazardStatements: Record<GhsFlammableCategory, string> = {
  1: 'H224',
  2: 'H225',
  3: 'H226',
  4: 'H227',
};

export const ghsFlammableHazardTexts: Record<GhsFlammableCategory, string> = {
  1: 'Extremely flammable liquid and vapour',
  2: 'Highly flammable liquid and vapour',
  3: 'Flammable liquid and vapour',
  4: 'Combustible liquid',
};

/** The boundaries of each GHS category, in words. */
export const ghsFlammableCategoryMeanings: Record<GhsFlammableCategory, string> = {
  1: 'flash point below 23 °C, initial boiling point 35 °C or below',
  2: 'flash point below 23 °C, initial boiling point above 35 °C',
  3: 'flash point 23 °C to 60 °C',
  4: 'flash point above 60 °C to 93 °C',
};

const flammableCodes = Object.values(ghsFlammableHazardStatements);

/**
 * Where the chemical's own flammable-liquid H-statements and the category its figures give
 * disagree: the statements it lists (H224–H227) and the one the figures give. Null when they
 * agree, when it lists none, or when the figures give no category.
 */
export function flammableStatementMismatch(
  hazardStatements: readonly string[],
  category: GhsFlammableCategory | null,
): { listed: string[]; expected: string } | null {
  if (category === null) return null;
  const listed = hazardStatements.filter((code) => flammableCodes.includes(code));
  const expected = ghsFlammableHazardStatements[category];
  if (listed.length === 0 || (listed.length === 1 && listed[0] === expected)) return null;
  return { listed, expected };
}
