import { tryParseUnit } from '@lotwise/chem';
import { z } from 'zod';
import { amountSchema, quantityUnitSchema } from './amounts';
import { stockUnitSchema } from './chemicals';
import { confirmFieldSchema } from './confirmations';
import { wasteAdditionInputSchema } from './waste';
import { isoDateSchema } from './dates';
import { listQuerySchema } from './list';
import { lotSourceSchema } from './lots';
import { nameSchema } from './names';
import {
  chemWarningSchema,
  scaleFactorInputSchema,
  stoichiometrySchema,
  temperatureRangeSchema,
} from './procedures';

export const runStatuses = ['open', 'recorded'] as const;
export const runStatusSchema = z.enum(runStatuses);
export type RunStatus = (typeof runStatuses)[number];

const measuredUnit = quantityUnitSchema;

/**
 * `POST /api/runs`: from a plan (procedure and scale from it: the plan's factor × benches)
 * or ad hoc (a procedure and a factor, default 1).
 */
export const runCreateSchema = z
  .object({
    planId: z.number({ message: 'must be a plan id' }).int().positive().optional(),
    procedureId: z.number({ message: 'must be a procedure id' }).int().positive().optional(),
    scaleFactor: scaleFactorInputSchema.optional(),
    notes: z.string().max(4000).default(''),
  })
  .strict()
  .refine((run) => (run.planId === undefined) !== (run.procedureId === undefined), {
    path: ['procedureId'],
    message: 'give either planId or procedureId',
  });
export type RunCreate = z.input<typeof runCreateSchema>;
export type RunCreateParsed = z.output<typeof runCreateSchema>;

/**
 * One draw of a run from a named container: `amount` taken (mass or volume unit), or the
 * container weighed: `grossMassBefore` and `grossMassAfter` (drawn = before − after), or
 * `grossMassAfter` alone (drawn = balance − (after − tare)).
 */
export const runDrawSchema = z
  .object({
    containerId: z.number({ message: 'must be a container id' }).int().positive(),
    amount: amountSchema('amount', 'positive').optional(),
    grossMassBefore: amountSchema('gross mass', 'nonNegative').optional(),
    grossMassAfter: amountSchema('gross mass', 'nonNegative').optional(),
    unit: measuredUnit,
    note: z.string().trim().max(1000).default(''),
  })
  .strict()
  .superRefine((draw, ctx) => {
    const weighed = draw.grossMassAfter !== undefined;
    if ((draw.amount === undefined) === !weighed) {
      ctx.addIssue({
        code: 'custom',
        path: ['amount'],
        message:
          'give either amount (what you took) or grossMassAfter (with grossMassBefore, or the tare)',
      });
    }
    if (draw.grossMassBefore !== undefined && !weighed) {
      ctx.addIssue({
        code: 'custom',
        path: ['grossMassAfter'],
        message: 'weigh the container again after taking from it',
      });
    }
    if (
      draw.grossMassBefore !== undefined &&
      draw.grossMassAfter !== undefined &&
      draw.grossMassAfter >= draw.grossMassBefore
    ) {
      ctx.addIssue({
        code: 'custom',
        path: ['grossMassAfter'],
        message: 'must be less than the mass before: something was taken out',
      });
    }
    if (weighed) {
      const unit = tryParseUnit(draw.unit);
      if (unit.ok && unit.value.dimension !== 'mass') {
        ctx.addIssue({ code: 'custom', path: ['unit'], message: 'a gross mass is weighed: use g' });
      }
    }
  });
export type RunDraw = z.input<typeof runDrawSchema>;

/** A portion of product put into stock: each becomes a new prepared lot and container. */
export const runPortionSchema = z
  .object({
    /** e.g. "first crop", "second crop (from the mother liquor)". */
    label: nameSchema(80, 'name the portion, e.g. first crop'),
    quantity: amountSchema('quantity', 'positive'),
    /** Mass (or, for a liquid or solution product, volume). */
    unit: measuredUnit,
    locationId: z.number({ message: 'must be a location id' }).int().positive(),
    tareMass: amountSchema('tare mass', 'nonNegative').nullable().default(null),
    expiresOn: isoDateSchema.nullable().default(null),
    notes: z.string().max(2000).default(''),
  })
  .strict();

export const runProductSchema = z
  .object({
    /** The product line; default the procedure's first. */
    lineIndex: z.number().int().min(0).optional(),
    /** Weighed before purification, g; recorded for the crude yield, not stocked. */
    crudeMassG: amountSchema('crude mass', 'positive').nullable().default(null),
    portions: z.array(runPortionSchema).max(10).default([]),
  })
  .strict();

export const runObservationsSchema = z
  .object({
    meltingRangeC: temperatureRangeSchema.nullable().default(null),
    appearance: z.string().trim().max(500).default(''),
    notes: z.string().max(4000).default(''),
  })
  .strict();

/**
 * `POST /api/runs/:id/record`: what was really used and obtained, in one transaction.
 * `lines[].lineIndex` names the procedure line each draw is for; `extraDraws` are draws for
 * no line (e.g. recrystallization solvent).
 */
export const runRecordSchema = z
  .object({
    performedOn: isoDateSchema.optional(),
    lines: z
      .array(
        z
          .object({
            lineIndex: z.number().int().min(0),
            draws: z.array(runDrawSchema).min(1).max(20),
          })
          .strict(),
      )
      .max(40)
      .default([]),
    extraDraws: z
      .array(runDrawSchema.and(z.object({ purpose: z.string().trim().max(200).default('') })))
      .max(20)
      .default([]),
    products: z.array(runProductSchema).max(5).default([]),
    observations: runObservationsSchema.default({ meltingRangeC: null, appearance: '', notes: '' }),
    /** Washings, filtrates and residues sent to waste containers with the run. */
    waste: z.array(wasteAdditionInputSchema).max(10).default([]),
    /**
     * Record even when a draw takes from what another plan holds, or a waste conflicts with
     * what its container holds (409 `confirmation_required` otherwise).
     */
    confirm: confirmFieldSchema,
  })
  .strict();
export type RunRecord = z.input<typeof runRecordSchema>;
export type RunRecordParsed = z.output<typeof runRecordSchema>;

export const runDrawViewSchema = z.object({
  id: z.number().int(),
  /** Procedure line, or null for an extra draw. */
  lineIndex: z.number().int().nullable(),
  purpose: z.string(),
  containerId: z.number().int(),
  labelCode: z.string(),
  lotId: z.number().int(),
  chemicalId: z.number().int(),
  chemicalName: z.string(),
  /** As drawn (positive), in the container's unit. */
  quantity: z.number(),
  unit: stockUnitSchema,
  purityPercent: z.number(),
  ledgerEntryId: z.number().int(),
});
export type RunDrawView = z.infer<typeof runDrawViewSchema>;

export const runPortionViewSchema = z.object({
  id: z.number().int(),
  lineIndex: z.number().int(),
  label: z.string(),
  lotId: z.number().int(),
  containerId: z.number().int(),
  labelCode: z.string(),
  locationPath: z.string(),
  chemicalId: z.number().int(),
  chemicalName: z.string(),
  quantity: z.number(),
  unit: stockUnitSchema,
  massG: z.number().nullable(),
  percentYield: z.number().nullable(),
});
export type RunPortionView = z.infer<typeof runPortionViewSchema>;

export const runSummarySchema = z.object({
  id: z.number().int(),
  procedure: z.object({ id: z.number().int(), title: z.string() }),
  planId: z.number().int().nullable(),
  scaleFactor: z.number(),
  status: runStatusSchema,
  performedBy: z.object({ id: z.number().int(), displayName: z.string() }).nullable(),
  performedOn: z.string().nullable(),
  /** From the amounts really used, g (for a solution product, g of solution). */
  theoreticalYieldG: z.number().nullable(),
  crudeMassG: z.number().nullable(),
  /** All portions put into stock, g. */
  productMassG: z.number().nullable(),
  /** Purified yield: the portions put into stock (null when none were). */
  percentYield: z.number().nullable(),
  /** Crude yield: the crude mass weighed before purifying (null when not weighed). */
  crudePercentYield: z.number().nullable(),
  expectedYieldPercent: z.number().nullable(),
  /** Set when the purified yield is above 100 %: probably wet or impure. */
  yieldFlag: z.string().nullable(),
  /** Set when the crude yield is above 100 %, whatever the purified yield. */
  crudeYieldFlag: z.string().nullable(),
  recordedAt: z.string().nullable(),
  createdAt: z.string(),
  /** Timeline entries flagged as deviations (a reading outside its window, a step cut short …). */
  deviationCount: z.number().int(),
});
export type RunSummary = z.infer<typeof runSummarySchema>;

export const runSchema = runSummarySchema.extend({
  notes: z.string(),
  draws: z.array(runDrawViewSchema),
  portions: z.array(runPortionViewSchema),
  /** computeStoichiometry of the amounts really used (purity of the lots drawn applied). */
  stoichiometry: stoichiometrySchema.nullable(),
  warnings: z.array(chemWarningSchema),
  /** Things Lotwise assumed, e.g. a line with no draw recorded used its planned amount. */
  notices: z.array(z.string()),
  observations: z.object({
    meltingRangeC: z.object({ low: z.number(), high: z.number() }).nullable(),
    literatureMeltingC: z.object({ low: z.number(), high: z.number() }).nullable(),
    /**
     * Whether the measured range agrees with the literature's, and in words, e.g. "starts
     * 2.0 °C below the literature range (135–136 °C): probably impure or still wet".
     */
    meltingComparison: z.object({ agrees: z.boolean(), text: z.string() }).nullable(),
    appearance: z.string(),
    notes: z.string(),
  }),
});
export type Run = z.infer<typeof runSchema>;

export const runSortFields = ['performedOn', 'createdAt', 'percentYield'] as const;
export const runListQuerySchema = listQuerySchema(runSortFields, 'createdAt.desc').extend({
  procedureId: z.coerce.number().int().positive().optional(),
  status: runStatusSchema.optional(),
});
export type RunListQuery = z.infer<typeof runListQuerySchema>;

/** Yields of one kind over a procedure's recorded runs. */
export const yieldStatsSchema = z.object({
  count: z.number().int(),
  meanPercentYield: z.number().nullable(),
  minPercentYield: z.number().nullable(),
  maxPercentYield: z.number().nullable(),
  aboveHundredCount: z.number().int(),
});
export type YieldStats = z.infer<typeof yieldStatsSchema>;

/** `GET /api/procedures/:id/runs`: yields over recorded runs against the expected yield. */
export const procedureRunsSchema = z.object({
  procedure: z.object({
    id: z.number().int(),
    title: z.string(),
    expectedYieldPercent: z.number().nullable(),
  }),
  runs: z.array(runSummarySchema),
  /**
   * Purified yields (runs that put product into stock); `count` is every recorded run.
   * Crude yields are counted apart in `crude`, never mixed into these.
   */
  stats: z.object({
    count: z.number().int(),
    purifiedCount: z.number().int(),
    meanPercentYield: z.number().nullable(),
    minPercentYield: z.number().nullable(),
    maxPercentYield: z.number().nullable(),
    aboveHundredCount: z.number().int(),
    crude: yieldStatsSchema,
  }),
});
export type ProcedureRuns = z.infer<typeof procedureRunsSchema>;

/** `GET /api/chemicals/:id/usage`: runs that drew or made it, and procedures that list it. */
export const chemicalUsageSchema = z.object({
  chemical: z.object({ id: z.number().int(), name: z.string() }),
  runs: z.array(
    z.object({
      runId: z.number().int(),
      procedureId: z.number().int(),
      procedureTitle: z.string(),
      performedOn: z.string().nullable(),
      /** `input`: drawn for a line; `extra`: an extra draw; `product`: made by the run. */
      use: z.enum(['input', 'extra', 'product']),
      quantity: z.number(),
      unit: stockUnitSchema,
    }),
  ),
  procedures: z.array(
    z.object({ id: z.number().int(), title: z.string(), roles: z.array(z.string()) }),
  ),
});
export type ChemicalUsage = z.infer<typeof chemicalUsageSchema>;

/** `GET /api/lots/:id/provenance`: how a lot was made, and where its containers went. */
export const lotProvenanceSchema = z.object({
  lot: z.object({
    id: z.number().int(),
    chemicalId: z.number().int(),
    chemicalName: z.string(),
    source: lotSourceSchema,
    receivedOn: z.string(),
    madeByRunId: z.number().int().nullable(),
  }),
  /** The run that made it (prepared lots). */
  run: runSummarySchema.nullable(),
  /** The input lots that run drew from. */
  inputs: z.array(
    z.object({
      lotId: z.number().int(),
      chemicalId: z.number().int(),
      chemicalName: z.string(),
      source: lotSourceSchema,
      supplierName: z.string().nullable(),
      supplierLotNumber: z.string().nullable(),
      labelCode: z.string(),
      lineIndex: z.number().int().nullable(),
      quantity: z.number(),
      unit: stockUnitSchema,
    }),
  ),
  containers: z.array(
    z.object({
      id: z.number().int(),
      labelCode: z.string(),
      status: z.string(),
      quantity: z.number(),
      unit: stockUnitSchema,
      locationPath: z.string(),
      /** Runs that drew from this container. */
      usedBy: z.array(
        z.object({
          runId: z.number().int(),
          procedureTitle: z.string(),
          quantity: z.number(),
          performedOn: z.string().nullable(),
        }),
      ),
      /** Ledger movements, oldest first. */
      movements: z.array(
        z.object({
          reason: z.string(),
          quantity: z.number(),
          balanceAfter: z.number(),
          note: z.string(),
          runId: z.number().int().nullable(),
          createdAt: z.string(),
        }),
      ),
    }),
  ),
});
export type LotProvenance = z.infer<typeof lotProvenanceSchema>;
