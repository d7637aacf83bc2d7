import { z } from 'zod';
import { amountSchema, quantityUnitSchema } from './amounts';
import { confirmFieldSchema } from './confirmations';
import { isoDateSchema } from './dates';
import { liquidClassSchema, wasteCharacteristicSchema } from './flammability';
import { ghsCodeSchema } from './hazards';

/**
 * Chemical waste: waste containers (a kind of container of their own, `waste_containers`),
 * what went into them (`waste_additions`, from a run, a draw or by hand), the places they
 * accumulate in, and the pickups that close them. `GET /api/containers?kind=waste`,
 * `/api/waste-containers[/:id]`, `POST /api/waste-containers/:id/additions`,
 * `/api/waste-areas`, `/api/waste-pickups[/:id]`.
 */

/** Waste label codes read `LW-W` and five digits: LW-W00012 (stock labels are `LW-00012`). */
export const wasteLabelCodePrefix = 'LW-W';

/** The label code of waste label number `n`: 12 -> "LW-W00012". */
export function formatWasteLabelCode(n: number): string {
  return `${wasteLabelCodePrefix}${String(Math.trunc(n)).padStart(5, '0')}`;
}

/** "lw-w12", "LW-W00012", "LW W 12" -> 12; null when it is not a waste label code. */
export function parseWasteLabelCode(text: string): number | null {
  const match = /^\s*lw[-\s]?w[-\s]?(\d{1,12})\s*$/i.exec(text);
  if (!match) return null;
  const n = Number(match[1]);
  return n > 0 ? n : null;
}

export const wasteStatuses = ['open', 'full', 'picked-up'] as const;
export type WasteStatus = (typeof wasteStatuses)[number];
export const wasteStatusSchema = z.enum(wasteStatuses, {
  message: `must be one of: ${wasteStatuses.join(', ')}`,
});
export const wasteStatusLabels: Record<WasteStatus, string> = {
  open: 'Open for additions',
  full: 'Full, waiting for pickup',
  'picked-up': 'Picked up',
};

export const wasteForms = ['liquid', 'solid'] as const;
export type WasteForm = (typeof wasteForms)[number];
export const wasteFormSchema = z.enum(wasteForms, { message: 'must be liquid or solid' });

/** The words printed on every waste label. */
export const hazardousWasteWording = 'Hazardous waste';

const characteristicsSchema = z
  .array(wasteCharacteristicSchema)
  .max(4)
  .transform((list) => [...new Set(list)]);

/** `POST /api/waste-containers`. */
export const wasteContainerCreateSchema = z
  .object({
    title: z.string().trim().min(1, 'say what the container collects').max(120),
    locationId: z.number().int().positive(),
    capacity: amountSchema('capacity', 'positive'),
    capacityUnit: quantityUnitSchema,
    form: wasteFormSchema.default('liquid'),
    characteristics: characteristicsSchema.default([]),
    acutelyHazardous: z.boolean().default(false),
    /** The first addition's date when not given. */
    accumulationStartOn: isoDateSchema.nullable().default(null),
    notes: z.string().trim().max(2000).default(''),
  })
  .strict();
export type WasteContainerCreate = z.input<typeof wasteContainerCreateSchema>;
export type WasteContainerCreateParsed = z.output<typeof wasteContainerCreateSchema>;

/** `PATCH /api/waste-containers/:id` (a picked-up container changes only through its pickup). */
export const wasteContainerPatchSchema = z
  .object({
    title: z.string().trim().min(1).max(120),
    locationId: z.number().int().positive(),
    characteristics: characteristicsSchema,
    acutelyHazardous: z.boolean(),
    accumulationStartOn: isoDateSchema.nullable(),
    status: z.enum(['open', 'full'], { message: 'must be open or full' }),
    notes: z.string().trim().max(2000),
  })
  .partial()
  .strict();
export type WasteContainerPatch = z.input<typeof wasteContainerPatchSchema>;

/**
 * What goes into a waste container: chemicals and an approximate amount, described in words
 * ("filtrate of run #12"). Used by the additions route, a run's `waste` and a draw to waste.
 */
export const wasteAdditionInputSchema = z
  .object({
    wasteContainerId: z.number().int().positive(),
    description: z.string().trim().min(1, 'say what went in').max(300),
    quantity: amountSchema('quantity', 'positive'),
    unit: quantityUnitSchema,
    chemicalIds: z.array(z.number().int().positive()).max(20).default([]),
  })
  .strict();
export type WasteAdditionInput = z.input<typeof wasteAdditionInputSchema>;
export type WasteAdditionInputParsed = z.output<typeof wasteAdditionInputSchema>;

/** `POST /api/waste-containers/:id/additions`. */
export const wasteAdditionCreateSchema = wasteAdditionInputSchema
  .omit({ wasteContainerId: true })
  .extend({
    /** Add even when the contents conflict by the segregation table (409 otherwise). */
    confirm: confirmFieldSchema,
  })
  .strict();
export type WasteAdditionCreate = z.input<typeof wasteAdditionCreateSchema>;

export const wasteAdditionSchema = z.object({
  id: z.number().int(),
  wasteContainerId: z.number().int(),
  description: z.string(),
  quantity: z.number(),
  unit: z.string(),
  chemicals: z.array(
    z.object({
      id: z.number().int(),
      name: z.string(),
      ghsPictograms: z.array(ghsCodeSchema),
      hazardStatements: z.array(z.string()),
    }),
  ),
  runId: z.number().int().nullable(),
  ledgerEntryId: z.number().int().nullable(),
  addedById: z.number().int().nullable(),
  addedByName: z.string().nullable(),
  addedAt: z.string(),
});
export type WasteAddition = z.infer<typeof wasteAdditionSchema>;

/** A waste container as lists show it (`GET /api/containers?kind=waste`). */
export const wasteContainerSchema = z.object({
  kind: z.literal('waste'),
  id: z.number().int(),
  labelCode: z.string(),
  title: z.string(),
  locationId: z.number().int(),
  locationPath: z.string(),
  capacity: z.number(),
  capacityUnit: z.string(),
  /** Approximate, from the additions, in the capacity's unit (null: amounts not comparable). */
  filled: z.number().nullable(),
  /** filled / capacity, 0 to 1 and beyond. */
  fillFraction: z.number().nullable(),
  form: wasteFormSchema,
  characteristics: z.array(wasteCharacteristicSchema),
  acutelyHazardous: z.boolean(),
  /** The most severe NFPA 30 class among the contents (Class IB when ignitable and unknown). */
  liquidClass: liquidClassSchema.nullable(),
  liquidClassNote: z.string().nullable(),
  accumulationStartOn: z.string().nullable(),
  /** Days since the accumulation start date, today included as day 0. */
  ageDays: z.number().int().nullable(),
  status: wasteStatusSchema,
  pickupId: z.number().int().nullable(),
  notes: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type WasteContainer = z.infer<typeof wasteContainerSchema>;

export const wasteContainerDetailSchema = wasteContainerSchema.extend({
  additions: z.array(wasteAdditionSchema),
  /** Every chemical that went in, once, with its hazards (for the page and the label). */
  chemicals: wasteAdditionSchema.shape.chemicals,
  ghsPictograms: z.array(ghsCodeSchema),
});
export type WasteContainerDetail = z.infer<typeof wasteContainerDetailSchema>;

/** `GET /api/waste-containers`: open ones; `compatibleWith` leaves out those that conflict. */
export const wasteContainerListQuerySchema = z.object({
  status: wasteStatusSchema.optional(),
  locationId: z.coerce.number().int().positive().optional(),
  /** Comma-separated chemical ids: only containers whose contents may be mixed with them. */
  compatibleWith: z
    .string()
    .regex(/^\d+(,\d+)*$/, 'must be chemical ids separated by commas')
    .transform((text) => text.split(',').map(Number))
    .optional(),
});
export type WasteContainerListQuery = z.infer<typeof wasteContainerListQuerySchema>;

/** `PUT /api/waste-areas/:locationId`: mark a place as a waste accumulation area. */
export const wasteAreaPutSchema = z
  .object({
    /** A `waste-accumulation` rule set; null: the built-in one (US EPA, 40 CFR §262.15). */
    ruleSetId: z.number().int().positive().nullable().default(null),
  })
  .strict();

/** A waste accumulation area with its totals against the rule set's limits. */
export const wasteAreaSchema = z.object({
  locationId: z.number().int(),
  locationPath: z.string(),
  ruleSetId: z.number().int(),
  ruleSetName: z.string(),
  /** "US EPA, 40 CFR, §262.15": cited beside every figure. */
  citation: z.string(),
  hazardous: z.object({ litres: z.number(), limitLitres: z.number(), fraction: z.number() }),
  acutelyHazardous: z.object({ litres: z.number(), limitLitres: z.number(), fraction: z.number() }),
  daysAllowedOnceExceeded: z.number().int(),
  maxAccumulationDays: z.number().int().nullable(),
  nearFraction: z.number(),
  state: z.enum(['ok', 'near', 'over']),
  containers: z.array(wasteContainerSchema),
  reminder: z.string(),
});
export type WasteArea = z.infer<typeof wasteAreaSchema>;

/** `POST /api/waste-pickups`: closes its containers in one transaction. */
export const wastePickupCreateSchema = z
  .object({
    pickedUpOn: isoDateSchema,
    contractor: z.string().trim().min(1, 'name the contractor').max(200),
    manifestNumber: z.string().trim().min(1, 'give the manifest number').max(60),
    wasteContainerIds: z
      .array(z.number().int().positive())
      .min(1, 'choose at least one container')
      .max(200),
    notes: z.string().trim().max(2000).default(''),
  })
  .strict();
export type WastePickupCreate = z.input<typeof wastePickupCreateSchema>;

export const wastePickupSchema = z.object({
  id: z.number().int(),
  pickedUpOn: z.string(),
  contractor: z.string(),
  manifestNumber: z.string(),
  notes: z.string(),
  recordedById: z.number().int().nullable(),
  createdAt: z.string(),
  containers: z.array(z.object({ id: z.number().int(), labelCode: z.string(), title: z.string() })),
});
export type WastePickup = z.infer<typeof wastePickupSchema>;
