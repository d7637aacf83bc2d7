import { z } from 'zod';
import { stockUnitSchema } from './chemicals';
import { amountSchema, quantityUnitSchema } from './amounts';
import { containerStatusSchema } from './containers';
import { listQuerySchema, queryFlagSchema } from './list';

/** `GET /api/locations/:id/stocktake`: what should be there. */
export const stocktakeExpectedQuerySchema = z.object({
  includeSublocations: queryFlagSchema.optional().default(false),
});
export const stocktakeExpectedSchema = z.object({
  location: z.object({ id: z.number().int(), name: z.string(), path: z.string() }),
  includeSublocations: z.boolean(),
  containers: z.array(
    z.object({
      id: z.number().int(),
      labelCode: z.string(),
      chemicalName: z.string(),
      quantity: z.number(),
      unit: stockUnitSchema,
      status: containerStatusSchema,
      tareMass: z.number().nullable(),
      locationPath: z.string(),
    }),
  ),
});
export type StocktakeExpected = z.infer<typeof stocktakeExpectedSchema>;

/** What the person found for one container. */
export const stocktakeOutcomes = ['confirmed', 'counted', 'missing'] as const;

export const stocktakeCountSchema = z
  .object({
    containerId: z.number({ message: 'must be a container id' }).int().positive(),
    /** confirmed: the balance is right; counted: `countedQuantity` is there; missing: not found (disposed). */
    outcome: z.enum(stocktakeOutcomes, { message: 'must be confirmed, counted or missing' }),
    countedQuantity: amountSchema('counted quantity', 'nonNegative').optional(),
    unit: quantityUnitSchema.optional(),
  })
  .strict()
  .superRefine((count, ctx) => {
    if (count.outcome === 'counted' && (count.countedQuantity === undefined || !count.unit)) {
      ctx.addIssue({
        code: 'custom',
        path: ['countedQuantity'],
        message: 'a counted container needs countedQuantity and unit',
      });
    }
  });

/** `POST /api/stocktakes`: every count is written in one transaction, or none. */
export const stocktakeCreateSchema = z
  .object({
    locationId: z.number({ message: 'must be a location id' }).int().positive(),
    includeSublocations: z.boolean().default(false),
    note: z.string().trim().max(2000).default(''),
    counts: z
      .array(stocktakeCountSchema)
      .min(1, 'count at least one container')
      .max(5000)
      .refine(
        (counts) => new Set(counts.map((c) => c.containerId)).size === counts.length,
        'lists a container twice',
      ),
  })
  .strict();
export type StocktakeCreate = z.input<typeof stocktakeCreateSchema>;

export const stocktakeSchema = z.object({
  id: z.number().int(),
  location: z.object({ id: z.number().int(), name: z.string(), path: z.string() }),
  includeSublocations: z.boolean(),
  user: z.object({ id: z.number().int(), displayName: z.string() }).nullable(),
  note: z.string(),
  summary: z.object({
    expected: z.number().int(),
    confirmed: z.number().int(),
    corrected: z.number().int(),
    missing: z.number().int(),
    /** Expected containers the person did not count (left as they were). */
    notCounted: z.number().int(),
  }),
  createdAt: z.string(),
});
export type Stocktake = z.infer<typeof stocktakeSchema>;

export const stocktakeListQuerySchema = listQuerySchema(['createdAt'], 'createdAt.desc').extend({
  locationId: z.coerce.number().int().positive().optional(),
});
export type StocktakeListQuery = z.infer<typeof stocktakeListQuerySchema>;
