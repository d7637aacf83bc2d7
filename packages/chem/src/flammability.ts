/**
 * How flammable a liquid is, from its flash point and boiling point: the NFPA 30 liquid class
 * (what fire codes count quantities by) and the GHS flammable-liquid category (what the label
 * and SDS say). Both are reminders worked out from the figures a person entered; the SDS and
 * the authority having jurisdiction decide.
 */

/** NFPA 30 (2024) §4.3 classes of flammable (I) and combustible (II, III) liquids. */
export const LIQUID_CLASSES = ['IA', 'IB', 'IC', 'II', 'IIIA', 'IIIB'] as const;
export type LiquidClass = (typeof LIQUID_CLASSES)[number];

/** GHS Rev. 10 Table 2.6.1 flammable-liquid categories (1 is the most severe). */
export const GHS_FLAMMABLE_CATEGORIES = [1, 2, 3, 4] as const;
export type GhsFlammableCategory = (typeof GHS_FLAMMABLE_CATEGORIES)[number];

/** Exact conversions (NIST SP 811, Appendix B). */
export const LITRES_PER_US_GALLON = 3.785411784;
export const SQUARE_METRES_PER_SQUARE_FOOT = 0.09290304;

/**
 * The NFPA 30 class of a liquid, or null when it cannot be told: no flash point, or a flash
 * point below 22.8 °C (73 °F) without the boiling point that splits IA from IB. NFPA 30 puts
 * the boundaries at whole °F (73 °F, 100 °F, 140 °F, 200 °F); their °C values are 22.8, 37.8,
 * 60 and 93.
 */
export function liquidClassOf(
  flashPointC: number | null,
  boilingPointC: number | null,
): LiquidClass | null {
  if (flashPointC === null || !Number.isFinite(flashPointC)) return null;
  if (flashPointC < 22.8) {
    if (boilingPointC === null || !Number.isFinite(boilingPointC)) return null;
    return boilingPointC < 37.8 ? 'IA' : 'IB';
  }
  if (flashPointC < 37.8) return 'IC';
  if (flashPointC < 60) return 'II';
  if (flashPointC < 93) return 'IIIA';
  return 'IIIB';
}

/**
 * The GHS flammable-liquid category, or null when the liquid is not a flammable liquid under
 * GHS (flash point above 93 °C) or cannot be told (no flash point, or a flash point below 23 °C
 * without the initial boiling point).
 */
export function ghsFlammableCategoryOf(
  flashPointC: number | null,
  initialBoilingPointC: number | null,
): GhsFlammableCategory | null {
  if (flashPointC === null || !Number.isFinite(flashPointC)) return null;
  if (flashPointC < 23) {
    if (initialBoilingPointC === null || !Number.isFinite(initialBoilingPointC)) return null;
    return initialBoilingPointC <= 35 ? 1 : 2;
  }
  if (flashPointC <= 60) return 3;
  if (flashPointC <= 93) return 4;
  return null;
}

/** Class I (IA, IB, IC): the flammable liquids. */
export function isClassI(liquidClass: LiquidClass): boolean {
  return liquidClass === 'IA' || liquidClass === 'IB' || liquidClass === 'IC';
}

/** Classes I, II and IIIA: what NFPA 45's combined limits count (IIIB is not counted). */
export function countsTowardCombinedLimit(liquidClass: LiquidClass): boolean {
  return liquidClass !== 'IIIB';
}
