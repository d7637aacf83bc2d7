import { z } from 'zod';
import { amountSchema } from './amounts';
import { stockUnitSchema } from './chemicals';
import { isoDateSchema } from './dates';
import { queryFlagSchema } from './list';
import { requestStatuses } from './purchasing';
import { restockChemicalSchema } from './reorder';

/** A request's status as the schemas check it (the statuses live in purchasing.ts). */
export const requestStatusSchema = z.enum(requestStatuses);

/** `POST /api/requests`: "I need 50 g of X by March". */
export const requestCreateSchema = z
  .object({
    chemicalId: z.number({ message: 'choose a chemical' }).int().positive('choose a chemical'),
    quantity: amountSchema('quantity', 'positive'),
    /** The chemical's stock unit (g or mL). */
    unit: stockUnitSchema,
    neededBy: isoDateSchema.nullable().optional().default(null),
    note: z.string().trim().max(1000, 'is at most 1000 characters').optional().default(''),
  })
  .strict();
export type RequestCreate = z.input<typeof requestCreateSchema>;
export type RequestCreateParsed = z.output<typeof requestCreateSchema>;

export const memberRequestSchema = z.object({
  id: z.number().int(),
  chemical: restockChemicalSchema,
  requester: z.object({ id: z.number().int(), displayName: z.string() }),
  quantity: z.number(),
  unit: stockUnitSchema,
  neededBy: z.string().nullable(),
  note: z.string(),
  status: requestStatusSchema,
  /** The order it was folded into, and the member's share there. */
  orderId: z.number().int().nullable(),
  shareId: z.number().int().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type MemberRequest = z.infer<typeof memberRequestSchema>;

/**
 * `GET /api/requests?status=open&mine=true`: a coordinator (orders.manage) sees everyone's,
 * anyone else only their own. Newest first; open ones by the date needed.
 */
export const requestListQuerySchema = z.object({
  status: requestStatusSchema.optional(),
  /** Only the signed-in person's own (a coordinator's default is everyone's). */
  mine: queryFlagSchema.optional(),
  page: z.coerce.number().int().min(1, 'page starts at 1').optional().default(1),
  pageSize: z.coerce
    .number()
    .int()
    .min(1)
    .max(200, 'pageSize is at most 200')
    .optional()
    .default(50),
});
export type RequestListQuery = z.infer<typeof requestListQuerySchema>;

/**
 * `POST /api/requests/:id/fold`: make an open request the member's claim on an order. With
 * `orderId`, that draft or open order (of a supplier selling the chemical); without it, the
 * draft order of the supplier with the best offer, created when there is none.
 */
export const requestFoldSchema = z
  .object({
    orderId: z.number().int().positive().optional(),
    supplierId: z.number().int().positive().optional(),
  })
  .strict();
export type RequestFold = z.infer<typeof requestFoldSchema>;
