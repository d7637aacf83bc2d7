import {
  ruleSetCitation,
  type FlammableLimitsData,
  type LabArea,
  type LabAreaKind,
  type LabUnitClass,
  type RuleSet,
} from '@lotwise/shared';
import { formatFixed } from '../../lib/format';

export const labAreaKindLabels: Record<LabAreaKind, string> = {
  'lab-unit': 'Lab unit',
  'control-area': 'Control area',
};

export const labAreaKindHints: Record<LabAreaKind, string> = {
  'lab-unit': 'A laboratory room or suite separated from the rest of the building.',
  'control-area': 'A part of the building allowed its own quantity of hazardous materials.',
};

/**
 * NFPA 45 fire-hazard classes of a lab unit in one line each.
 * NFPA 45 (2024), Chapter 4 (laboratory unit hazard classification) — from memory, as given in
 * public summaries of the standard.
 */
export const labUnitClassHints: Record<LabUnitClass, string> = {
  A: 'High fire hazard: the most flammable liquid allowed.',
  B: 'Moderate fire hazard.',
  C: 'Low fire hazard; instructional labs are Class C or D.',
  D: 'Minimal fire hazard: the least flammable liquid allowed.',
};

export const floorAreaUnitLabels = { m2: 'm²', ft2: 'ft²' } as const;

/** "20 gal Class I, 40 gal Classes I–IIIA per 100 ft²" for a class in a flammable-limits set. */
export function unitClassFigures(
  data: FlammableLimitsData,
  unitClass: LabUnitClass,
): string | null {
  const row = data.byUnitClass.find((r) => r.unitClass === unitClass);
  if (!row) return null;
  const per = data.perFloorArea
    ? ` per ${formatFixed(data.perFloorArea.value, 0)} ${floorAreaUnitLabels[data.perFloorArea.unit]}`
    : ' per area';
  return `Class I ${formatFixed(row.perArea.classI, 0)} ${data.unit}, Classes I–IIIA ${formatFixed(row.perArea.classesIToIIIA, 0)} ${data.unit}${per}`;
}

/** The citation of a set as the server wrote it, or as Lotwise writes it. */
export function citationOf(
  set: Pick<RuleSet, 'source' | 'edition' | 'reference'> & { citation?: string },
) {
  return set.citation || ruleSetCitation(set);
}

/** The limit an area uses most of (a zero limit with something held counts as most). */
export function worstLimit(area: LabArea): LabArea['limits'][number] | null {
  let worst: LabArea['limits'][number] | null = null;
  for (const limit of area.limits) {
    const share = limit.fractionUsed ?? (limit.heldLitres > 0 ? Infinity : 0);
    const top = worst === null ? -1 : (worst.fractionUsed ?? (worst.heldLitres > 0 ? Infinity : 0));
    if (share > top) worst = limit;
  }
  return worst;
}
