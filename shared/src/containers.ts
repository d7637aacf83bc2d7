import { tryParseUnit } from '@lotwise/chem';
import { z } from 'zod';
import { amountSchema, quantityUnitSchema } from './amounts';
import { physicalStateSchema, stockUnitSchema } from './chemicals';
import { isoDateSchema } from './dates';
import { containerMaterialSchema } from './flammability';
import { ghsCodeSchema, peroxideClassSchema, storageGroupSchema } from './hazards';
import { confirmFieldSchema, containerHoldSchema } from './confirmations';
import { ghsFlammableCategorySchema, liquidClassSchema } from './flammability';
import { labelCodeToLookUp } from './label-codes';
import { ledgerEntrySchema } from './ledger';
import { listQuerySchema, queryFlagSchema } from './list';
import { lotSourceSchema } from './lots';
import { segregationWarningSchema } from './segregation';
import { storedFileSchema } from './uploads';

// The label-code rules live on their own, so that a page can read a scanned code without
// loading the container schemas.
export * from './label-codes';

export const containerStatuses = ['sealed', 'open', 'empty', 'disposed'] as const;
export const containerStatusSchema = z.enum(containerStatuses, {
  message: `must be one of: ${containerStatuses.join(', ')}`,
});
export type ContainerStatus = (typeof containerStatuses)[number];

const positive = (what: string) => amountSchema(what, 'positive');
const nonNegative = (what: string) => amountSchema(what, 'nonNegative');

const noteSchema = z.string().trim().max(1000, 'is at most 1000 characters');

/**
 * Put a new container of a lot on a shelf: writes a `received` ledger entry of `quantity`.
 * `quantity` may be in any mass or volume unit; it is stored in the chemical's stock unit
 * (converted through the density when needed). The label code is generated.
 */
export const containerCreateSchema = z
  .object({
    lotId: z.number({ message: 'must be a lot id' }).int().positive(),
    locationId: z.number({ message: 'must be a location id' }).int().positive(),
    quantity: nonNegative('quantity'),
    unit: quantityUnitSchema,
    /** Empty container with cap, in g, for weighing by difference. */
    tareMass: nonNegative('tare mass').nullable().default(null),
    capacity: positive('capacity').nullable().default(null),
    capacityUnit: quantityUnitSchema.nullable().default(null),
    /** What it is made of (for the container-size limits); null: not said. */
    material: containerMaterialSchema.nullable().default(null),
    status: z.enum(['sealed', 'open'], { message: 'must be sealed or open' }).default('sealed'),
    openedOn: isoDateSchema.nullable().default(null),
    notes: z.string().max(2000, 'is at most 2000 characters').default(''),
    /** Store it even where it breaks a storage rule (answered 409 `confirmation_required` otherwise). */
    confirm: confirmFieldSchema,
  })
  .strict()
  .refine((c) => c.capacity === null || c.capacityUnit !== null, {
    message: 'is required with a capacity',
    path: ['capacityUnit'],
  });
export type ContainerCreate = z.input<typeof containerCreateSchema>;
export type ContainerCreateParsed = z.output<typeof containerCreateSchema>;

/** Details of a container that are not its quantity or place (those go through the ledger). */
export const containerPatchSchema = z
  .object({
    tareMass: nonNegative('tare mass').nullable(),
    capacity: positive('capacity').nullable(),
    capacityUnit: quantityUnitSchema.nullable(),
    material: containerMaterialSchema.nullable(),
    openedOn: isoDateSchema.nullable(),
    notes: z.string().max(2000, 'is at most 2000 characters'),
  })
  .partial()
  .strict();
export type ContainerPatch = z.infer<typeof containerPatchSchema>;

/**
 * `POST /api/containers/:id/draws`: either `amount` taken (any mass or volume unit; a volume
 * of a mass-counted chemical, or the other way round, goes through the density) or the
 * container's `grossMass` now (a mass unit; drawn = last balance − (gross − tare)).
 */
export const drawSchema = z
  .object({
    amount: positive('amount').optional(),
    grossMass: nonNegative('gross mass').optional(),
    unit: quantityUnitSchema,
    note: noteSchema.default(''),
    /** The drawn amount goes into this waste container (recorded with the draw). */
    toWasteContainerId: z.number().int().positive().optional(),
    /**
     * Draw even when it takes from what is held for a plan, or the chemical conflicts with what
     * the waste container holds (409 `confirmation_required` otherwise).
     */
    confirm: confirmFieldSchema,
  })
  .strict()
  .superRefine((draw, ctx) => {
    if ((draw.amount === undefined) === (draw.grossMass === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: ['amount'],
        message: 'give either amount (what you took) or grossMass (what the container weighs now)',
      });
    }
    if (draw.grossMass !== undefined) {
      const unit = tryParseUnit(draw.unit);
      if (unit.ok && unit.value.dimension !== 'mass') {
        ctx.addIssue({
          code: 'custom',
          path: ['unit'],
          message: 'a gross mass is weighed: use g, mg or kg',
        });
      }
    }
  });
export type Draw = z.input<typeof drawSchema>;
export type DrawParsed = z.output<typeof drawSchema>;

/**
 * `POST /api/containers/:id/adjustments`: either the amount counted now or a signed
 * correction, with the reason in `note`. Writes an `adjusted` entry.
 */
export const adjustmentSchema = z
  .object({
    countedQuantity: nonNegative('counted quantity').optional(),
    correction: amountSchema('correction', 'signed').optional(),
    unit: quantityUnitSchema,
    note: noteSchema.min(1, 'say why the amount is corrected'),
  })
  .strict()
  .refine((a) => (a.countedQuantity === undefined) !== (a.correction === undefined), {
    path: ['countedQuantity'],
    message: 'give either countedQuantity (what is there now) or correction (a signed change)',
  });
export type Adjustment = z.input<typeof adjustmentSchema>;

/** `POST /api/containers/:id/splits`: pour part into a new labelled container. */
export const splitSchema = z
  .object({
    quantity: positive('quantity'),
    unit: quantityUnitSchema,
    locationId: z.number({ message: 'must be a location id' }).int().positive(),
    tareMass: nonNegative('tare mass').nullable().default(null),
    capacity: positive('capacity').nullable().default(null),
    capacityUnit: quantityUnitSchema.nullable().default(null),
    material: containerMaterialSchema.nullable().default(null),
    note: noteSchema.default(''),
    /** Place the new container even where it breaks a storage rule. */
    confirm: confirmFieldSchema,
  })
  .strict();
export type Split = z.input<typeof splitSchema>;

/** `POST /api/containers/:id/transfers`: move to another place. */
export const transferSchema = z
  .object({
    locationId: z.number({ message: 'must be a location id' }).int().positive(),
    note: noteSchema.default(''),
    /** Move it even where it breaks a storage rule. */
    confirm: confirmFieldSchema,
  })
  .strict();
export type Transfer = z.input<typeof transferSchema>;

/** `POST /api/containers/:id/disposal`: what is left goes out; the container is disposed. */
export const disposalSchema = z.object({ note: noteSchema.default('') }).strict();
export type Disposal = z.input<typeof disposalSchema>;

/** The chemical as a container shows it: identity and hazards. */
export const containerChemicalSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  formula: z.string().nullable(),
  casNumber: z.string().nullable(),
  density: z.number().nullable(),
  /** Always sent by the server: a solid crosses mass and volume only through `bulkDensity`. */
  physicalState: physicalStateSchema.optional(),
  bulkDensity: z.number().nullable().optional(),
  storageGroup: storageGroupSchema,
  extraHazardGroups: z.array(storageGroupSchema),
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.string()),
  peroxideClass: peroxideClassSchema.nullable(),
  stockUnit: stockUnitSchema,
  /** NFPA 30 class and GHS flammable category of the chemical (see `chemicalSchema`). */
  liquidClass: liquidClassSchema.nullable().optional(),
  ghsFlammableCategory: ghsFlammableCategorySchema.nullable().optional(),
});

export const containerSchema = z.object({
  id: z.number().int(),
  labelCode: z.string(),
  status: containerStatusSchema,
  /** The balance: the sum of the container's ledger entries. */
  quantity: z.number(),
  unit: stockUnitSchema,
  tareMass: z.number().nullable(),
  capacity: z.number().nullable(),
  capacityUnit: z.string().nullable(),
  material: containerMaterialSchema.nullable(),
  openedOn: z.string().nullable(),
  /** The lot's expiry date. */
  expiresOn: z.string().nullable(),
  expired: z.boolean(),
  /** Peroxide formers: test-or-discard date by class (see @lotwise/chem `peroxideTestDue`). */
  peroxide: z
    .object({
      dueOn: z.string(),
      basis: z.enum(['opened', 'unopened', 'expiry']),
      rule: z.string(),
      overdue: z.boolean(),
    })
    .nullable(),
  notes: z.string(),
  chemical: containerChemicalSchema,
  lot: z.object({
    id: z.number().int(),
    source: lotSourceSchema,
    supplierName: z.string().nullable(),
    supplierLotNumber: z.string().nullable(),
    grade: z.string().nullable(),
    purityPercent: z.number(),
    receivedOn: z.string(),
    expiresOn: z.string().nullable(),
  }),
  location: z.object({ id: z.number().int(), name: z.string(), path: z.string() }),
  /**
   * The member it belongs to (their portion of a shared order); null: the lab's. Always sent
   * by the server.
   */
  owner: z.object({ id: z.number().int(), displayName: z.string() }).nullable().optional(),
  /** What plans hold of it now (reservations in force), oldest first. */
  holds: z.array(containerHoldSchema),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Container = z.infer<typeof containerSchema>;

/** `GET /api/containers/:id`: the container with segregation warnings for its place. */
export const containerDetailSchema = containerSchema.extend({
  warnings: z.array(segregationWarningSchema),
  /**
   * The chemical's current SDS (PDF, downloaded from `GET /api/chemicals/:id/sds`), shown beside
   * the hazards; null when none was uploaded. Always sent by the server.
   */
  sds: storedFileSchema.nullable().optional(),
});
export type ContainerDetail = z.infer<typeof containerDetailSchema>;

/**
 * What every container write answers: the saved container, the ledger entries written,
 * segregation warnings for where it now is, and for a split the new container.
 */
export const containerChangeSchema = z.object({
  container: containerDetailSchema,
  entries: z.array(ledgerEntrySchema),
  warnings: z.array(segregationWarningSchema),
  newContainer: containerDetailSchema.optional(),
});
export type ContainerChange = z.infer<typeof containerChangeSchema>;

export const containerSortFields = [
  'labelCode',
  'chemical',
  'quantity',
  'expiresOn',
  'location',
  'updatedAt',
] as const;

/**
 * `GET /api/containers`. `q` matches a label code, or the chemical's name, synonyms, CAS RN
 * or formula. `locationId` includes every place below it. `belowReorderPoint`: the
 * chemical's usable total is at or below its reorder point. `peroxideDue`: test-or-discard
 * date within `peroxideDueWithinDays` (default 30) or past.
 */
export const containerListQuerySchema = listQuerySchema(
  containerSortFields,
  'labelCode.asc',
).extend({
  locationId: z.coerce.number().int().positive().optional(),
  chemicalId: z.coerce.number().int().positive().optional(),
  lotId: z.coerce.number().int().positive().optional(),
  status: containerStatusSchema.optional(),
  storageGroup: storageGroupSchema.optional(),
  expiringWithinDays: z.coerce.number().int().min(0).max(3650).optional(),
  expired: queryFlagSchema.optional(),
  belowReorderPoint: queryFlagSchema.optional(),
  peroxideDue: queryFlagSchema.optional(),
  peroxideDueWithinDays: z.coerce.number().int().min(0).max(3650).optional().default(30),
  /** `waste`: the waste containers (open and full) instead, as `wasteContainerSchema` items. */
  kind: z.enum(['stock', 'waste'], { message: 'must be stock or waste' }).default('stock'),
});
export type ContainerListQuery = z.infer<typeof containerListQuerySchema>;

/** Path params of `GET /api/containers/by-label/:labelCode`. */
export const labelCodeParamsSchema = z.object({
  labelCode: z.string().refine((text) => labelCodeToLookUp(text) !== null, {
    message: 'must be a label code such as LW-00042 (or a code of up to 20 letters and digits)',
  }),
});
