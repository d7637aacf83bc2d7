import { LIQUID_CLASSES } from '@lotwise/chem';
import {
  containerMaterials,
  labUnitClasses,
  type ContainerSizesData,
  type FlammableLimitsData,
  type RuleSet,
  type RuleSetKind,
  type WasteAccumulationData,
} from '@lotwise/shared';
import { formatFixed } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';

/**
 * The figures of a rule set as the form edits them: each number as the text in its box, keyed
 * by its path in the set's data (`byUnitClass.0.perArea.classI`), which is also the path the
 * server names a field error by (after `data.`).
 */
export type FigureTexts = Record<string, string>;

export type RuleSetData =
  | { kind: 'flammable-limits'; data: FlammableLimitsData }
  | { kind: 'container-sizes'; data: ContainerSizesData }
  | { kind: 'waste-accumulation'; data: WasteAccumulationData };

/** A fresh set of each kind: every figure to be filled in. */
export function blankData(kind: RuleSetKind): RuleSetData {
  if (kind === 'flammable-limits') {
    return {
      kind,
      data: {
        unit: 'L',
        perFloorArea: null,
        byUnitClass: labUnitClasses.map((unitClass) => ({
          unitClass,
          perArea: { classI: 0, classesIToIIIA: 0 },
          maxPerUnit: null,
        })),
        outsideStorageFactor: 1,
        instructional: null,
        storeyReductions: [],
        countsIgnitableWaste: true,
        perCabinet: null,
      },
    };
  }
  if (kind === 'container-sizes') return { kind, data: { unit: 'L', limits: [] } };
  return {
    kind,
    data: {
      maxHazardous: { value: 0, unit: 'L' },
      maxAcutelyHazardous: { value: 0, unit: 'L' },
      daysAllowedOnceExceeded: 3,
      maxAccumulationDays: null,
      nearFraction: 0.9,
    },
  };
}

export function dataOf(set: RuleSet): RuleSetData {
  return { kind: set.kind, data: set.data } as RuleSetData;
}

function text(value: number | null | undefined): string {
  if (value === null || value === undefined) return '';
  const decimals = Number.isInteger(value) ? 0 : Number.isInteger(value * 100) ? 2 : 4;
  return formatFixed(value, decimals);
}

/** The boxes of the form, filled from a set's figures (shares as percentages). */
export function textsOf(set: RuleSetData): FigureTexts {
  const texts: FigureTexts = {};
  if (set.kind === 'flammable-limits') {
    const d = set.data;
    texts['perFloorArea.value'] = text(d.perFloorArea?.value);
    d.byUnitClass.forEach((row, i) => {
      texts[`byUnitClass.${i}.perArea.classI`] = text(row.perArea.classI);
      texts[`byUnitClass.${i}.perArea.classesIToIIIA`] = text(row.perArea.classesIToIIIA);
      texts[`byUnitClass.${i}.maxPerUnit.classI`] = text(row.maxPerUnit?.classI);
      texts[`byUnitClass.${i}.maxPerUnit.classesIToIIIA`] = text(row.maxPerUnit?.classesIToIIIA);
    });
    texts.outsideStorageFactor = text(d.outsideStorageFactor * 100);
    texts.perCabinet = text(d.perCabinet);
  } else if (set.kind === 'container-sizes') {
    for (const liquidClass of LIQUID_CLASSES) {
      for (const material of containerMaterials) {
        const limit = set.data.limits.find(
          (l) => l.liquidClass === liquidClass && l.material === material,
        );
        texts[`limits.${liquidClass}.${material}`] = text(limit?.maxCapacity);
      }
    }
  } else {
    const d = set.data;
    texts['maxHazardous.value'] = text(d.maxHazardous.value);
    texts['maxAcutelyHazardous.value'] = text(d.maxAcutelyHazardous.value);
    texts.daysAllowedOnceExceeded = text(d.daysAllowedOnceExceeded);
    texts.maxAccumulationDays = text(d.maxAccumulationDays);
    texts.nearFraction = text(d.nearFraction * 100);
  }
  return texts;
}

/** A typed number; empty is null, anything else unreadable is NaN (the schema says so). */
function read(value: string | undefined): number | null {
  return parseDecimal(value ?? '');
}

function need(value: string | undefined): number {
  return read(value) ?? Number.NaN;
}

/**
 * The set's figures from the boxes, on top of `base` (which carries what the form does not
 * edit: storey reductions and the instructional rule, kept or dropped by `keepExtras`).
 */
export function dataFrom(base: RuleSetData, texts: FigureTexts, keepExtras = true): RuleSetData {
  if (base.kind === 'flammable-limits') {
    const d = base.data;
    const perValue = read(texts['perFloorArea.value']);
    return {
      kind: base.kind,
      data: {
        ...d,
        perFloorArea:
          perValue === null ? null : { value: perValue, unit: d.perFloorArea?.unit ?? 'ft2' },
        byUnitClass: d.byUnitClass.map((row, i) => {
          const capI = read(texts[`byUnitClass.${i}.maxPerUnit.classI`]);
          const capAll = read(texts[`byUnitClass.${i}.maxPerUnit.classesIToIIIA`]);
          return {
            unitClass: row.unitClass,
            perArea: {
              classI: need(texts[`byUnitClass.${i}.perArea.classI`]),
              classesIToIIIA: need(texts[`byUnitClass.${i}.perArea.classesIToIIIA`]),
            },
            maxPerUnit:
              capI === null && capAll === null
                ? null
                : { classI: capI ?? Number.NaN, classesIToIIIA: capAll ?? Number.NaN },
          };
        }),
        outsideStorageFactor: need(texts.outsideStorageFactor) / 100,
        perCabinet: read(texts.perCabinet),
        instructional: keepExtras ? d.instructional : null,
        storeyReductions: keepExtras ? d.storeyReductions : [],
      },
    };
  }
  if (base.kind === 'container-sizes') {
    const limits: ContainerSizesData['limits'] = [];
    for (const liquidClass of LIQUID_CLASSES) {
      for (const material of containerMaterials) {
        const value = read(texts[`limits.${liquidClass}.${material}`]);
        if (value !== null) limits.push({ liquidClass, material, maxCapacity: value });
      }
    }
    return { kind: base.kind, data: { ...base.data, limits } };
  }
  const d = base.data;
  return {
    kind: base.kind,
    data: {
      ...d,
      maxHazardous: { ...d.maxHazardous, value: need(texts['maxHazardous.value']) },
      maxAcutelyHazardous: {
        ...d.maxAcutelyHazardous,
        value: need(texts['maxAcutelyHazardous.value']),
      },
      daysAllowedOnceExceeded: need(texts.daysAllowedOnceExceeded),
      maxAccumulationDays: read(texts.maxAccumulationDays),
      nearFraction: need(texts.nearFraction) / 100,
    },
  };
}
