import { z } from 'zod';
import { amountSchema, quantityUnitSchema } from './amounts';
import { stockUnitSchema } from './chemicals';
import { containerStatusSchema } from './containers';
import { isoDateSchema } from './dates';
import { ghsCodeSchema } from './hazards';
import { listQuerySchema } from './list';
import { numberSchema } from './messages';
import {
  cautionFlagsSchema,
  displayValueSchema,
  lineRoleSchema,
  procedureStepSchema,
  scaleFactorInputSchema,
} from './procedures';

/**
 * A prep plan's life: `draft` (checked, nothing held) -> `reserved` (containers held until a
 * date) -> `recorded` (a run was recorded from it) or `cancelled`; a reserved plan whose
 * reservations ran out (past their until-date) is `lapsed` and holds nothing.
 */
export const planStatuses = ['draft', 'reserved', 'recorded', 'cancelled', 'lapsed'] as const;
export const planStatusSchema = z.enum(planStatuses);
export type PlanStatus = (typeof planStatuses)[number];

/** Default overage on every required amount, %. */
export const defaultOveragePercent = 10;

const planFields = {
  /** Per bench; a number or a fraction such as "1/4". */
  scaleFactor: scaleFactorInputSchema,
  /** Benches or groups doing the prep at that scale. */
  benches: numberSchema().int('must be a whole number').min(1).max(500),
  /** Extra on every required amount for spills and transfer losses, %. */
  overagePercent: numberSchema().min(0).max(200),
  plannedOn: isoDateSchema,
  notes: z.string().max(2000, 'is at most 2000 characters'),
};

/** `POST /api/plans`. */
export const planCreateSchema = z
  .object({
    procedureId: z.number({ message: 'must be a procedure id' }).int().positive(),
    ...planFields,
    benches: planFields.benches.default(1),
    overagePercent: planFields.overagePercent.default(defaultOveragePercent),
    notes: planFields.notes.default(''),
  })
  .strict();
export type PlanCreate = z.input<typeof planCreateSchema>;
export type PlanCreateParsed = z.output<typeof planCreateSchema>;

/** `PATCH /api/plans/:id` (draft, reserved or lapsed plans). */
export const planPatchSchema = z.object(planFields).partial().strict();
export type PlanPatch = z.output<typeof planPatchSchema>;

export const reservationStatuses = ['active', 'released'] as const;
export const releaseReasons = ['recorded', 'cancelled', 'lapsed', 'replaced'] as const;

export const reservationSchema = z.object({
  id: z.number().int(),
  planId: z.number().int(),
  containerId: z.number().int(),
  labelCode: z.string(),
  chemicalId: z.number().int(),
  chemicalName: z.string(),
  locationPath: z.string(),
  /** Row of the stock check it was made for, when known. */
  requirementIndex: z.number().int().nullable(),
  /**
   * Held now, as supplied, in the container's unit: never more than is left of it in the
   * container (draws since the reservation take from the newest holds first).
   */
  quantity: z.number(),
  /** What was reserved; more than `quantity` when the container was drawn down since. */
  reservedQuantity: z.number(),
  unit: stockUnitSchema,
  until: z.string(),
  status: z.enum(reservationStatuses),
  releasedReason: z.enum(releaseReasons).nullable(),
  releasedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Reservation = z.infer<typeof reservationSchema>;

/**
 * `POST /api/plans/:id/reservations`: hold containers until `until` (default the plan's
 * date). Without `items`, the containers the stock check suggests are held. The plan's
 * active reservations are replaced by these (all or nothing: 409 when any container has
 * less free than asked).
 */
export const reservationCreateSchema = z
  .object({
    until: isoDateSchema.optional(),
    items: z
      .array(
        z
          .object({
            containerId: z.number({ message: 'must be a container id' }).int().positive(),
            quantity: amountSchema('quantity', 'positive'),
            /** Default: the container's unit. */
            unit: quantityUnitSchema.optional(),
            requirementIndex: z.number().int().min(0).nullable().optional(),
          })
          .strict(),
      )
      .min(1, 'reserve at least one container')
      .max(200)
      .optional(),
  })
  .strict();
export type ReservationCreate = z.input<typeof reservationCreateSchema>;

/** A container the stock check suggests taking from, in the order to use them. */
export const stockTakeSchema = z.object({
  containerId: z.number().int(),
  labelCode: z.string(),
  lotId: z.number().int(),
  locationId: z.number().int(),
  locationPath: z.string(),
  status: containerStatusSchema,
  expiresOn: z.string().nullable(),
  purityPercent: z.number(),
  /** The container's balance (as supplied). */
  quantity: z.number(),
  /** Held by other plans. */
  reservedByOthers: z.number(),
  /** Held by this plan. */
  reservedByThisPlan: z.number(),
  /** Balance minus what other plans hold. */
  free: z.number(),
  /** To take from this container, as supplied (its own purity applied). */
  take: z.number(),
  /** `take` as pure substance, in the stock unit. */
  takePure: z.number(),
});
export type StockTake = z.infer<typeof stockTakeSchema>;

export const stockSuggestionSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('reorder'),
    chemicalId: z.number().int(),
    /** Shortfall as supplied at the chemical's default purity, in the stock unit. */
    shortfall: z.number(),
    unit: stockUnitSchema,
    reorderQuantity: z.number().nullable(),
    /** Where a reorder draft will be made (filled in by purchasing). */
    href: z.string(),
  }),
  z.object({
    kind: z.literal('prepare'),
    procedureId: z.number().int(),
    procedureTitle: z.string(),
    productLineIndex: z.number().int(),
    /** Scale factor of that procedure that covers the shortfall at its expected yield. */
    factor: z.number(),
    /** `factor` rounded up to two significant figures, for a person to type. */
    roundedFactor: z.number(),
    expectedYieldPercent: z.number(),
    /** What that procedure makes at `factor` and the expected yield, in the stock unit. */
    expectedAmount: z.number(),
    unit: stockUnitSchema,
  }),
]);
export type StockSuggestion = z.infer<typeof stockSuggestionSchema>;

export const requirementStatuses = ['ok', 'short', 'unconvertible'] as const;

/**
 * One row of the stock check: a procedure line (or the solvent a line's solute is dissolved
 * in). Amounts are in the chemical's stock unit. `perBench`, `required` and `shortfall` are
 * stated as the reagent as supplied at the chemical's default purity (what the procedure
 * says to measure); the `…Pure…` fields are pure substance. Availability is counted lot by
 * lot as pure substance, so a 95 % lot counts 95 % of its quantity.
 */
export const stockCheckLineSchema = z.object({
  index: z.number().int(),
  lineIndex: z.number().int(),
  purpose: z.enum(['line', 'dissolving']),
  role: lineRoleSchema,
  optional: z.boolean(),
  chemical: z.object({
    id: z.number().int(),
    name: z.string(),
    stockUnit: stockUnitSchema,
    density: z.number().nullable(),
    defaultPurityPercent: z.number(),
  }),
  unit: stockUnitSchema,
  /** Per bench, before overage, as supplied. */
  perBench: z.number().nullable(),
  perBenchDisplay: displayValueSchema.nullable(),
  /** perBench × benches × (1 + overage %), as supplied. */
  required: z.number().nullable(),
  requiredDisplay: displayValueSchema.nullable(),
  /** `required` as pure substance, in the stock unit and in grams (null without density). */
  requiredPure: z.number().nullable(),
  requiredPureG: z.number().nullable(),
  /** Usable containers' balances minus what other plans hold, as supplied. */
  available: z.number(),
  /** Pure substance in those, in the stock unit and in grams. */
  availablePure: z.number(),
  availablePureG: z.number().nullable(),
  /** required − available (as supplied at default purity, pure counted), ≥ 0. */
  shortfall: z.number(),
  shortfallPureG: z.number().nullable(),
  status: z.enum(requirementStatuses),
  /** Why an amount could not be put in the stock unit. */
  problem: z.string().nullable(),
  take: z.array(stockTakeSchema),
  suggestions: z.array(stockSuggestionSchema),
  /**
   * Benches (of the plan's) that what is on hand serves for this line, its share of the
   * overage included; null when the amount could not be worked out.
   */
  benchesCovered: z.number().int().nullable(),
  /** What to do about a shortfall: prepare it first (a procedure makes it) or reorder it. */
  remedy: z.enum(['prepare', 'reorder']).nullable(),
});
export type StockCheckLine = z.infer<typeof stockCheckLineSchema>;

export const stockCheckSchema = z.object({
  /** Containers expiring before this date are not counted (the later of today and the plan date). */
  asOf: z.string(),
  lines: z.array(stockCheckLineSchema),
  /** Every line that is not optional is covered. */
  ok: z.boolean(),
  shortCount: z.number().int(),
  /** Benches 1 to this one can be served from what is on hand (required lines only). */
  benchesServed: z.number().int(),
  rule: z.string(),
});
export type StockCheck = z.infer<typeof stockCheckSchema>;

export const planHazardSchema = z.object({
  chemicalId: z.number().int(),
  name: z.string(),
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.object({ code: z.string(), text: z.string().nullable() })),
});
export type PlanHazard = z.infer<typeof planHazardSchema>;

export const planCautionsSchema = z.object({
  text: z.string(),
  flags: cautionFlagsSchema,
  /** The flags in words, e.g. "Keep below 10 °C". */
  items: z.array(z.string()),
});

export const planSchema = z.object({
  id: z.number().int(),
  procedure: z.object({ id: z.number().int(), title: z.string() }),
  scaleFactor: z.number(),
  benches: z.number().int(),
  overagePercent: z.number(),
  /** scaleFactor × benches × (1 + overage %): the factor the required amounts use. */
  totalFactor: z.number(),
  plannedOn: z.string(),
  status: planStatusSchema,
  notes: z.string(),
  createdBy: z.object({ id: z.number().int(), displayName: z.string() }).nullable(),
  /** Latest until-date of active reservations. */
  reservedUntil: z.string().nullable(),
  runId: z.number().int().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Plan = z.infer<typeof planSchema>;

/** `GET /api/plans/:id`: the plan with its stock check, hazards, cautions and reservations. */
export const planDetailSchema = planSchema.extend({
  stockCheck: stockCheckSchema,
  hazards: z.array(planHazardSchema),
  cautions: planCautionsSchema,
  safetyDeferral: z.string(),
  reservations: z.array(reservationSchema),
  /** The procedure's steps, in order (an addition's amount is the stock check's line). */
  steps: z.array(procedureStepSchema),
});
export type PlanDetail = z.infer<typeof planDetailSchema>;

/**
 * `POST /api/plans/preview` (body as `POST /api/plans`): the stock check, hazards and cautions
 * a plan would have. Nothing is saved.
 */
export const planPreviewSchema = planDetailSchema.pick({
  totalFactor: true,
  stockCheck: true,
  hazards: true,
  cautions: true,
  safetyDeferral: true,
});
export type PlanPreview = z.infer<typeof planPreviewSchema>;

export const planSortFields = ['plannedOn', 'updatedAt'] as const;
export const planListQuerySchema = listQuerySchema(planSortFields, 'plannedOn.desc').extend({
  status: planStatusSchema.optional(),
  procedureId: z.coerce.number().int().positive().optional(),
  /** Only plans made by the signed-in person. */
  mine: z
    .enum(['true', 'false', '1', '0'])
    .transform((value) => value === 'true' || value === '1')
    .optional(),
});
export type PlanListQuery = z.infer<typeof planListQuerySchema>;

/** One line of the dispensing sheet: what each bench gets. */
export const dispensingLineSchema = z.object({
  lineIndex: z.number().int(),
  purpose: z.enum(['line', 'dissolving']),
  chemicalId: z.number().int(),
  name: z.string(),
  role: lineRoleSchema,
  optional: z.boolean(),
  notes: z.string(),
  /** Per bench at full precision, in the unit it is measured in. */
  perBench: z.object({ value: z.number(), unit: z.string() }).nullable(),
  /** Rounded for the balance or glassware, with the rule. */
  perBenchDisplay: displayValueSchema.nullable(),
  /** Whole session with overage, in the stock unit. */
  total: z.number().nullable(),
  totalDisplay: displayValueSchema.nullable(),
  ghsPictograms: z.array(ghsCodeSchema),
  containers: z.array(
    z.object({
      containerId: z.number().int(),
      labelCode: z.string(),
      locationPath: z.string(),
      take: z.number(),
      /** What the container holds: a take is never written larger than this. */
      quantity: z.number(),
      unit: stockUnitSchema,
    }),
  ),
  /** The stock check's word on this line, as the plan page shows it. */
  stock: stockCheckLineSchema.pick({
    status: true,
    unit: true,
    shortfall: true,
    problem: true,
    suggestions: true,
    benchesCovered: true,
    remedy: true,
  }),
});

/** `GET /api/plans/:id/dispensing`: a printable sheet per bench. */
export const dispensingSheetSchema = z.object({
  planId: z.number().int(),
  procedure: z.object({
    id: z.number().int(),
    title: z.string(),
    reference: z.string(),
    baseScale: z.string(),
  }),
  plannedOn: z.string(),
  scaleFactor: z.number(),
  benches: z.number().int(),
  overagePercent: z.number(),
  lines: z.array(dispensingLineSchema),
  /** From the stock check: required lines short, and benches 1 to `benchesServed` served. */
  shortCount: z.number().int(),
  benchesServed: z.number().int(),
  hazards: z.array(planHazardSchema),
  cautions: planCautionsSchema,
  rules: z.array(z.string()),
  safetyDeferral: z.string(),
  /** The procedure's steps, in order: every bench page shows them with its amounts. */
  steps: z.array(procedureStepSchema),
});
export type DispensingSheet = z.infer<typeof dispensingSheetSchema>;
