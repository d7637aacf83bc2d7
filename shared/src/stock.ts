import { z } from 'zod';
import { stockUnitSchema } from './chemicals';
import { containerStatusSchema } from './containers';
import { ghsCodeSchema, storageGroupSchema } from './hazards';
import { listQuerySchema, queryFlagSchema } from './list';

/** Where a chemical's usable total stands against its reorder point. */
export const reorderStatuses = ['below', 'at', 'ok', 'none'] as const;
export const reorderStatusSchema = z.enum(reorderStatuses);
export type ReorderStatus = (typeof reorderStatuses)[number];

/** A quantity as it is written for reading (`formatQuantity`): e.g. `2,500.00 mL`, in its own unit. */
export const displayQuantitySchema = z.object({
  value: z.number(),
  unit: z.string(),
  text: z.string(),
});

/**
 * One chemical in the stock overview. Usable = containers that are sealed or open and not
 * past their lot's expiry date.
 */
export const stockItemSchema = z.object({
  chemical: z.object({
    id: z.number().int(),
    name: z.string(),
    formula: z.string().nullable(),
    casNumber: z.string().nullable(),
    storageGroup: storageGroupSchema,
    ghsPictograms: z.array(ghsCodeSchema),
    hazardStatements: z.array(z.string()),
  }),
  /** Usable total in the chemical's stock unit. */
  total: z.number(),
  unit: stockUnitSchema,
  display: displayQuantitySchema,
  usableContainerCount: z.number().int(),
  /** Containers not disposed (usable, empty or expired). */
  containerCount: z.number().int(),
  expiredContainerCount: z.number().int(),
  /** Earliest expiry among usable containers. */
  nextExpiresOn: z.string().nullable(),
  reorderPoint: z.number().nullable(),
  reorderQuantity: z.number().nullable(),
  reorderStatus: reorderStatusSchema,
});
export type StockItem = z.infer<typeof stockItemSchema>;

export const stockSortFields = ['name', 'total', 'containerCount', 'nextExpiresOn'] as const;

/**
 * `GET /api/stock`. With `locationId`, totals count only that place and every place below it,
 * and only chemicals held there are listed. `belowReorderPoint`: at or below the reorder
 * point. `expiringWithinDays`: chemicals with a usable container expiring within N days.
 */
export const stockListQuerySchema = listQuerySchema(stockSortFields, 'name.asc').extend({
  locationId: z.coerce.number().int().positive().optional(),
  storageGroup: storageGroupSchema.optional(),
  belowReorderPoint: queryFlagSchema.optional(),
  expiringWithinDays: z.coerce.number().int().min(0).max(3650).optional(),
});
export type StockListQuery = z.infer<typeof stockListQuerySchema>;

/** `GET /api/chemicals/:id/stock-history`: total held (all containers) at the end of each day with a change. */
export const stockHistoryQuerySchema = z.object({
  days: z.coerce.number().int().min(1).max(3660).optional().default(365),
});
export const stockHistorySchema = z.object({
  chemicalId: z.number().int(),
  unit: stockUnitSchema,
  /** Oldest first; the first point is the total at the start of the window. */
  points: z.array(z.object({ date: z.string(), total: z.number() })),
});
export type StockHistory = z.infer<typeof stockHistorySchema>;

/** `GET /api/search?q=`: chemicals by name, synonym, CAS RN or formula; containers by label code. */
export const searchQuerySchema = z.object({
  q: z.string().trim().min(1, 'type something to search for').max(200),
  limit: z.coerce.number().int().min(1).max(50).optional().default(10),
});
export const searchResultSchema = z.object({
  /** A label code that matched exactly comes first, so a scan can jump straight to it. */
  containers: z.array(
    z.object({
      id: z.number().int(),
      labelCode: z.string(),
      status: containerStatusSchema,
      chemicalId: z.number().int(),
      chemicalName: z.string(),
      locationPath: z.string(),
      exact: z.boolean(),
    }),
  ),
  chemicals: z.array(
    z.object({
      id: z.number().int(),
      name: z.string(),
      casNumber: z.string().nullable(),
      formula: z.string().nullable(),
      /** The synonym that matched, when the name did not. */
      matchedSynonym: z.string().nullable(),
    }),
  ),
});
export type SearchResult = z.infer<typeof searchResultSchema>;
