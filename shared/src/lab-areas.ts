import { z } from 'zod';
import { ghsCodeSchema } from './hazards';
import {
  containerMaterialSchema,
  flammableStorageKindSchema,
  floorAreaUnitSchema,
  labAreaKindSchema,
  labUnitClassSchema,
  liquidClassSchema,
} from './flammability';

/**
 * Lab areas: a place marked as a lab unit (or control area) whose flammable and combustible
 * liquids Lotwise counts against a flammable-limits rule set. Everything in the place and in
 * every place below it counts; places below flagged `flammableStorage` (an approved cabinet or
 * safety cans) count as "in storage". `GET /api/lab-areas`, `GET /api/lab-areas/:id`,
 * `POST /api/lab-areas` (mark a place), `PATCH /api/lab-areas/:id`, `DELETE /api/lab-areas/:id`
 * (unmark it; the place and its containers stay).
 */

const id = (what: string) =>
  z
    .number({ message: `must be ${what}` })
    .int()
    .positive();

const labAreaFields = {
  kind: labAreaKindSchema,
  unitClass: labUnitClassSchema,
  floorArea: z
    .number({ message: 'must be a number' })
    .positive('must be more than 0')
    .max(1_000_000, 'is at most 1,000,000'),
  floorAreaUnit: floorAreaUnitSchema,
  /** 1 is the ground floor (grade level); below grade is 0 or less. */
  storey: z.number({ message: 'must be a whole number' }).int().min(-10).max(200),
  /** A teaching lab (NFPA 45: Class C or D, limited to half of Class C's figures). */
  instructional: z.boolean({ message: 'must be true or false' }),
  /** The flammable-limits rule set the area is counted against. */
  flammableRuleSetId: id('a rule set id'),
  /** The container-sizes rule set; null: container sizes are not checked. */
  containerSizeRuleSetId: id('a rule set id').nullable(),
  notes: z.string().trim().max(2000, 'is at most 2000 characters'),
};

/**
 * `POST /api/lab-areas`: mark a place. Without `flammableRuleSetId` the built-in
 * "NFPA 45 (2024), Table 9.1.1" set is used; without `containerSizeRuleSetId` the built-in
 * container-sizes set (send null to check no container sizes). A place inside another area,
 * or one that holds an area, cannot be marked (409).
 */
export const labAreaCreateSchema = z
  .object({
    locationId: id('a location id'),
    ...labAreaFields,
    kind: labAreaFields.kind.default('lab-unit'),
    storey: labAreaFields.storey.default(1),
    instructional: labAreaFields.instructional.default(false),
    flammableRuleSetId: labAreaFields.flammableRuleSetId.optional(),
    containerSizeRuleSetId: labAreaFields.containerSizeRuleSetId.optional(),
    notes: labAreaFields.notes.default(''),
  })
  .strict();
export type LabAreaCreate = z.input<typeof labAreaCreateSchema>;
export type LabAreaCreateParsed = z.output<typeof labAreaCreateSchema>;

/** `PATCH /api/lab-areas/:id`: any field but the place (unmark it and mark the other one). */
export const labAreaPatchSchema = z.object(labAreaFields).partial().strict();
export type LabAreaPatch = z.infer<typeof labAreaPatchSchema>;

export const labAreaStatuses = ['within', 'near', 'over'] as const;
export type LabAreaStatus = (typeof labAreaStatuses)[number];
export const labAreaStatusLabels: Record<LabAreaStatus, string> = {
  within: 'Within its limits',
  near: 'Near a limit',
  over: 'Over a limit',
};
/** A limit at this share or more is "near" (the start page lists the area). */
export const labAreaNearFraction = 0.9;

/** Which liquids a limit counts, and where. */
export const labAreaLimitKeys = [
  'class-i',
  'classes-i-to-iiia',
  'class-i-outside-storage',
  'classes-i-to-iiia-outside-storage',
] as const;
export type LabAreaLimitKey = (typeof labAreaLimitKeys)[number];

/** One step of working out a limit, in words, with the figure it arrives at. */
export const limitStepSchema = z.object({
  /** "20 gal per 100 ft² × 400 ft² ÷ 100 ft² = 80 gal" */
  text: z.string(),
  /** The figure after this step, in litres. */
  litres: z.number(),
});
export type LimitStep = z.infer<typeof limitStepSchema>;

/** One limit of the area against what it holds. */
export const labAreaLimitSchema = z.object({
  key: z.enum(labAreaLimitKeys),
  /** In words: "Class I liquids, cabinets and safety cans included". */
  label: z.string(),
  limitLitres: z.number(),
  /** What counts toward it now. */
  heldLitres: z.number(),
  /** limit − held; negative when over. */
  marginLitres: z.number(),
  /** held ÷ limit; null when the limit is 0 (then anything held is over). */
  fractionUsed: z.number().nullable(),
  status: z.enum(labAreaStatuses),
  /** How the limit was worked out, step by step. */
  working: z.array(limitStepSchema),
});
export type LabAreaLimit = z.infer<typeof labAreaLimitSchema>;

export const labAreaRuleSetRefSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  /** "NFPA 45 (2024), Table 9.1.1" */
  citation: z.string(),
  builtIn: z.boolean(),
});

/** `GET /api/lab-areas`: one area with its limits against what it holds. */
export const labAreaSchema = z.object({
  id: z.number().int(),
  locationId: z.number().int(),
  /** The place's name and path ("Room 101"). */
  name: z.string(),
  path: z.string(),
  kind: labAreaKindSchema,
  unitClass: labUnitClassSchema,
  floorArea: z.number(),
  floorAreaUnit: floorAreaUnitSchema,
  storey: z.number().int(),
  instructional: z.boolean(),
  notes: z.string(),
  flammableRuleSet: labAreaRuleSetRefSchema,
  containerSizeRuleSet: labAreaRuleSetRefSchema.nullable(),
  limits: z.array(labAreaLimitSchema),
  /** The highest share of a limit used; null when no limit is above 0 and nothing is held. */
  worstFractionUsed: z.number().nullable(),
  status: z.enum(labAreaStatuses),
  /** Containers of a liquid whose class cannot be told (not counted). */
  notCountedCount: z.number().int(),
  containerSizeBreachCount: z.number().int(),
  /** The reminder every room-rule answer carries (`roomRulesReminder`). */
  reminder: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type LabArea = z.infer<typeof labAreaSchema>;

const areaChemicalSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.string()),
});

/** Litres held of one liquid class, in approved storage and outside it. */
export const labAreaClassTotalSchema = z.object({
  liquidClass: liquidClassSchema,
  inStorageLitres: z.number(),
  outsideStorageLitres: z.number(),
  totalLitres: z.number(),
});
export type LabAreaClassTotal = z.infer<typeof labAreaClassTotalSchema>;

/** A container that counts toward the limits. */
export const labAreaCountedContainerSchema = z.object({
  containerId: z.number().int(),
  labelCode: z.string(),
  chemical: areaChemicalSchema,
  liquidClass: liquidClassSchema,
  litres: z.number(),
  /** Inside an approved cabinet or safety cans. */
  inStorage: z.boolean(),
  storageKind: flammableStorageKindSchema.nullable(),
  locationId: z.number().int(),
  locationPath: z.string(),
  material: containerMaterialSchema.nullable(),
  capacityLitres: z.number().nullable(),
});
export type LabAreaCountedContainer = z.infer<typeof labAreaCountedContainerSchema>;

/** A liquid container Lotwise could not count, and what to add so it can. */
export const labAreaNotCountedSchema = z.object({
  containerId: z.number().int(),
  labelCode: z.string(),
  chemical: areaChemicalSchema,
  locationPath: z.string(),
  /** "add flash point/boiling point", "add the density (counted in g)". */
  reason: z.string(),
});
export type LabAreaNotCounted = z.infer<typeof labAreaNotCountedSchema>;

/** A container larger than its liquid class and material allow. */
export const labAreaContainerSizeBreachSchema = z.object({
  containerId: z.number().int(),
  labelCode: z.string(),
  chemicalName: z.string(),
  liquidClass: liquidClassSchema,
  material: containerMaterialSchema,
  capacityLitres: z.number(),
  limitLitres: z.number(),
  source: z.string(),
});
export type LabAreaContainerSizeBreach = z.infer<typeof labAreaContainerSizeBreachSchema>;

/** An approved cabinet or safety-can place inside the area and what it holds (I, II, IIIA). */
export const labAreaStoragePlaceSchema = z.object({
  locationId: z.number().int(),
  path: z.string(),
  storageKind: flammableStorageKindSchema,
  heldLitres: z.number(),
  /** A custom set's cap per cabinet; null: none. */
  limitLitres: z.number().nullable(),
});
export type LabAreaStoragePlace = z.infer<typeof labAreaStoragePlaceSchema>;

/** `GET /api/lab-areas/:id`: the limits with their working and what is counted. */
/** Ignitable liquid waste counted toward the totals (when the rule set counts it). */
export const labAreaCountedWasteSchema = z.object({
  wasteContainerId: z.number().int(),
  labelCode: z.string(),
  title: z.string(),
  locationPath: z.string(),
  liquidClass: liquidClassSchema,
  /** Set when the class is assumed (ignitable, no flash point known: Class IB). */
  liquidClassNote: z.string().nullable(),
  litres: z.number(),
  inStorage: z.boolean(),
});
export type LabAreaCountedWaste = z.infer<typeof labAreaCountedWasteSchema>;

export const labAreaDetailSchema = labAreaSchema.extend({
  byClass: z.array(labAreaClassTotalSchema),
  containers: z.array(labAreaCountedContainerSchema),
  countedWaste: z.array(labAreaCountedWasteSchema),
  notCounted: z.array(labAreaNotCountedSchema),
  containerSizeBreaches: z.array(labAreaContainerSizeBreachSchema),
  storagePlaces: z.array(labAreaStoragePlaceSchema),
});
export type LabAreaDetail = z.infer<typeof labAreaDetailSchema>;
