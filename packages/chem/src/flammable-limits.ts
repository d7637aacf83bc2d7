/**
 * The arithmetic of a flammable-limits rule set: how many litres of Class I liquids, and of
 * Classes I, II and IIIA together, a lab area may hold (cabinets and safety cans included, and
 * outside them), each step said in words so a page can show its working; and what an area
 * holds against those limits. The figures are reminders worked out from a rule set a person
 * chose; the authority having jurisdiction and the edition it adopted decide.
 *
 * A per-area limit is linear in the floor area: figure × area ÷ the area the figure is for,
 * until the lab unit's maximum caps it.
 */
import { ChemError } from './errors';
import {
  LITRES_PER_US_GALLON,
  SQUARE_METRES_PER_SQUARE_FOOT,
  countsTowardCombinedLimit,
  isClassI,
  type LiquidClass,
} from './flammability';

export type LabUnitClassCode = 'A' | 'B' | 'C' | 'D';
export type FloorAreaUnitCode = 'm2' | 'ft2';

export interface ClassLimitPairInput {
  classI: number;
  classesIToIIIA: number;
}

/** Structurally the same as `FlammableLimitsData` of shared/src/rule-sets.ts. */
export interface FlammableLimitsInput {
  unit: 'L' | 'gal';
  perFloorArea: { value: number; unit: FloorAreaUnitCode } | null;
  byUnitClass: readonly {
    unitClass: LabUnitClassCode;
    perArea: ClassLimitPairInput;
    maxPerUnit: ClassLimitPairInput | null;
  }[];
  outsideStorageFactor: number;
  instructional: {
    allowedUnitClasses: readonly LabUnitClassCode[];
    limitedToUnitClass: LabUnitClassCode;
    factor: number;
  } | null;
  storeyReductions: readonly {
    unitClasses: readonly LabUnitClassCode[];
    fromStorey: number;
    toStorey: number | null;
    factor: number;
  }[];
  countsIgnitableWaste: boolean;
  perCabinet: number | null;
}

/** The area as the limits need it. */
export interface LabAreaInput {
  unitClass: LabUnitClassCode;
  floorArea: number;
  floorAreaUnit: FloorAreaUnitCode;
  storey: number;
  instructional: boolean;
}

export type FlammableLimitKey =
  'class-i' | 'classes-i-to-iiia' | 'class-i-outside-storage' | 'classes-i-to-iiia-outside-storage';

export const FLAMMABLE_LIMIT_KEYS: readonly FlammableLimitKey[] = [
  'class-i',
  'classes-i-to-iiia',
  'class-i-outside-storage',
  'classes-i-to-iiia-outside-storage',
];

export const FLAMMABLE_LIMIT_LABELS: Record<FlammableLimitKey, string> = {
  'class-i': 'Class I liquids, cabinets and safety cans included',
  'classes-i-to-iiia': 'Classes I, II and IIIA together, cabinets and safety cans included',
  'class-i-outside-storage': 'Class I liquids outside cabinets and safety cans',
  'classes-i-to-iiia-outside-storage':
    'Classes I, II and IIIA together outside cabinets and safety cans',
};

export interface WorkingStep {
  text: string;
  /** The figure after this step, in litres. */
  litres: number;
}

export interface FlammableLimit {
  key: FlammableLimitKey;
  label: string;
  litres: number;
  working: WorkingStep[];
}

const areaUnitWords: Record<FloorAreaUnitCode, string> = { m2: 'm²', ft2: 'ft²' };

/** "1,234.5": at most two decimals, for the working's sentences. */
function figure(value: number): string {
  return value.toLocaleString('en-US', { maximumFractionDigits: 2 });
}

function toLitres(value: number, unit: 'L' | 'gal'): number {
  return unit === 'gal' ? value * LITRES_PER_US_GALLON : value;
}

function amount(value: number, unit: 'L' | 'gal'): string {
  return unit === 'gal'
    ? `${figure(value)} gal (${figure(toLitres(value, unit))} L)`
    : `${figure(value)} L`;
}

function convertArea(value: number, from: FloorAreaUnitCode, to: FloorAreaUnitCode): number {
  if (from === to) return value;
  return from === 'm2'
    ? value / SQUARE_METRES_PER_SQUARE_FOOT
    : value * SQUARE_METRES_PER_SQUARE_FOOT;
}

function figuresOf(set: FlammableLimitsInput, unitClass: LabUnitClassCode) {
  const row =
    set.byUnitClass.find((r) => r.unitClass === unitClass) ??
    (set.byUnitClass.length === 1 ? set.byUnitClass[0] : undefined);
  if (!row) {
    throw new ChemError(
      'out_of_range',
      `the rule set gives no figures for a Class ${unitClass} lab unit: pick a class it lists (${set.byUnitClass.map((r) => r.unitClass).join(', ') || 'none'})`,
    );
  }
  return row;
}

function storeyFactor(set: FlammableLimitsInput, unitClass: LabUnitClassCode, storey: number) {
  return set.storeyReductions.find(
    (r) =>
      r.unitClasses.includes(unitClass) &&
      storey >= r.fromStorey &&
      (r.toStorey === null || storey <= r.toStorey),
  );
}

function storeyRange(r: { fromStorey: number; toStorey: number | null }): string {
  if (r.toStorey === null) return `storey ${r.fromStorey} and above`;
  if (r.toStorey === r.fromStorey) return `storey ${r.fromStorey}`;
  return `storeys ${r.fromStorey}–${r.toStorey}`;
}

const pairWords: Record<keyof ClassLimitPairInput, string> = {
  classI: 'Class I liquids',
  classesIToIIIA: 'Classes I, II and IIIA',
};

/** One class's figure for one pair (in the set's unit), with its steps. */
function classFigure(
  set: FlammableLimitsInput,
  area: LabAreaInput,
  unitClass: LabUnitClassCode,
  pair: keyof ClassLimitPairInput,
  steps: WorkingStep[],
): number {
  const row = figuresOf(set, unitClass);
  const unit = set.unit;
  const perArea = row.perArea[pair];
  let value: number;
  if (set.perFloorArea) {
    const per = set.perFloorArea;
    const areaInSetUnit = convertArea(area.floorArea, area.floorAreaUnit, per.unit);
    const areaWords =
      area.floorAreaUnit === per.unit
        ? `${figure(area.floorArea)} ${areaUnitWords[per.unit]}`
        : `${figure(areaInSetUnit)} ${areaUnitWords[per.unit]} (${figure(area.floorArea)} ${areaUnitWords[area.floorAreaUnit]})`;
    value = (perArea * areaInSetUnit) / per.value;
    steps.push({
      text: `Class ${unitClass}, ${pairWords[pair]}: ${figure(perArea)} ${unit} per ${figure(per.value)} ${areaUnitWords[per.unit]} × ${areaWords} ÷ ${figure(per.value)} ${areaUnitWords[per.unit]} = ${amount(value, unit)}`,
      litres: toLitres(value, unit),
    });
  } else {
    value = perArea;
    steps.push({
      text: `Class ${unitClass}, ${pairWords[pair]}: ${amount(value, unit)} for the lab area, whatever its size`,
      litres: toLitres(value, unit),
    });
  }
  if (row.maxPerUnit) {
    const max = row.maxPerUnit[pair];
    if (value > max) {
      value = max;
      steps.push({
        text: `Capped at the lab unit maximum of ${amount(max, unit)}`,
        litres: toLitres(value, unit),
      });
    } else {
      steps.push({
        text: `Within the lab unit maximum of ${amount(max, unit)}: stays ${amount(value, unit)}`,
        litres: toLitres(value, unit),
      });
    }
  }
  const reduction = storeyFactor(set, unitClass, area.storey);
  if (reduction) {
    value *= reduction.factor;
    steps.push({
      text: `Storey ${area.storey} (Class ${unitClass} figures, ${storeyRange(reduction)}): × ${figure(reduction.factor)} = ${amount(value, unit)}`,
      litres: toLitres(value, unit),
    });
  }
  return value;
}

function pairLimit(
  set: FlammableLimitsInput,
  area: LabAreaInput,
  pair: keyof ClassLimitPairInput,
  steps: WorkingStep[],
): number {
  const unit = set.unit;
  let value = classFigure(set, area, area.unitClass, pair, steps);
  if (area.instructional && set.instructional) {
    const rule = set.instructional;
    const ref: WorkingStep[] = [];
    const other = classFigure(set, area, rule.limitedToUnitClass, pair, ref) * rule.factor;
    steps.push(
      ...ref.map((s) => ({
        ...s,
        text: `Instructional lab, ${s.text.charAt(0).toLowerCase()}${s.text.slice(1)}`,
      })),
    );
    const lower = Math.min(value, other);
    steps.push({
      text: `Instructional lab: at most ${figure(rule.factor * 100)} % of Class ${rule.limitedToUnitClass}'s figure, ${amount(other, unit)}; the lower figure applies: ${amount(lower, unit)}`,
      litres: toLitres(lower, unit),
    });
    value = lower;
  }
  return value;
}

/**
 * Whether the set lets an area be instructional in its class: null when it may, otherwise a
 * sentence saying which classes an instructional lab may be.
 */
export function instructionalProblem(
  set: FlammableLimitsInput,
  area: Pick<LabAreaInput, 'unitClass' | 'instructional'>,
): string | null {
  if (!area.instructional || !set.instructional) return null;
  const allowed = set.instructional.allowedUnitClasses;
  if (allowed.includes(area.unitClass)) return null;
  return `an instructional lab must be Class ${allowed.join(' or ')} under this rule set`;
}

/**
 * The four limits of an area under a flammable-limits set, in litres, with their working:
 * Class I and Classes I+II+IIIA, cabinets and safety cans included, and outside them
 * (× `outsideStorageFactor`). Throws a ChemError when the set has no figures for the class.
 */
export function flammableLimitsFor(
  set: FlammableLimitsInput,
  area: LabAreaInput,
): FlammableLimit[] {
  const limits: FlammableLimit[] = [];
  for (const pair of ['classI', 'classesIToIIIA'] as const) {
    const steps: WorkingStep[] = [];
    const value = pairLimit(set, area, pair, steps);
    const including = pair === 'classI' ? 'class-i' : 'classes-i-to-iiia';
    const outside =
      pair === 'classI' ? 'class-i-outside-storage' : 'classes-i-to-iiia-outside-storage';
    limits.push({
      key: including,
      label: FLAMMABLE_LIMIT_LABELS[including],
      litres: toLitres(value, set.unit),
      working: steps,
    });
    const outsideValue = value * set.outsideStorageFactor;
    limits.push({
      key: outside,
      label: FLAMMABLE_LIMIT_LABELS[outside],
      litres: toLitres(outsideValue, set.unit),
      working: [
        ...steps,
        {
          text: `Outside cabinets and safety cans: × ${figure(set.outsideStorageFactor)} = ${amount(outsideValue, set.unit)}`,
          litres: toLitres(outsideValue, set.unit),
        },
      ],
    });
  }
  return FLAMMABLE_LIMIT_KEYS.map((key) => limits.find((l) => l.key === key)!);
}

/** A volume that counts: a container, or an extra volume such as ignitable waste. */
export interface FlammableVolume {
  liquidClass: LiquidClass;
  litres: number;
  /** In an approved cabinet or safety can. */
  inStorage: boolean;
}

export interface ClassTotal {
  liquidClass: LiquidClass;
  inStorageLitres: number;
  outsideStorageLitres: number;
  totalLitres: number;
}

export type LimitStatus = 'within' | 'near' | 'over';

export interface LimitAgainstHeld extends FlammableLimit {
  heldLitres: number;
  marginLitres: number;
  /** held ÷ limit; null when the limit is 0. */
  fractionUsed: number | null;
  status: LimitStatus;
}

/** What a volume counts toward. */
export function countsToward(key: FlammableLimitKey, volume: FlammableVolume): boolean {
  const classIOnly = key === 'class-i' || key === 'class-i-outside-storage';
  const inClass = classIOnly
    ? isClassI(volume.liquidClass)
    : countsTowardCombinedLimit(volume.liquidClass);
  if (!inClass) return false;
  return key.endsWith('outside-storage') ? !volume.inStorage : true;
}

/** Tolerance below which a held amount is "at" the limit rather than over it (floating point). */
const EPSILON = 1e-9;

/**
 * Litres per class in and out of storage, and each limit against what is held: the margin
 * (negative when over), the share used and the status (`near` from `nearFraction`, 0.9).
 */
export function flammableTotals(
  volumes: readonly FlammableVolume[],
  limits: readonly FlammableLimit[],
  nearFraction = 0.9,
): {
  byClass: ClassTotal[];
  limits: LimitAgainstHeld[];
  worstFractionUsed: number | null;
  status: LimitStatus;
} {
  const byClass = new Map<LiquidClass, ClassTotal>();
  for (const v of volumes) {
    const row = byClass.get(v.liquidClass) ?? {
      liquidClass: v.liquidClass,
      inStorageLitres: 0,
      outsideStorageLitres: 0,
      totalLitres: 0,
    };
    if (v.inStorage) row.inStorageLitres += v.litres;
    else row.outsideStorageLitres += v.litres;
    row.totalLitres += v.litres;
    byClass.set(v.liquidClass, row);
  }
  const order: LiquidClass[] = ['IA', 'IB', 'IC', 'II', 'IIIA', 'IIIB'];
  const against = limits.map((limit): LimitAgainstHeld => {
    const held = volumes
      .filter((v) => countsToward(limit.key, v))
      .reduce((s, v) => s + v.litres, 0);
    const fractionUsed = limit.litres > 0 ? held / limit.litres : null;
    const over = held > limit.litres + EPSILON;
    const status: LimitStatus = over
      ? 'over'
      : fractionUsed !== null && fractionUsed >= nearFraction
        ? 'near'
        : 'within';
    return { ...limit, heldLitres: held, marginLitres: limit.litres - held, fractionUsed, status };
  });
  const fractions = against.map((l) => l.fractionUsed).filter((f): f is number => f !== null);
  const worstFractionUsed = fractions.length ? Math.max(...fractions) : null;
  const status: LimitStatus = against.some((l) => l.status === 'over')
    ? 'over'
    : against.some((l) => l.status === 'near')
      ? 'near'
      : 'within';
  return {
    byClass: order.flatMap((c) => (byClass.has(c) ? [byClass.get(c)!] : [])),
    limits: against,
    worstFractionUsed,
    status,
  };
}

/**
 * The limits a change would cross: those over after it and either not over before or
 * further over than before.
 */
export function limitsCrossed<
  T extends { key: FlammableLimitKey; heldLitres: number; status: LimitStatus },
>(before: readonly T[], after: readonly T[]): { before: T; after: T }[] {
  return after.flatMap((a) => {
    const b = before.find((x) => x.key === a.key);
    if (!b || a.status !== 'over') return [];
    return a.heldLitres > b.heldLitres + EPSILON ? [{ before: b, after: a }] : [];
  });
}
