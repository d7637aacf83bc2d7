import { z } from 'zod';
import { amountSchema } from './amounts';
import { emailSchema } from './auth';
import { ghsCodeSchema } from './hazards';
import { listQuerySchema, pageSchema, queryFlagSchema } from './list';
import { currencyCodeSchema, minorAmountSchema } from './money';
import { nameSchema, refuseControlCharacters } from './names';
import { packUnits } from './purchasing';

/**
 * Suppliers the lab buys from and the packs they sell (the catalogue). Every amount is whole
 * minor units (cents) of the lab's one currency; the server names that currency in each answer.
 */

export const packUnitSchema = z.enum(packUnits, {
  message: `must be one of: ${packUnits.join(', ')}`,
});

const optionalText = (max: number) =>
  refuseControlCharacters(z.string().trim().max(max, `is at most ${max} characters`));

const supplierFields = {
  name: nameSchema(200),
  contactName: optionalText(200),
  /** Where orders go; empty when the supplier takes orders another way. */
  email: z.union([z.literal(''), emailSchema]),
  phone: optionalText(60),
  website: optionalText(300),
  /** How to order: account number, order form, cut-off days, delivery quirks. */
  orderingNotes: z.string().max(4000, 'is at most 4000 characters'),
  /** Smallest order the supplier accepts, goods only, before fees; 0 for none. */
  minimumOrderMinor: minorAmountSchema,
  /** Charged once per order. */
  shippingFeeMinor: minorAmountSchema,
  /** Charged once per order that holds any hazardous-goods item. */
  hazardousFeeMinor: minorAmountSchema,
};

export const supplierCreateSchema = z
  .object({
    ...supplierFields,
    contactName: supplierFields.contactName.default(''),
    email: supplierFields.email.default(''),
    phone: supplierFields.phone.default(''),
    website: supplierFields.website.default(''),
    orderingNotes: supplierFields.orderingNotes.default(''),
    minimumOrderMinor: supplierFields.minimumOrderMinor.default(0),
    shippingFeeMinor: supplierFields.shippingFeeMinor.default(0),
    hazardousFeeMinor: supplierFields.hazardousFeeMinor.default(0),
  })
  .strict();
export type SupplierCreate = z.input<typeof supplierCreateSchema>;
export type SupplierCreateParsed = z.output<typeof supplierCreateSchema>;

/**
 * Change a supplier; `archived: true` takes it out of new orders and suggestions while the
 * orders that name it keep it (a supplier named by orders cannot be deleted).
 */
export const supplierPatchSchema = z
  .object({ ...supplierFields, archived: z.boolean() })
  .partial()
  .strict();
export type SupplierPatch = z.infer<typeof supplierPatchSchema>;

export const supplierSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  contactName: z.string(),
  email: z.string(),
  phone: z.string(),
  website: z.string(),
  orderingNotes: z.string(),
  minimumOrderMinor: z.number().int(),
  shippingFeeMinor: z.number().int(),
  hazardousFeeMinor: z.number().int(),
  /** The lab's currency, which every amount of the supplier is in. */
  currency: z.string(),
  archived: z.boolean(),
  /** Catalogue items still sold (not discontinued). */
  catalogItemCount: z.number().int(),
  /** Orders that name the supplier, of any status. */
  orderCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Supplier = z.infer<typeof supplierSchema>;

/**
 * `GET /api/suppliers`: a list page, plus the lab's currency, so a client can read and write
 * amounts even before there is any supplier.
 */
export const supplierPageSchema = pageSchema(supplierSchema).extend({ currency: z.string() });
export type SupplierPage = z.infer<typeof supplierPageSchema>;

export const supplierSortFields = ['name', 'updatedAt'] as const;
export const supplierListQuerySchema = listQuerySchema(supplierSortFields, 'name.asc').extend({
  /** `false`: only suppliers in use; `true`: only archived ones; absent: both. */
  archived: queryFlagSchema.optional(),
});
export type SupplierListQuery = z.infer<typeof supplierListQuerySchema>;

const catalogItemFields = {
  supplierId: z.number({ message: 'must be a supplier id' }).int().positive(),
  /** The supplier's article number, unique per supplier. */
  sku: nameSchema(80),
  chemicalId: z.number({ message: 'must be a chemical id' }).int().positive(),
  packSize: amountSchema('pack size', 'positive'),
  packUnit: packUnitSchema,
  grade: refuseControlCharacters(z.string().trim().max(80, 'is at most 80 characters')).nullable(),
  purityPercent: z
    .number({ message: 'must be a number' })
    .gt(0, 'must be more than 0 %')
    .max(100, 'cannot be more than 100 %')
    .nullable(),
  /** Price of one pack, in minor units. */
  priceMinor: minorAmountSchema,
  /** Must be the lab's currency; the server fills it in when left out. */
  currency: currencyCodeSchema,
  hazardous: z.boolean(),
  splittable: z.boolean(),
};

export const catalogItemCreateSchema = z
  .object({
    ...catalogItemFields,
    grade: catalogItemFields.grade.default(null),
    purityPercent: catalogItemFields.purityPercent.default(null),
    currency: catalogItemFields.currency.optional(),
    hazardous: catalogItemFields.hazardous.default(false),
    splittable: catalogItemFields.splittable.default(false),
  })
  .strict();
export type CatalogItemCreate = z.input<typeof catalogItemCreateSchema>;
export type CatalogItemCreateParsed = z.output<typeof catalogItemCreateSchema>;

/**
 * Change a catalogue item (not its supplier); `discontinued: true` keeps it for the orders
 * that name it and leaves it out of new ones.
 */
export const catalogItemPatchSchema = z
  .object({ ...catalogItemFields, discontinued: z.boolean() })
  .omit({ supplierId: true })
  .partial()
  .strict();
export type CatalogItemPatch = z.infer<typeof catalogItemPatchSchema>;

/** A chemical as purchasing shows it: enough to recognise it and see its hazards. */
export const purchasingChemicalSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  casNumber: z.string().nullable(),
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.string()),
});
export type PurchasingChemical = z.infer<typeof purchasingChemicalSchema>;

export const catalogItemSchema = z.object({
  id: z.number().int(),
  supplierId: z.number().int(),
  supplierName: z.string(),
  sku: z.string(),
  chemicalId: z.number().int(),
  chemical: purchasingChemicalSchema,
  packSize: z.number(),
  packUnit: packUnitSchema,
  grade: z.string().nullable(),
  purityPercent: z.number().nullable(),
  priceMinor: z.number().int(),
  currency: z.string(),
  hazardous: z.boolean(),
  splittable: z.boolean(),
  discontinued: z.boolean(),
  /** Order lines that name the item: while any does, it can be discontinued, not deleted. */
  orderLineCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type CatalogItem = z.infer<typeof catalogItemSchema>;

export const catalogItemSortFields = ['sku', 'chemical', 'packSize', 'price', 'updatedAt'] as const;
export const catalogItemListQuerySchema = listQuerySchema(
  catalogItemSortFields,
  'chemical.asc',
).extend({
  supplierId: z.coerce.number().int().positive().optional(),
  chemicalId: z.coerce.number().int().positive().optional(),
  /** `false`: only items still sold; `true`: only discontinued ones; absent: both. */
  discontinued: queryFlagSchema.optional(),
});
export type CatalogItemListQuery = z.infer<typeof catalogItemListQuerySchema>;
