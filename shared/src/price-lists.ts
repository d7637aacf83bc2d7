import { z } from 'zod';

/**
 * CSV import of a supplier's price list: one row per pack the supplier sells. A row whose SKU
 * the supplier already has updates that catalogue item; a new SKU adds one. See
 * docs/importing-price-lists.md.
 */

export const priceListColumnKeys = [
  'sku',
  'chemical',
  'packSize',
  'packUnit',
  'price',
  'currency',
  'grade',
  'purityPercent',
  'hazardous',
  'splittable',
] as const;
export type PriceListColumnKey = (typeof priceListColumnKeys)[number];
export const priceListColumnKeySchema = z.enum(priceListColumnKeys);

export interface PriceListColumn {
  key: PriceListColumnKey;
  /** The header Lotwise writes in the example file. */
  header: string;
  /** Other headers read as this column (compared without case, spaces or punctuation). */
  aliases: readonly string[];
  required: boolean;
  description: string;
  example: string;
}

/** Every column of a price-list import, in the order of the example file. */
export const priceListColumns: readonly PriceListColumn[] = [
  {
    key: 'sku',
    header: 'sku',
    aliases: ['SKU', 'Article', 'Article number', 'Item number', 'Catalogue number', 'Cat no'],
    required: true,
    description:
      "The supplier's own article number. A number this supplier already has in Lotwise updates that item; a new one adds an item.",
    example: 'NLS-1001',
  },
  {
    key: 'chemical',
    header: 'chemical',
    aliases: ['Chemical name', 'Name', 'CAS', 'CAS RN', 'Substance'],
    required: true,
    description:
      'The chemical by its name (any letter case) or CAS RN, as Lotwise already knows it. Add a chemical first if it is not in Lotwise.',
    example: 'Salicylic acid',
  },
  {
    key: 'packSize',
    header: 'pack_size',
    aliases: ['Pack size', 'Size', 'Quantity'],
    required: true,
    description: 'How much one pack holds, more than 0, in pack_unit.',
    example: '250',
  },
  {
    key: 'packUnit',
    header: 'pack_unit',
    aliases: ['Pack unit', 'Unit'],
    required: true,
    description: 'g, kg, mg, mL or L (ml and l are read too).',
    example: 'g',
  },
  {
    key: 'price',
    header: 'price',
    aliases: ['Pack price', 'Unit price', 'Price per pack'],
    required: true,
    description:
      'Price of one pack in the major unit, with a point or comma for the decimals (12.50); no more decimals than the currency has (2 for EUR).',
    example: '14.90',
  },
  {
    key: 'currency',
    header: 'currency',
    aliases: ['Currency code'],
    required: false,
    description: "ISO code such as EUR; when given it must be the lab's currency.",
    example: 'EUR',
  },
  {
    key: 'grade',
    header: 'grade',
    aliases: ['Quality'],
    required: false,
    description: 'e.g. ACS reagent, technical.',
    example: 'ACS reagent',
  },
  {
    key: 'purityPercent',
    header: 'purity_percent',
    aliases: ['Purity', 'Purity %', 'Assay'],
    required: false,
    description: 'Mass %, more than 0 and at most 100.',
    example: '99.5',
  },
  {
    key: 'hazardous',
    header: 'hazardous',
    aliases: ['Hazardous goods', 'Dangerous goods'],
    required: false,
    description:
      "yes or no (empty: no). yes: the pack ships as hazardous goods and an order holding it pays the supplier's hazardous-goods fee.",
    example: 'no',
  },
  {
    key: 'splittable',
    header: 'splittable',
    aliases: ['Split', 'Shareable'],
    required: false,
    description: 'yes or no (empty: no). yes: members may claim part of a pack in a shared order.',
    example: 'yes',
  },
];

/** What a price-list row does to the catalogue. */
export const priceListActions = ['create', 'update', 'unchanged'] as const;
export type PriceListAction = (typeof priceListActions)[number];

export const priceListActionLabels: Record<PriceListAction, string> = {
  create: 'New item',
  update: 'Update',
  unchanged: 'No change',
};

/** What a price-list import writes (or wrote), row by row. */
export const priceListSummarySchema = z.object({
  rows: z.number().int(),
  blankRowsSkipped: z.number().int(),
  supplier: z.object({ id: z.number().int(), name: z.string() }),
  currency: z.string(),
  items: z.object({
    new: z.number().int(),
    updated: z.number().int(),
    unchanged: z.number().int(),
  }),
  /** The first 1,000 rows with what each does. */
  changes: z.array(
    z.object({
      row: z.number().int(),
      sku: z.string(),
      chemical: z.string(),
      packSize: z.number(),
      packUnit: z.string(),
      priceMinor: z.number().int(),
      /** The item's price before the import; null for a new item. */
      previousPriceMinor: z.number().int().nullable(),
      action: z.enum(priceListActions),
    }),
  ),
});
export type PriceListSummary = z.infer<typeof priceListSummarySchema>;

/** Changes listed per import (the counts are always complete). */
export const priceListChangesShown = 1000;
