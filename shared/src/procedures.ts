import {
  AMOUNT_RULE,
  BALANCE_RULE,
  CHEM_WARNING_CODES,
  GLASSWARE_RULE,
  LINE_ROLES,
  checkScaleFactor,
  measuringDensity,
  parseScaleFactor,
  computeStoichiometry,
  tryComputeStoichiometry,
  type LineRole,
  type ProcedureLine,
  type Result,
  type StoichiometryResult,
} from '@lotwise/chem';
import { z } from 'zod';
import { amountSchema, coercedAmountSchema, quantityUnitSchema, unitSchema } from './amounts';
import { physicalStateSchema, stockUnitSchema, type PhysicalState } from './chemicals';
import { ghsCodeSchema } from './hazards';
import { listQuerySchema } from './list';
import { nameSchema } from './names';

/** What a line of a procedure is for (see @lotwise/chem `LINE_ROLES`). */
export const lineRoles = LINE_ROLES;
export const lineRoleSchema = z.enum(LINE_ROLES, {
  message: `must be one of: ${LINE_ROLES.join(', ')}`,
});
export type { LineRole };

/** Roles whose stoichiometric coefficient matters. */
export const coefficientRoles: readonly LineRole[] = ['limiting-reagent', 'reagent', 'product'];

/** A unit of mass, volume or amount of substance (g, mL, mmol…). */
export const procedureUnitSchema = unitSchema();

/** A unit of mass or volume (what is measured from a bottle). */
const measuredUnitSchema = quantityUnitSchema;

/**
 * A line measured as a solution of known strength: the line's chemical is what is in the
 * bottle (e.g. "Sodium hydroxide solution 1 M"), its molar mass is the solute's, and the
 * quantity is of the solution.
 */
export const lineConcentrationSchema = z.union([
  z.object({ molarity: z.number().positive('must be more than 0 mol/L').max(30) }).strict(),
  z
    .object({
      percentWw: z.number().gt(0, 'must be more than 0 %').max(100, 'cannot be more than 100 %'),
    })
    .strict(),
]);
export type LineConcentration = z.infer<typeof lineConcentrationSchema>;

/**
 * "X g of a salt dissolved in Y mL water": the line's chemical and quantity are the solute
 * (its moles come from that mass); `dissolvedIn` is the solvent, which the stock check
 * also asks for.
 */
export const dissolvedInSchema = z
  .object({
    chemicalId: z.number({ message: 'must be a chemical id' }).int().positive(),
    quantity: amountSchema('quantity', 'positive'),
    unit: measuredUnitSchema,
  })
  .strict();
export type DissolvedIn = z.infer<typeof dissolvedInSchema>;

/** One line as a person enters it, at base scale. */
export const procedureLineInputSchema = z
  .object({
    chemicalId: z.number({ message: 'must be a chemical id' }).int().positive(),
    role: lineRoleSchema,
    /** At base scale; optional only on product lines. */
    quantity: amountSchema('quantity', 'positive').nullable().default(null),
    unit: procedureUnitSchema.nullable().default(null),
    /** ν in the balanced equation, for reagents and products; default 1. */
    coefficient: z
      .number({ message: 'must be a number' })
      .positive('must be more than 0')
      .max(1000)
      .nullable()
      .default(null),
    optional: z.boolean().default(false),
    notes: z.string().max(1000, 'is at most 1000 characters').default(''),
    concentration: lineConcentrationSchema.nullable().default(null),
    /** g/mL of the solution, when it differs from the chemical's recorded density. */
    solutionDensity: z
      .number()
      .positive('must be more than 0 g/mL')
      .max(25)
      .nullable()
      .default(null),
    dissolvedIn: dissolvedInSchema.nullable().default(null),
  })
  .strict()
  .superRefine((line, ctx) => {
    if ((line.quantity === null) !== (line.unit === null)) {
      ctx.addIssue({
        code: 'custom',
        path: [line.quantity === null ? 'quantity' : 'unit'],
        message: 'give the amount together with its unit',
      });
    }
    if (line.quantity === null && line.role !== 'product') {
      ctx.addIssue({
        code: 'custom',
        path: ['quantity'],
        message: 'is required (only a product line may leave it out)',
      });
    }
    if (line.concentration && line.dissolvedIn) {
      ctx.addIssue({
        code: 'custom',
        path: ['dissolvedIn'],
        message: 'give either a concentration or what the solute is dissolved in, not both',
      });
    }
    if (line.dissolvedIn && line.role === 'product') {
      ctx.addIssue({
        code: 'custom',
        path: ['dissolvedIn'],
        message: 'a product line is not dissolved from stock',
      });
    }
  });
export type ProcedureLineInput = z.input<typeof procedureLineInputSchema>;
export type ProcedureLineParsed = z.output<typeof procedureLineInputSchema>;

/** Structured cautions: the web shows them as icons on the plan and the dispensing sheet. */
export const cautionFlagsSchema = z
  .object({
    exothermicAddition: z.boolean().default(false),
    /** Keep the mixture below this temperature, °C. */
    keepBelowC: z.number().min(-100).max(400).nullable().default(null),
    flammableSolvent: z.boolean().default(false),
    toxicGas: z.boolean().default(false),
    fumeHood: z.boolean().default(false),
  })
  .strict();
export type CautionFlags = z.output<typeof cautionFlagsSchema>;
export const noCautionFlags: CautionFlags = {
  exothermicAddition: false,
  keepBelowC: null,
  flammableSolvent: false,
  toxicGas: false,
  fumeHood: false,
};

/** A range in °C, low ≤ high (a melting range). */
export const temperatureRangeSchema = z
  .object({ low: z.number().min(-273.15).max(4000), high: z.number().min(-273.15).max(4000) })
  .strict()
  .refine((range) => range.low <= range.high, {
    message: 'low must not be above high',
    path: ['high'],
  });
export type TemperatureRange = z.infer<typeof temperatureRangeSchema>;

/** The step cautions: the procedure's caution flags a single step can carry. */
export const STEP_CAUTIONS = [
  'exothermicAddition',
  'flammableSolvent',
  'toxicGas',
  'fumeHood',
] as const;
export type StepCaution = (typeof STEP_CAUTIONS)[number];

/**
 * One step of a procedure: what to do, and optionally how long (not scaled with the batch),
 * the temperature window to keep (with what to do outside it), the line whose amount is
 * added in this step (scaled with the plan), a caution and a hold point.
 */
export const procedureStepInputSchema = z
  .object({
    text: z.string().trim().min(1, 'describe the step').max(2000, 'is at most 2000 characters'),
    durationMinutes: z
      .number({ message: 'must be a number of minutes' })
      .gt(0, 'must be more than 0 minutes')
      .max(10080, 'is at most 10080 minutes (a week)')
      .nullable()
      .default(null),
    temperatureLowC: z.number().min(-200).max(1000).nullable().default(null),
    temperatureHighC: z.number().min(-200).max(1000).nullable().default(null),
    /** What to do when a reading falls outside the window, e.g. "slow the addition, add ice". */
    outsideWindow: z.string().trim().max(500, 'is at most 500 characters').default(''),
    /** The procedure line added in this step (its amount scales with the plan). */
    lineIndex: z.number().int().min(0).nullable().default(null),
    /** How it is added, e.g. "dropwise over about 20 min", "in portions". */
    addition: z.string().trim().max(200, 'is at most 200 characters').default(''),
    /** One of the procedure's caution flags this step carries. */
    caution: z.enum(STEP_CAUTIONS).nullable().default(null),
    /** "Do not go on until …"; empty: no hold point. */
    holdPoint: z.string().trim().max(500, 'is at most 500 characters').default(''),
  })
  .strict()
  .superRefine((step, ctx) => {
    if (
      step.temperatureLowC !== null &&
      step.temperatureHighC !== null &&
      step.temperatureLowC > step.temperatureHighC
    ) {
      ctx.addIssue({
        code: 'custom',
        path: ['temperatureHighC'],
        message: 'must not be below the low end of the window',
      });
    }
  });
export type ProcedureStepInput = z.input<typeof procedureStepInputSchema>;
export type ProcedureStep = z.output<typeof procedureStepInputSchema>;

function lineRules(
  procedure: { lines?: ProcedureLineParsed[]; steps?: ProcedureStep[] },
  ctx: { addIssue(issue: { code: 'custom'; path: PropertyKey[]; message: string }): void },
) {
  const lines = procedure.lines ?? [];
  (procedure.steps ?? []).forEach((step, index) => {
    if (procedure.lines && step.lineIndex !== null && step.lineIndex >= lines.length) {
      ctx.addIssue({
        code: 'custom',
        path: ['steps', index, 'lineIndex'],
        message: `points at line ${step.lineIndex + 1}, but the procedure has ${lines.length}`,
      });
    }
  });
  const limiting = lines.filter((line) => line.role === 'limiting-reagent').length;
  if (limiting > 1) {
    ctx.addIssue({
      code: 'custom',
      path: ['lines'],
      message: 'mark at most one line as the limiting reagent (or none: Lotwise detects it)',
    });
  }
}

const procedureFields = {
  title: nameSchema(200),
  /** Literature reference as free text. */
  reference: z.string().trim().max(2000, 'is at most 2000 characters'),
  /** What the base scale is, e.g. "one bench: 2.0 g salicylic acid". */
  baseScale: z.string().trim().max(1000, 'is at most 1000 characters'),
  expectedYieldPercent: z
    .number({ message: 'must be a number' })
    .gt(0, 'must be more than 0 %')
    .max(100, 'cannot be more than 100 %')
    .nullable(),
  /** Literature melting range of the product, °C. */
  literatureMeltingC: temperatureRangeSchema.nullable(),
  cautions: z.string().trim().max(4000, 'is at most 4000 characters'),
  cautionFlags: cautionFlagsSchema,
  lines: z
    .array(procedureLineInputSchema)
    .min(1, 'add at least one line')
    .max(40, 'at most 40 lines'),
  /** In order; `PATCH` with `steps` replaces every step. */
  steps: z.array(procedureStepInputSchema).max(60, 'at most 60 steps'),
};

/** `POST /api/procedures`. */
export const procedureCreateSchema = z
  .object({
    ...procedureFields,
    reference: procedureFields.reference.default(''),
    baseScale: procedureFields.baseScale.default(''),
    expectedYieldPercent: procedureFields.expectedYieldPercent.default(null),
    literatureMeltingC: procedureFields.literatureMeltingC.default(null),
    cautions: procedureFields.cautions.default(''),
    cautionFlags: procedureFields.cautionFlags.default(noCautionFlags),
    steps: procedureFields.steps.default([]),
  })
  .strict()
  .superRefine(lineRules);
export type ProcedureCreate = z.input<typeof procedureCreateSchema>;
export type ProcedureCreateParsed = z.output<typeof procedureCreateSchema>;

/** `PATCH /api/procedures/:id`: `lines`, when given, replaces every line. */
export const procedurePatchSchema = z
  .object(procedureFields)
  .partial()
  .strict()
  .superRefine(lineRules);
export type ProcedurePatch = z.output<typeof procedurePatchSchema>;

/** What a procedure line needs to know about its chemical to be worked out. */
export interface LineChemicalFacts {
  id: number;
  name: string;
  /** g/mol; null when the chemical has no formula. */
  molarMass: number | null;
  /** g/mL; null when unknown. For a solid, of the crystal: never used to measure it. */
  density: number | null;
  /** The purity the procedure's amounts assume (the chemical's default), %. */
  defaultPurityPercent: number;
  /** "solid": a volume of it goes through `bulkDensity`. Left out: read as not a solid. */
  physicalState?: PhysicalState;
  /** g/mL of the poured solid; null or left out when unknown. */
  bulkDensity?: number | null;
}

/** A line while it is being typed: everything but the role may still be missing. */
export interface ProcedureLineDraft {
  chemicalId?: number | null;
  role: LineRole;
  quantity?: number | null;
  unit?: string | null;
  coefficient?: number | null;
  concentration?: LineConcentration | null;
  solutionDensity?: number | null;
}

type FactsLookup =
  ReadonlyMap<number, LineChemicalFacts> | ((id: number) => LineChemicalFacts | undefined);

function lookup(facts: FactsLookup, id: number | null | undefined) {
  if (id === null || id === undefined) return undefined;
  return typeof facts === 'function' ? facts(id) : facts.get(id);
}

/**
 * Turns procedure lines (as entered, or as stored) and their chemicals' properties into the
 * lines @lotwise/chem `computeStoichiometry` works on. The server and the procedure form
 * both call this, so the live preview and the saved procedure show the same numbers.
 *
 * - the quantity is multiplied by `factor` (default 1);
 * - a neat line carries its chemical's default purity (a 37 % acid counts 37 % of its mass);
 * - a solution line (`concentration`) carries the solution's density (`solutionDensity`, or
 *   the chemical's) and no purity;
 * - a solid carries its bulk (poured) density, never its crystal density: a volume of a solid
 *   without one cannot be weighed out (@lotwise/chem `measuringDensity`);
 * - a line without a chemical yet is named "line N" and has no molar mass.
 */
export function procedureLinesFor(
  lines: readonly ProcedureLineDraft[],
  facts: FactsLookup,
  factor = 1,
): ProcedureLine[] {
  return lines.map((line) => {
    const chemical = lookup(facts, line.chemicalId);
    const result: ProcedureLine = { role: line.role };
    if (chemical) result.name = chemical.name;
    if (line.quantity !== null && line.quantity !== undefined && line.unit) {
      result.quantity = { value: line.quantity * factor, unit: line.unit };
    }
    if (line.coefficient !== null && line.coefficient !== undefined) {
      result.coefficient = line.coefficient;
    }
    if (chemical?.molarMass !== null && chemical?.molarMass !== undefined) {
      result.molarMass = chemical.molarMass;
    }
    if (line.concentration) {
      result.concentration = line.concentration;
      const density = line.solutionDensity ?? chemical?.density ?? null;
      if (density !== null) result.density = density;
    } else {
      if (chemical?.physicalState === 'solid') result.solid = true;
      const density = chemical ? measuringDensity(chemical) : null;
      if (density !== null) result.density = density;
      if (chemical && chemical.defaultPurityPercent !== 100) {
        result.purityPercent = chemical.defaultPurityPercent;
      }
    }
    return result;
  });
}

/** {@link procedureLinesFor} then `computeStoichiometry` (throws `ChemError` on bad input). */
export function procedureStoichiometry(
  lines: readonly ProcedureLineDraft[],
  facts: FactsLookup,
  factor = 1,
): StoichiometryResult {
  return computeStoichiometry(procedureLinesFor(lines, facts, factor));
}

/** {@link procedureStoichiometry} as a `Result`, for a form that is still being typed. */
export function tryProcedureStoichiometry(
  lines: readonly ProcedureLineDraft[],
  facts: FactsLookup,
  factor = 1,
): Result<StoichiometryResult> {
  return tryComputeStoichiometry(procedureLinesFor(lines, facts, factor));
}

/** The display rounding rules, for the page to state. */
export const roundingRules = {
  balance: BALANCE_RULE,
  glassware: GLASSWARE_RULE,
  amount: AMOUNT_RULE,
} as const;

export const chemWarningSchema = z.object({
  code: z.enum(CHEM_WARNING_CODES),
  message: z.string(),
  lineIndex: z.number().int().optional(),
});

/** The result of @lotwise/chem `computeStoichiometry`, as the API sends it. */
export const stoichiometrySchema = z.object({
  lines: z.array(
    z.object({
      index: z.number().int(),
      name: z.string().optional(),
      role: lineRoleSchema,
      coefficient: z.number(),
      massG: z.number().optional(),
      volumeMl: z.number().optional(),
      amountMol: z.number().optional(),
      equivalents: z.number().optional(),
      theoretical: z
        .object({
          amountMol: z.number(),
          massG: z.number().optional(),
          volumeMl: z.number().optional(),
        })
        .optional(),
      percentYield: z.number().optional(),
    }),
  ),
  limitingIndex: z.number().int().nullable(),
  detectedLimitingIndex: z.number().int().nullable(),
  warnings: z.array(chemWarningSchema),
});
export type Stoichiometry = z.infer<typeof stoichiometrySchema>;

/** A value rounded for the bench (see @lotwise/chem `DisplayValue`). */
export const displayValueSchema = z.object({
  value: z.number(),
  unit: z.string(),
  text: z.string(),
  decimals: z.number().int(),
  rule: z.string(),
});

/** The chemical as a procedure line shows it. */
export const lineChemicalSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  formula: z.string().nullable(),
  molarMass: z.number().nullable(),
  density: z.number().nullable(),
  defaultPurityPercent: z.number(),
  /** Always sent by the server: a solid is measured by volume through `bulkDensity`. */
  physicalState: physicalStateSchema.optional(),
  bulkDensity: z.number().nullable().optional(),
  stockUnit: stockUnitSchema,
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.string()),
});
export type LineChemical = z.infer<typeof lineChemicalSchema>;

export const procedureLineSchema = z.object({
  index: z.number().int(),
  chemicalId: z.number().int(),
  chemical: lineChemicalSchema,
  role: lineRoleSchema,
  quantity: z.number().nullable(),
  unit: z.string().nullable(),
  coefficient: z.number().nullable(),
  optional: z.boolean(),
  notes: z.string(),
  concentration: lineConcentrationSchema.nullable(),
  solutionDensity: z.number().nullable(),
  dissolvedIn: z
    .object({
      chemicalId: z.number().int(),
      chemicalName: z.string(),
      quantity: z.number(),
      unit: z.string(),
    })
    .nullable(),
});
export type ProcedureLineView = z.infer<typeof procedureLineSchema>;

/** A calculation that could not be done, with @lotwise/chem's code and message. */
export const calculationErrorSchema = z.object({
  code: z.string(),
  message: z.string(),
  lineIndex: z.number().int().optional(),
});

/** A step as the API sends it (`index` from 0, in order). */
export const procedureStepSchema = z.object({
  index: z.number().int(),
  text: z.string(),
  durationMinutes: z.number().nullable(),
  temperatureLowC: z.number().nullable(),
  temperatureHighC: z.number().nullable(),
  outsideWindow: z.string(),
  lineIndex: z.number().int().nullable(),
  addition: z.string(),
  caution: z.enum(STEP_CAUTIONS).nullable(),
  holdPoint: z.string(),
});
export type ProcedureStepView = z.infer<typeof procedureStepSchema>;

export const procedureSchema = z.object({
  id: z.number().int(),
  title: z.string(),
  reference: z.string(),
  baseScale: z.string(),
  expectedYieldPercent: z.number().nullable(),
  literatureMeltingC: z.object({ low: z.number(), high: z.number() }).nullable(),
  cautions: z.string(),
  cautionFlags: z.object({
    exothermicAddition: z.boolean(),
    keepBelowC: z.number().nullable(),
    flammableSolvent: z.boolean(),
    toxicGas: z.boolean(),
    fumeHood: z.boolean(),
  }),
  lines: z.array(procedureLineSchema),
  steps: z.array(procedureStepSchema),
  /** computeStoichiometry at base scale; null when the lines cannot be worked out. */
  stoichiometry: stoichiometrySchema.nullable(),
  stoichiometryError: calculationErrorSchema.nullable(),
  /** Chemicals this procedure makes (its product lines). */
  productChemicalIds: z.array(z.number().int()),
  runCount: z.number().int(),
  createdBy: z.object({ id: z.number().int(), displayName: z.string() }).nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Procedure = z.infer<typeof procedureSchema>;

export const procedureSortFields = ['title', 'updatedAt'] as const;
/** `GET /api/procedures`: `q` matches the title; `chemicalId` lists procedures using or making it. */
export const procedureListQuerySchema = listQuerySchema(procedureSortFields, 'title.asc').extend({
  chemicalId: z.coerce.number().int().positive().optional(),
  producesChemicalId: z.coerce.number().int().positive().optional(),
});
export type ProcedureListQuery = z.infer<typeof procedureListQuerySchema>;

/** A factor as a number or a fraction typed by a person: "2", "0.5", "1/6". */
export const scaleFactorInputSchema = z.union([z.number(), z.string()]).transform((value, ctx) => {
  let parsed: number;
  try {
    parsed = typeof value === 'number' ? checkScaleFactor(value) : parseScaleFactor(value);
  } catch {
    parsed = Number.NaN;
  }
  if (!Number.isFinite(parsed) || parsed > 1000) {
    ctx.addIssue({
      code: 'custom',
      message: 'must be a scale factor above 0 (at most 1000) such as 2, 0.5 or 1/6',
    });
    return z.NEVER;
  }
  return parsed;
});

/**
 * `GET /api/procedures/:id/scaled`: one of `factor` ("1/6", 0.5, 2), `targetLimitingMass`
 * (the limiting reagent reaches this amount) or `targetProductMass` (the product's
 * theoretical yield, or with `basis=expected` the expected yield, reaches it), with `unit`
 * (default g; any mass, volume or amount unit).
 */
export const scaledQuerySchema = z
  .object({
    factor: scaleFactorInputSchema.optional(),
    targetLimitingMass: coercedAmountSchema('target mass', 'positive').optional(),
    targetProductMass: coercedAmountSchema('target mass', 'positive').optional(),
    unit: procedureUnitSchema.optional().default('g'),
    basis: z.enum(['theoretical', 'expected']).optional().default('theoretical'),
  })
  .superRefine((query, ctx) => {
    const given = [query.factor, query.targetLimitingMass, query.targetProductMass].filter(
      (value) => value !== undefined,
    ).length;
    if (given !== 1) {
      ctx.addIssue({
        code: 'custom',
        path: ['factor'],
        message: 'give exactly one of factor, targetLimitingMass or targetProductMass',
      });
    }
  });
export type ScaledQuery = z.output<typeof scaledQuerySchema>;

export const scaledLineSchema = z.object({
  index: z.number().int(),
  chemicalId: z.number().int(),
  name: z.string(),
  role: lineRoleSchema,
  optional: z.boolean(),
  notes: z.string(),
  /** Scaled at full precision, in the line's own unit; null on a product line without one. */
  quantity: z.object({ value: z.number(), unit: z.string() }).nullable(),
  originalQuantity: z.object({ value: z.number(), unit: z.string() }).nullable(),
  /** The scaled quantity rounded for the balance, glassware or amount rule. */
  display: displayValueSchema.nullable(),
  /** Full precision, as far as the data allow. */
  massG: z.number().nullable(),
  volumeMl: z.number().nullable(),
  amountMol: z.number().nullable(),
  massDisplay: displayValueSchema.nullable(),
  volumeDisplay: displayValueSchema.nullable(),
  equivalents: z.number().nullable(),
  /** Solvent to dissolve a solute line in, scaled. */
  dissolvedIn: z
    .object({
      chemicalId: z.number().int(),
      chemicalName: z.string(),
      quantity: z.number(),
      unit: z.string(),
      display: displayValueSchema,
    })
    .nullable(),
});
export type ScaledLine = z.infer<typeof scaledLineSchema>;

export const theoreticalYieldSchema = z.object({
  lineIndex: z.number().int(),
  chemicalId: z.number().int(),
  name: z.string(),
  amountMol: z.number(),
  /** Grams (for a solution product, grams of solution). */
  massG: z.number().nullable(),
  volumeMl: z.number().nullable(),
  display: displayValueSchema.nullable(),
  /** massG × expected yield %, when the procedure states one. */
  expectedMassG: z.number().nullable(),
});
export type TheoreticalYieldView = z.infer<typeof theoreticalYieldSchema>;

export const scaledProcedureSchema = z.object({
  procedureId: z.number().int(),
  title: z.string(),
  factor: z.number(),
  /** How the factor was chosen. */
  basis: z.enum(['factor', 'limiting-reagent', 'product']),
  /**
   * With `basis` product: the yield the target was reached at — `expected` (the procedure's
   * expected yield) or `theoretical`; null for the other bases.
   */
  yieldBasis: z.enum(['theoretical', 'expected']).nullable(),
  /** What a person must know about how the factor was found, e.g. a fallback to theory. */
  notice: z.string().nullable(),
  lines: z.array(scaledLineSchema),
  stoichiometry: stoichiometrySchema,
  /** The first product line's theoretical yield at this scale, in grams; null without one. */
  theoreticalYield: theoreticalYieldSchema.nullable(),
  rules: z.object({ balance: z.string(), glassware: z.string(), amount: z.string() }),
});
export type ScaledProcedure = z.infer<typeof scaledProcedureSchema>;
