import { z } from 'zod';
import { amountSchema } from './amounts';
import { tryMolarMass, validateCasNumber } from '@lotwise/chem';
import {
  ghsCodeSchema,
  hazardStatementSchema,
  peroxideClassSchema,
  storageGroupSchema,
} from './hazards';
import { figureSourceSchema, fireDataProblem, temperatureCSchema } from './fire-data';
import { ghsFlammableCategorySchema, liquidClassSchema } from './flammability';
import { listQuerySchema } from './list';
import { nameSchema } from './names';
import { storedFileSchema } from './uploads';

export const physicalStates = ['solid', 'liquid', 'gas', 'solution'] as const;
export const physicalStateSchema = z.enum(physicalStates, {
  message: `must be one of: ${physicalStates.join(', ')}`,
});
export type PhysicalState = (typeof physicalStates)[number];

/** Units a chemical's stock and reorder point are counted in. */
export const stockUnits = ['g', 'mL'] as const;
export const stockUnitSchema = z.enum(stockUnits, { message: 'must be g or mL' });
export type StockUnit = (typeof stockUnits)[number];

const casNumberSchema = z
  .string()
  .trim()
  .superRefine((value, ctx) => {
    const check = validateCasNumber(value);
    if (!check.valid) ctx.addIssue({ code: 'custom', message: check.reason });
  });

const formulaSchema = z
  .string()
  .trim()
  .min(1, 'is required when given; leave it out if the formula is unknown')
  .max(120)
  .superRefine((value, ctx) => {
    const result = tryMolarMass(value);
    if (!result.ok) ctx.addIssue({ code: 'custom', message: result.error.message });
  });

const nonNegative = (what: string) => amountSchema(what, 'nonNegative');

function uniqueList<T extends z.ZodType>(item: T, what: string) {
  return z
    .array(item)
    .max(30)
    .refine((list) => new Set(list).size === list.length, `lists a ${what} twice`);
}

/** The fields a person edits on a chemical, without defaults (a patch never fills them). */
const chemicalFields = {
  name: nameSchema(200),
  synonyms: uniqueList(nameSchema(200), 'synonym'),
  casNumber: casNumberSchema.nullable(),
  formula: formulaSchema.nullable(),
  physicalState: physicalStateSchema,
  /** g/mL at 20 °C (for a solid, of the crystal). */
  density: z.number().positive('must be greater than 0 g/mL').max(25).nullable(),
  /**
   * g/mL of a poured solid, air included: what a volume of a solid is weighed with (10 mL of
   * table salt is about 12 g, not the 21.65 g its crystal density gives).
   */
  bulkDensity: z.number().positive('must be greater than 0 g/mL').max(25).nullable(),
  /** Purity a new lot gets unless its certificate says otherwise, in %. */
  defaultPurityPercent: z
    .number()
    .gt(0, 'must be more than 0 %')
    .max(100, 'cannot be more than 100 %'),
  ghsPictograms: uniqueList(ghsCodeSchema, 'pictogram'),
  hazardStatements: uniqueList(hazardStatementSchema, 'hazard statement'),
  storageGroup: storageGroupSchema,
  peroxideClass: peroxideClassSchema.nullable(),
  stockUnit: stockUnitSchema,
  reorderPoint: nonNegative('reorder point').nullable(),
  reorderQuantity: nonNegative('reorder quantity').nullable(),
  /** Orders of a restricted chemical need a manager's approval. */
  restricted: z.boolean(),
  notes: z.string().max(4000, 'is at most 4000 characters'),
  /** °C (closed cup where the source says); what the liquid class is worked out from. */
  flashPointC: temperatureCSchema.nullable(),
  /** °C at normal pressure (the initial boiling point of a mixture). */
  boilingPointC: temperatureCSchema.nullable(),
  /** Where the flash point came from: "NIOSH Pocket Guide", "SDS of lot 2291", "from memory". */
  flashPointSource: figureSourceSchema,
  boilingPointSource: figureSourceSchema,
};

/** A flash point at or above the boiling point is a field error on the flash point. */
function checkFireData(
  value: { flashPointC?: number | null; boilingPointC?: number | null },
  ctx: z.RefinementCtx,
) {
  const problem = fireDataProblem(value.flashPointC, value.boilingPointC);
  if (problem) ctx.addIssue({ code: 'custom', path: ['flashPointC'], message: problem });
}

/**
 * Create a chemical. `molarMass` is never sent: the server computes it from `formula`
 * with packages/chem.
 */
const chemicalCreateObject = z
  .object({
    ...chemicalFields,
    synonyms: chemicalFields.synonyms.default([]),
    casNumber: chemicalFields.casNumber.default(null),
    formula: chemicalFields.formula.default(null),
    density: chemicalFields.density.default(null),
    bulkDensity: chemicalFields.bulkDensity.default(null),
    defaultPurityPercent: chemicalFields.defaultPurityPercent.default(100),
    ghsPictograms: chemicalFields.ghsPictograms.default([]),
    hazardStatements: chemicalFields.hazardStatements.default([]),
    storageGroup: chemicalFields.storageGroup.default('low-hazard'),
    peroxideClass: chemicalFields.peroxideClass.default(null),
    stockUnit: chemicalFields.stockUnit.default('g'),
    reorderPoint: chemicalFields.reorderPoint.default(null),
    reorderQuantity: chemicalFields.reorderQuantity.default(null),
    restricted: chemicalFields.restricted.default(false),
    notes: chemicalFields.notes.default(''),
    flashPointC: chemicalFields.flashPointC.default(null),
    boilingPointC: chemicalFields.boilingPointC.default(null),
    flashPointSource: chemicalFields.flashPointSource.default(''),
    boilingPointSource: chemicalFields.boilingPointSource.default(''),
  })
  .strict();
export const chemicalCreateSchema = chemicalCreateObject.superRefine(checkFireData);
/** What a client sends (defaults optional). */
export type ChemicalCreate = z.input<typeof chemicalCreateSchema>;
/** What the server works with after parsing (defaults filled). */
export type ChemicalCreateParsed = z.output<typeof chemicalCreateSchema>;

/** Change some fields of a chemical; absent fields stay as they are. */
const chemicalPatchObject = z.object(chemicalFields).partial().strict();
/**
 * Flash point against boiling point is checked here when a patch gives both; the server checks
 * a patch of one against the stored other.
 */
export const chemicalPatchSchema = chemicalPatchObject.superRefine(checkFireData);
export type ChemicalPatch = z.infer<typeof chemicalPatchSchema>;

export const chemicalSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  synonyms: z.array(z.string()),
  casNumber: z.string().nullable(),
  formula: z.string().nullable(),
  /** g/mol, computed from the formula; null when there is no formula. */
  molarMass: z.number().nullable(),
  physicalState: physicalStateSchema,
  density: z.number().nullable(),
  /** g/mL of the poured solid; a volume of a solid is converted with this, never `density`. */
  bulkDensity: z.number().nullable(),
  defaultPurityPercent: z.number(),
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.string()),
  storageGroup: storageGroupSchema,
  peroxideClass: peroxideClassSchema.nullable(),
  /**
   * Groups whose incompatibilities the chemical carries besides its storage group (sodium
   * nitrite: an oxidizer that also releases toxic gas with acids). Always sent by the server.
   */
  extraHazardGroups: z.array(storageGroupSchema).optional(),
  stockUnit: stockUnitSchema,
  reorderPoint: z.number().nullable(),
  reorderQuantity: z.number().nullable(),
  restricted: z.boolean(),
  notes: z.string(),
  /** °C; null when not recorded. Always sent by the server (as are the three below). */
  flashPointC: z.number().nullable().optional(),
  boilingPointC: z.number().nullable().optional(),
  flashPointSource: z.string().optional(),
  boilingPointSource: z.string().optional(),
  /**
   * Worked out by the server from the figures with @lotwise/chem (NFPA 30 class, GHS
   * flammable-liquid category); null for solids and gases and when the figures do not tell.
   * Always sent by the server.
   */
  liquidClass: liquidClassSchema.nullable().optional(),
  ghsFlammableCategory: ghsFlammableCategorySchema.nullable().optional(),
  /**
   * The current safety data sheet (PDF), downloaded from `GET /api/chemicals/:id/sds`; null
   * when none was uploaded. Always sent by the server.
   */
  sds: storedFileSchema.nullable().optional(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Chemical = z.infer<typeof chemicalSchema>;

export const chemicalSortFields = [
  'name',
  'casNumber',
  'formula',
  'molarMass',
  'storageGroup',
  'updatedAt',
] as const;

export const chemicalListQuerySchema = listQuerySchema(chemicalSortFields, 'name.asc').extend({
  storageGroup: storageGroupSchema.optional(),
  physicalState: physicalStateSchema.optional(),
  pictogram: ghsCodeSchema.optional(),
});
export type ChemicalListQuery = z.infer<typeof chemicalListQuerySchema>;

/** Extra incompatibilities of a chemical; see `chemicalSchema.extraHazardGroups`. */
export const extraHazardGroupsSchema = z
  .array(storageGroupSchema)
  .max(8)
  .refine((list) => new Set(list).size === list.length, 'lists a storage group twice');

/** What `POST /api/chemicals` accepts: {@link chemicalCreateSchema} plus `extraHazardGroups`. */
export const chemicalCreateBodySchema = chemicalCreateObject
  .extend({ extraHazardGroups: extraHazardGroupsSchema.optional() })
  .superRefine(checkFireData);
export type ChemicalCreateBody = z.input<typeof chemicalCreateBodySchema>;

/** What `PATCH /api/chemicals/:id` accepts: {@link chemicalPatchSchema} plus `extraHazardGroups`. */
export const chemicalPatchBodySchema = chemicalPatchObject
  .extend({ extraHazardGroups: extraHazardGroupsSchema.optional() })
  .superRefine(checkFireData);
export type ChemicalPatchBody = z.infer<typeof chemicalPatchBodySchema>;
