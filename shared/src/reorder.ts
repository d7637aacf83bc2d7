import { z } from 'zod';
import { amountSchema } from './amounts';
import { physicalStateSchema, stockUnitSchema } from './chemicals';
import { ghsCodeSchema, storageGroupSchema } from './hazards';
import { queryFlagSchema } from './list';
import { currencyDigits } from './money';

/** A chemical as the purchasing pages show it: enough to name it and show its hazards. */
export const restockChemicalSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  casNumber: z.string().nullable(),
  formula: z.string().nullable(),
  physicalState: physicalStateSchema,
  stockUnit: stockUnitSchema,
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.string()),
  storageGroup: storageGroupSchema,
  /** Orders of a restricted chemical need a manager's approval. */
  restricted: z.boolean(),
});
export type RestockChemical = z.infer<typeof restockChemicalSchema>;

/** How many of one catalogue pack a suggestion buys. */
export const suggestedPackSchema = z.object({
  catalogItemId: z.number().int(),
  supplierSku: z.string(),
  count: z.number().int(),
  packSize: z.number(),
  packUnit: z.string(),
  /** One pack in the chemical's stock unit (through the density when sold in the other). */
  amountPerPack: z.number(),
  priceMinor: z.number().int(),
  hazardous: z.boolean(),
});
export type SuggestedPack = z.infer<typeof suggestedPackSchema>;

/** Packs of one supplier that cover the quantity to buy, with the supplier's fees. */
export const packOfferSchema = z.object({
  supplier: z.object({ id: z.number().int(), name: z.string() }),
  packs: z.array(suggestedPackSchema),
  packCount: z.number().int(),
  /** What the packs hold, in the stock unit. */
  amount: z.number(),
  goodsMinor: z.number().int(),
  shippingFeeMinor: z.number().int(),
  hazardousFeeMinor: z.number().int(),
  /** Packs and fees, as if this were the supplier's only line. */
  totalMinor: z.number().int(),
  /** totalMinor per g (or mL) bought: a decimal number of minor units. */
  pricePerUnitMinor: z.number(),
  /** Buys no more than twice the quantity asked for. */
  withinOverbuyLimit: z.boolean(),
  minimumOrderMinor: z.number().int(),
  /** The packs alone fall short of the supplier's minimum order (other lines may make it up). */
  belowMinimumOrder: z.boolean(),
  minimumOrderShortMinor: z.number().int(),
});
export type PackOffer = z.infer<typeof packOfferSchema>;

/** How the quantity to buy was found. */
export const reorderRules = ['reorder-quantity', 'target-level', 'none'] as const;

/** One chemical with a reorder point: how long its stock lasts, and what to buy. */
export const reorderSuggestionSchema = z.object({
  chemical: restockChemicalSchema,
  unit: stockUnitSchema,
  /** Usable stock (sealed or open, not expired). */
  onHand: z.number(),
  reorderPoint: z.number(),
  reorderQuantity: z.number().nullable(),
  /** Drawn (by hand and by runs) over the window, in the stock unit. */
  consumed: z.number(),
  /** Days the rate was counted over: the window, or less for a chemical newer than it. */
  rateDays: z.number(),
  /** Use per day, or null when nothing was drawn in the window. */
  ratePerDay: z.number().nullable(),
  daysLeft: z.number().nullable(),
  daysToReorderPoint: z.number().nullable(),
  /** YYYY-MM-DD, or null when nothing is being used. */
  reorderPointOn: z.string().nullable(),
  emptyOn: z.string().nullable(),
  /** At or below the reorder point now. */
  due: z.boolean(),
  /** Null when the chemical has no reorder quantity. */
  quantityToBuy: z.number().nullable(),
  rule: z.enum(reorderRules),
  /** Already on draft or open orders (not yet received), in the stock unit. */
  onOrder: z.number(),
  /** The best offer, or null (no catalogue item, none usable, or nothing to buy). */
  offer: packOfferSchema.nullable(),
  /** The best offer of every other supplier that can cover the quantity, best first. */
  alternatives: z.array(packOfferSchema),
  /** Why there is no offer, or which catalogue items could not be counted and why. */
  notes: z.array(z.string()),
});
export type ReorderSuggestion = z.infer<typeof reorderSuggestionSchema>;

/** `GET /api/reorder-suggestions?dueOnly=true&q=…` */
export const reorderSuggestionQuerySchema = z.object({
  q: z.string().trim().max(200).optional().default(''),
  /** Only chemicals at or below their reorder point. */
  dueOnly: queryFlagSchema.optional(),
});
export type ReorderSuggestionQuery = z.infer<typeof reorderSuggestionQuerySchema>;

export const reorderSuggestionListSchema = z.object({
  /** Due first, then the soonest reorder point, then by name. */
  items: z.array(reorderSuggestionSchema),
  /** REORDER_WINDOW_WEEKS: the weeks of draws the rate is counted over. */
  windowWeeks: z.number().int(),
  /** YYYY-MM-DD the days are counted from. */
  asOf: z.string(),
  currency: z.string(),
  /** How packs are chosen, in words. */
  packRule: z.string(),
});
export type ReorderSuggestionList = z.infer<typeof reorderSuggestionListSchema>;

/**
 * `POST /api/reorder-suggestions/draft-orders`: draft orders (one per supplier) from the
 * chosen suggestions. The server works out quantities, packs and prices itself; the
 * browser only says which chemicals, and optionally another supplier's offer.
 */
export const draftFromSuggestionsSchema = z
  .object({
    items: z
      .array(
        z
          .object({
            chemicalId: z.number().int().positive(),
            /** Take this supplier's best offer instead of the overall best. */
            supplierId: z.number().int().positive().optional(),
          })
          .strict(),
      )
      .min(1, 'choose at least one chemical')
      .max(200)
      .refine(
        (items) => new Set(items.map((item) => item.chemicalId)).size === items.length,
        'lists a chemical twice',
      ),
  })
  .strict();
export type DraftFromSuggestions = z.infer<typeof draftFromSuggestionsSchema>;

/** A draft order that lines were added to, or that was created for them. */
export const draftedOrderSchema = z.object({
  orderId: z.number().int(),
  supplier: z.object({ id: z.number().int(), name: z.string() }),
  /** True when the order was created now; false when lines went into an existing draft. */
  created: z.boolean(),
  lineCount: z.number().int(),
});
export type DraftedOrder = z.infer<typeof draftedOrderSchema>;

export const draftResultSchema = z.object({ orders: z.array(draftedOrderSchema) });
export type DraftResult = z.infer<typeof draftResultSchema>;

/**
 * `POST /api/reorder-suggestions/shortfall`: buy a plan's shortfall of one chemical. The
 * line goes into an existing draft order of the supplier with the best offer, or a new one.
 */
export const shortfallDraftSchema = z
  .object({
    chemicalId: z.number().int().positive(),
    quantity: amountSchema('quantity', 'positive'),
    unit: stockUnitSchema,
    /** The plan the shortfall comes from, noted on the line. */
    planId: z.number().int().positive().optional(),
  })
  .strict();
export type ShortfallDraft = z.infer<typeof shortfallDraftSchema>;

const perUnitFormats = new Map<string, Intl.NumberFormat>();

/**
 * A price per g (or mL) from a decimal number of minor units, in the reader's locale:
 * `formatPricePerUnit(10.4, 'EUR', 'g', 'en-GB')` = "€0.104/g". Two more decimals than the
 * currency has, since prices per gram are small; for display only (totals stay integers).
 */
export function formatPricePerUnit(
  minorPerUnit: number,
  currency: string,
  unit: string,
  locale?: string,
): string {
  const digits = currencyDigits(currency);
  const key = `${locale ?? ''}|${currency}`;
  let format = perUnitFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, {
      style: 'currency',
      currency,
      minimumFractionDigits: digits,
      maximumFractionDigits: digits + 2,
    });
    perUnitFormats.set(key, format);
  }
  return `${format.format(minorPerUnit / 10 ** digits)}/${unit}`;
}
