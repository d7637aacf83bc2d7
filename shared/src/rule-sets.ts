import { z } from 'zod';
import {
  containerMaterialSchema,
  floorAreaUnitSchema,
  labUnitClassSchema,
  liquidClassSchema,
} from './flammability';

/**
 * Rule sets: the published limits Lotwise checks a room against, kept as data with their
 * source and edition, so a lab can pick the set its authority adopted or enter its own. Built-in
 * sets are read-only; a lab copies one to change it. `GET /api/rule-sets[?kind=]`,
 * `GET /api/rule-sets/:id`, `POST /api/rule-sets` (custom), `PATCH`/`DELETE /api/rule-sets/:id`
 * (custom and unused only).
 */
export const ruleSetKinds = ['flammable-limits', 'container-sizes', 'waste-accumulation'] as const;
export type RuleSetKind = (typeof ruleSetKinds)[number];
export const ruleSetKindSchema = z.enum(ruleSetKinds, {
  message: `must be one of: ${ruleSetKinds.join(', ')}`,
});
export const ruleSetKindLabels: Record<RuleSetKind, string> = {
  'flammable-limits': 'Flammable-liquid quantity limits',
  'container-sizes': 'Largest container by liquid class and material',
  'waste-accumulation': 'Waste accumulation limits',
};

export const volumeUnits = ['L', 'gal'] as const;
export const volumeUnitSchema = z.enum(volumeUnits, { message: 'must be L or gal' });
export type VolumeUnit = (typeof volumeUnits)[number];

const quantity = z.number().min(0, 'cannot be negative').max(1_000_000);
const factor = z.number().min(0, 'cannot be below 0').max(1, 'cannot be above 1');

/** A limit on Class I liquids and on Classes I, II and IIIA together, in the set's unit. */
export const classLimitPairSchema = z.object({
  classI: quantity,
  classesIToIIIA: quantity,
});
export type ClassLimitPair = z.infer<typeof classLimitPairSchema>;

/**
 * Flammable-liquid limits of a lab area. NFPA 45 Table 9.1.1 gives, per lab-unit class, figures
 * per 100 ft² (cabinets and safety cans included) and a maximum per lab unit; outside cabinets
 * and safety cans half of each per-area figure. A custom per-room set has `perFloorArea: null`
 * (the figures are the room's whatever its size) and may give one figure for every class.
 */
export const flammableLimitsDataSchema = z.object({
  unit: volumeUnitSchema,
  /** The floor area the per-area figures are for (NFPA 45: 100 ft²); null: per lab area. */
  perFloorArea: z.object({ value: z.number().positive(), unit: floorAreaUnitSchema }).nullable(),
  /** Figures by lab-unit class (cabinets and safety cans included). */
  byUnitClass: z.array(
    z.object({
      unitClass: labUnitClassSchema,
      perArea: classLimitPairSchema,
      /** The most a lab unit may hold whatever its size; null: no cap. */
      maxPerUnit: classLimitPairSchema.nullable(),
    }),
  ),
  /** Share of each per-area figure allowed outside cabinets and safety cans (NFPA 45: 0.5). */
  outsideStorageFactor: factor,
  /** Instructional labs: which classes they may be, and their share of one class's figures. */
  instructional: z
    .object({
      allowedUnitClasses: z.array(labUnitClassSchema),
      limitedToUnitClass: labUnitClassSchema,
      factor,
    })
    .nullable(),
  /** Reductions by storey: the figures of `unitClasses` are multiplied by `factor`. */
  storeyReductions: z.array(
    z.object({
      unitClasses: z.array(labUnitClassSchema),
      fromStorey: z.number().int(),
      /** Inclusive; null: every storey above `fromStorey`. */
      toStorey: z.number().int().nullable(),
      factor,
    }),
  ),
  /** Waste ignitable liquids count toward the totals. */
  countsIgnitableWaste: z.boolean(),
  /** A custom set may cap each approved cabinet (Classes I, II and IIIA together); null: none. */
  perCabinet: quantity.nullable(),
});
export type FlammableLimitsData = z.infer<typeof flammableLimitsDataSchema>;

/** The largest container allowed for a liquid class in a material. */
export const containerSizesDataSchema = z.object({
  unit: volumeUnitSchema,
  limits: z.array(
    z.object({
      liquidClass: liquidClassSchema,
      material: containerMaterialSchema,
      maxCapacity: quantity,
    }),
  ),
});
export type ContainerSizesData = z.infer<typeof containerSizesDataSchema>;

/**
 * Limits of a waste accumulation area (US EPA satellite accumulation, 40 CFR 262.15: 55 gallons
 * of hazardous waste or 1 quart of acutely hazardous waste; once exceeded, 3 consecutive
 * calendar days to remove the excess).
 */
export const wasteAccumulationDataSchema = z.object({
  maxHazardous: z.object({ value: quantity, unit: z.enum(['L', 'gal']) }),
  maxAcutelyHazardous: z.object({ value: quantity, unit: z.enum(['L', 'qt']) }),
  /** Days allowed to remove the excess once a limit is exceeded. */
  daysAllowedOnceExceeded: z.number().int().min(0).max(3650),
  /** The longest a container may accumulate from its start date; null: no limit in this set. */
  maxAccumulationDays: z.number().int().min(1).max(3650).nullable(),
  /** Share of a limit at which Lotwise warns (e.g. 0.9). */
  nearFraction: factor,
});
export type WasteAccumulationData = z.infer<typeof wasteAccumulationDataSchema>;

const ruleSetCommon = {
  name: z.string().trim().min(1, 'give the rule set a name').max(120),
  /** Who publishes it: "NFPA 45", "US EPA, 40 CFR 262.15", "City fire marshal, letter of …". */
  source: z.string().trim().min(1, 'say where the limits come from').max(300),
  /** Edition or date: "2024". */
  edition: z.string().trim().max(60),
  /** Table or section: "Table 9.1.1". */
  reference: z.string().trim().max(120),
  notes: z.string().trim().max(4000),
};

export const ruleSetDataSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('flammable-limits'), data: flammableLimitsDataSchema }),
  z.object({ kind: z.literal('container-sizes'), data: containerSizesDataSchema }),
  z.object({ kind: z.literal('waste-accumulation'), data: wasteAccumulationDataSchema }),
]);

/** `POST /api/rule-sets`: a lab's own set. */
export const ruleSetCreateSchema = z
  .object({
    ...ruleSetCommon,
    edition: ruleSetCommon.edition.default(''),
    reference: ruleSetCommon.reference.default(''),
    notes: ruleSetCommon.notes.default(''),
  })
  .and(ruleSetDataSchema);
export type RuleSetCreate = z.input<typeof ruleSetCreateSchema>;

export const ruleSetSchema = z
  .object({
    id: z.number().int(),
    name: z.string(),
    source: z.string(),
    edition: z.string(),
    reference: z.string(),
    notes: z.string(),
    /** Shipped with Lotwise (read-only); a lab copies it to change it. */
    builtIn: z.boolean(),
    /** "NFPA 45 (2024), Table 9.1.1": what pages and warnings cite. */
    citation: z.string(),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .and(ruleSetDataSchema);
export type RuleSet = z.infer<typeof ruleSetSchema>;

export const ruleSetListQuerySchema = z.object({ kind: ruleSetKindSchema.optional() });

/** "NFPA 45 (2024), Table 9.1.1" from a set's source, edition and reference. */
export function ruleSetCitation(set: { source: string; edition: string; reference: string }) {
  const edition = set.edition ? ` (${set.edition})` : '';
  const reference = set.reference ? `, ${set.reference}` : '';
  return `${set.source}${edition}${reference}`;
}
