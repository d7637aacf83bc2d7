import { z } from 'zod';
import { listQuerySchema } from './list';
import { priceListColumnKeySchema, priceListSummarySchema } from './price-lists';

/**
 * CSV imports, of two kinds: `stock` (existing stock: one row per container, with what is
 * needed to create its chemical, lot and place when Lotwise does not know them yet; see
 * docs/importing-stock.md) and `price-list` (a supplier's catalogue, see ./price-lists.ts).
 * Both go through the same steps: upload, check every row, preview, commit all or nothing.
 */
export const importKinds = ['stock', 'price-list'] as const;
export type ImportKind = (typeof importKinds)[number];
export const importKindSchema = z.enum(importKinds, {
  message: `must be one of: ${importKinds.join(', ')}`,
});

/** `POST /api/imports?kind=price-list&supplierId=3`; without `kind`, a stock import. */
export const importCreateQuerySchema = z
  .object({
    kind: importKindSchema.optional().default('stock'),
    supplierId: z.coerce.number().int().positive().optional(),
  })
  .superRefine((query, ctx) => {
    if (query.kind === 'price-list' && query.supplierId === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['supplierId'],
        message: 'is required for a price list: the supplier whose prices the file holds',
      });
    }
  });
export type ImportCreateQuery = z.infer<typeof importCreateQuerySchema>;

export const importColumnKeys = [
  'chemical',
  'casNumber',
  'formula',
  'physicalState',
  'density',
  'storageGroup',
  'ghsPictograms',
  'hazardStatements',
  'peroxideClass',
  'supplier',
  'supplierLotNumber',
  'grade',
  'purityPercent',
  'receivedOn',
  'expiresOn',
  'labelCode',
  'quantity',
  'unit',
  'tareMass',
  'capacity',
  'capacityUnit',
  'openedOn',
  'status',
  'location',
  'notes',
] as const;
export type ImportColumnKey = (typeof importColumnKeys)[number];
export const importColumnKeySchema = z.enum(importColumnKeys);

export type ImportColumnGroup = 'chemical' | 'lot' | 'container' | 'location';

export interface ImportColumn {
  key: ImportColumnKey;
  /** The header Lotwise writes in an export and in the template. */
  header: string;
  /** Other headers read as this column (compared without case, spaces or punctuation). */
  aliases: readonly string[];
  required: boolean;
  group: ImportColumnGroup;
  description: string;
  example: string;
}

/** Every column of a stock import, in the order an export writes them. */
export const importColumns: readonly ImportColumn[] = [
  {
    key: 'chemical',
    header: 'Chemical',
    aliases: ['Chemical name', 'Name', 'Substance', 'Reagent'],
    required: true,
    group: 'chemical',
    description:
      'Name of the chemical. Matched to a chemical Lotwise knows by CAS RN first, then by name (any letter case); a new chemical is created otherwise.',
    example: 'Sodium chloride',
  },
  {
    key: 'casNumber',
    header: 'CAS RN',
    aliases: ['CAS', 'CAS number', 'CAS no', 'CAS registry number'],
    required: false,
    group: 'chemical',
    description: 'CAS Registry Number with hyphens; the check digit is verified.',
    example: '7647-14-5',
  },
  {
    key: 'formula',
    header: 'Formula',
    aliases: ['Molecular formula', 'Chemical formula'],
    required: false,
    group: 'chemical',
    description: 'Formula for the molar mass, e.g. CuSO4·5H2O for a hydrate.',
    example: 'NaCl',
  },
  {
    key: 'physicalState',
    header: 'Physical state',
    aliases: ['State', 'Form'],
    required: false,
    group: 'chemical',
    description:
      'solid, liquid, gas or solution. Empty: liquid when the quantity is a volume, solid otherwise.',
    example: 'solid',
  },
  {
    key: 'density',
    header: 'Density (g/mL)',
    aliases: ['Density', 'Density g/cm3'],
    required: false,
    group: 'chemical',
    description: 'g/mL at 20 °C; needed to count a liquid by mass or a solid by volume.',
    example: '0.789',
  },
  {
    key: 'storageGroup',
    header: 'Storage group',
    aliases: ['Group', 'Storage'],
    required: false,
    group: 'chemical',
    description:
      'A Lotwise storage group code (flammable, oxidizer, base…) or its label; empty means low-hazard.',
    example: 'low-hazard',
  },
  {
    key: 'ghsPictograms',
    header: 'GHS pictograms',
    aliases: ['Pictograms', 'GHS'],
    required: false,
    group: 'chemical',
    description: 'GHS01 to GHS09, separated by commas, semicolons or spaces.',
    example: 'GHS02, GHS07',
  },
  {
    key: 'hazardStatements',
    header: 'H-statements',
    aliases: ['Hazard statements', 'H codes', 'Hazard codes'],
    required: false,
    group: 'chemical',
    description: 'H-statement codes separated by commas, semicolons, spaces or +.',
    example: 'H225, H319',
  },
  {
    key: 'peroxideClass',
    header: 'Peroxide class',
    aliases: ['Peroxide former', 'Peroxide'],
    required: false,
    group: 'chemical',
    description: 'A, B, C or D for a peroxide former; empty otherwise.',
    example: 'B',
  },
  {
    key: 'supplier',
    header: 'Supplier',
    aliases: ['Supplier name', 'Vendor', 'Maker'],
    required: false,
    group: 'lot',
    description: 'Who the lot came from.',
    example: 'Northgate Lab Supply',
  },
  {
    key: 'supplierLotNumber',
    header: 'Supplier lot no.',
    aliases: ['Supplier lot number', 'Lot', 'Lot number', 'Lot no', 'Batch', 'Batch number'],
    required: false,
    group: 'lot',
    description:
      "The supplier's lot or batch number. Rows of one chemical with the same supplier and lot number are one lot.",
    example: 'NG-24-0117',
  },
  {
    key: 'grade',
    header: 'Grade',
    aliases: ['Quality'],
    required: false,
    group: 'lot',
    description: 'e.g. ACS reagent, technical.',
    example: 'ACS reagent',
  },
  {
    key: 'purityPercent',
    header: 'Purity %',
    aliases: ['Purity', 'Purity percent', 'Assay'],
    required: false,
    group: 'lot',
    description: 'Mass % from the certificate, more than 0 and at most 100.',
    example: '99.5',
  },
  {
    key: 'receivedOn',
    header: 'Received on',
    aliases: ['Received', 'Date received', 'Receipt date'],
    required: false,
    group: 'lot',
    description: 'YYYY-MM-DD; empty means the day of the import.',
    example: '2025-09-01',
  },
  {
    key: 'expiresOn',
    header: 'Expires on',
    aliases: ['Expiry', 'Expires', 'Expiry date', 'Expiration date', 'Use by'],
    required: false,
    group: 'lot',
    description: 'YYYY-MM-DD, not before the received date.',
    example: '2028-09-01',
  },
  {
    key: 'labelCode',
    header: 'Label code',
    aliases: ['Label', 'Code', 'Container code', 'Barcode'],
    required: false,
    group: 'container',
    description:
      'The code on the bottle. Empty: the next LW- code is generated. lw-42 is read as LW-00042; other codes up to 20 characters are kept as written.',
    example: 'LW-00042',
  },
  {
    key: 'quantity',
    header: 'Quantity',
    aliases: ['Amount', 'Qty', 'Contents'],
    required: true,
    group: 'container',
    description: 'What the container holds now, 0 or more, in Unit.',
    example: '500',
  },
  {
    key: 'unit',
    header: 'Unit',
    aliases: ['Units', 'Quantity unit', 'UOM'],
    required: true,
    group: 'container',
    description: 'A mass or volume unit: µg, mg, g, kg, µL, mL or L (ug, uL, ml and l also).',
    example: 'g',
  },
  {
    key: 'tareMass',
    header: 'Tare (g)',
    aliases: ['Tare', 'Tare mass', 'Empty mass'],
    required: false,
    group: 'container',
    description: 'Mass of the empty container with its cap, in g, for weighing by difference.',
    example: '182.4',
  },
  {
    key: 'capacity',
    header: 'Capacity',
    aliases: ['Size', 'Container size', 'Bottle size'],
    required: false,
    group: 'container',
    description: 'How much the container holds when full.',
    example: '500',
  },
  {
    key: 'capacityUnit',
    header: 'Capacity unit',
    aliases: ['Size unit'],
    required: false,
    group: 'container',
    description: 'Unit of the capacity; empty means the same as Unit.',
    example: 'g',
  },
  {
    key: 'openedOn',
    header: 'Opened on',
    aliases: ['Opened', 'Date opened'],
    required: false,
    group: 'container',
    description: 'YYYY-MM-DD when first opened (peroxide formers count from it).',
    example: '2025-10-03',
  },
  {
    key: 'status',
    header: 'Status',
    aliases: ['Container status'],
    required: false,
    group: 'container',
    description:
      'sealed, open, empty or disposed. Empty: open when Opened on is given, sealed otherwise; a quantity of 0 makes it empty.',
    example: 'open',
  },
  {
    key: 'location',
    header: 'Location',
    aliases: ['Location path', 'Place', 'Storage location'],
    required: true,
    group: 'location',
    description:
      'Path from the room down, parts separated by › (or / or >): Room 101 › Cabinet A › Shelf 2. Missing places are created.',
    example: 'Room 101 › Cabinet A › Shelf 2',
  },
  {
    key: 'notes',
    header: 'Notes',
    aliases: ['Note', 'Comment', 'Comments', 'Remarks'],
    required: false,
    group: 'container',
    description: 'Free text kept on the container.',
    example: 'Working bottle',
  },
];

/** A header as compared: lower case, letters and digits only ("Tare (g)" -> "tareg"). */
export function normalizeHeader(text: string): string {
  return text
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[^\p{L}\p{N}]+/gu, '');
}

const columnByHeader = new Map<string, ImportColumnKey>(
  importColumns.flatMap((column) =>
    [column.header, column.key, ...column.aliases].map(
      (name) => [normalizeHeader(name), column.key] as const,
    ),
  ),
);

/** The column a header names (header, alias or key, any case/spacing), or null. */
export function importColumnForHeader(header: string): ImportColumnKey | null {
  return columnByHeader.get(normalizeHeader(header)) ?? null;
}

/** Files with more data rows than this are refused as a whole. */
export const importRowLimit = 50_000;
/**
 * Up to this many data rows, `POST /api/imports` and the commit answer when the work is done;
 * larger files answer 202 at once and are followed with `GET /api/imports/:id`.
 */
export const importWaitRowLimit = 500;

export const importStatuses = [
  'validating',
  'ready',
  'invalid',
  'committing',
  'committed',
  'failed',
] as const;
export type ImportStatus = (typeof importStatuses)[number];
export const importStatusSchema = z.enum(importStatuses);

/** One thing wrong with the file: a cell, a row, or (row null) the file as a whole. */
export const importProblemSchema = z.object({
  /** Row number as a spreadsheet shows it (the header is row 1); null for the whole file. */
  row: z.number().int().nullable(),
  /** The column's header as written in the file (ours when the column is missing). */
  column: z.string().nullable(),
  /** The column's key: of {@link importColumnKeys}, or of the price-list columns. */
  field: z.union([importColumnKeySchema, priceListColumnKeySchema]).nullable(),
  /** The cell as read, shortened to 100 characters. */
  value: z.string().nullable(),
  message: z.string(),
});
export type ImportProblem = z.infer<typeof importProblemSchema>;

/** What a commit writes (or wrote): new and matched records. */
export const importSummarySchema = z.object({
  /** Data rows read, blank rows not counted. */
  rows: z.number().int(),
  blankRowsSkipped: z.number().int(),
  chemicals: z.object({ new: z.number().int(), existing: z.number().int() }),
  lots: z.object({ new: z.number().int(), existing: z.number().int() }),
  containers: z.object({ new: z.number().int(), generatedLabelCodes: z.number().int() }),
  locations: z.object({ new: z.number().int(), existing: z.number().int() }),
  /** Up to 100 of each. */
  newChemicalNames: z.array(z.string()),
  newLocationPaths: z.array(z.string()),
});
export type ImportSummary = z.infer<typeof importSummarySchema>;

export const importSchema = z.object({
  id: z.number().int(),
  kind: importKindSchema,
  /** The supplier a price list is for; null for stock (or when the supplier was deleted). */
  supplier: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  fileName: z.string(),
  status: importStatusSchema,
  /** Data rows in the file (blank rows included until validation has read them). */
  totalRows: z.number().int(),
  /** Rows validated (status validating) or written (status committing) so far. */
  processedRows: z.number().int(),
  errorCount: z.number().int(),
  /** One page of the problems, in file order; see `errorsPage` / `errorsPageSize`. */
  errors: z.array(importProblemSchema),
  errorsPage: z.number().int(),
  errorsPageSize: z.number().int(),
  /** Things that do not stop the import (e.g. a column Lotwise does not read). */
  warnings: z.array(z.string()),
  /**
   * What a stock import's commit creates; null until validation has finished, when the file
   * is unreadable, and for a price list.
   */
  summary: importSummarySchema.nullable(),
  /** What a price list's commit adds and updates; null as `summary` is, and for stock. */
  priceList: priceListSummarySchema.nullable(),
  /** Why a commit failed (nothing was written) or validation stopped. */
  failure: z.string().nullable(),
  createdBy: z.object({ id: z.number().int(), displayName: z.string() }).nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  committedAt: z.string().nullable(),
});
export type Import = z.infer<typeof importSchema>;

export const importListItemSchema = importSchema.omit({
  errors: true,
  errorsPage: true,
  errorsPageSize: true,
  warnings: true,
});
export type ImportListItem = z.infer<typeof importListItemSchema>;

export const maxErrorsPageSize = 500;

/** `GET /api/imports/:id?errorsPage=&errorsPageSize=`. */
export const importQuerySchema = z.object({
  errorsPage: z.coerce.number().int().min(1, 'errorsPage starts at 1').optional().default(1),
  errorsPageSize: z.coerce
    .number()
    .int()
    .min(1)
    .max(maxErrorsPageSize, `errorsPageSize is at most ${maxErrorsPageSize}`)
    .optional()
    .default(100),
});
export type ImportQuery = z.infer<typeof importQuerySchema>;

export const importListQuerySchema = listQuerySchema(['createdAt'], 'createdAt.desc').extend({
  status: importStatusSchema.optional(),
});
export type ImportListQuery = z.infer<typeof importListQuerySchema>;

/**
 * `POST /api/imports` as JSON instead of multipart (small files: the JSON body limit is
 * 1 MB). Multipart takes the file in the field `file`.
 */
export const importTextBodySchema = z
  .object({
    fileName: z.string().trim().min(1).max(255).optional().default('import.csv'),
    text: z.string().min(1, 'is empty: paste the CSV text, header row first'),
  })
  .strict();
export type ImportTextBody = z.input<typeof importTextBodySchema>;

/** Multipart field holding the uploaded file (imports, SDS, certificates). */
export const uploadFieldName = 'file';

/** Columns of `GET /api/exports/chemicals.csv`. Shared names match the import's headers. */
export const chemicalExportHeaders = [
  'Chemical',
  'Synonyms',
  'CAS RN',
  'Formula',
  'Molar mass (g/mol)',
  'Physical state',
  'Density (g/mL)',
  'Default purity %',
  'GHS pictograms',
  'H-statements',
  'Storage group',
  'Extra storage groups',
  'Peroxide class',
  'Stock unit',
  'Reorder point',
  'Reorder quantity',
  'Restricted',
  'Flash point (°C)',
  'Flash point source',
  'Boiling point (°C)',
  'Boiling point source',
  'NFPA 30 class',
  'GHS flammable category',
  'Notes',
] as const;
