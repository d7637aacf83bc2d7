import { z } from 'zod';
import { stockUnitSchema } from './chemicals';
import { confirmFieldSchema } from './confirmations';
import { isoDateSchema } from './dates';
import { ghsCodeSchema } from './hazards';
import { refuseControlCharacters } from './names';
import { orderStatuses, packUnits } from './purchasing';

/**
 * Receiving a shared order's delivery: per order line what came (packs, the supplier's lot
 * number, expiry), and where each member's portion goes. One lot per line; each pack is split
 * into one container per share (member portion), owned by that member.
 */

const idSchema = z.number({ message: 'must be an id' }).int().positive();

/** What came for one order line. */
export const receiveLineSchema = z
  .object({
    lineId: idSchema,
    /** Must be the number of packs ordered: a delivery is received whole. */
    packsReceived: z.number({ message: 'must be a whole number of packs' }).int().min(1),
    supplierLotNumber: refuseControlCharacters(
      z.string().trim().max(80, 'is at most 80 characters'),
    )
      .transform((text) => (text === '' ? null : text))
      .nullable()
      .default(null),
    expiresOn: isoDateSchema.nullable().default(null),
  })
  .strict();

/** `POST /api/orders/:id/receive`. */
export const receiveOrderSchema = z
  .object({
    receivedOn: isoDateSchema,
    /** Where every portion goes unless `shares` says otherwise. */
    locationId: idSchema,
    lines: z.array(receiveLineSchema).min(1, 'name what came for each line'),
    /** A different place for some shares' portions. */
    shares: z.array(z.object({ shareId: idSchema, locationId: idSchema }).strict()).default([]),
    confirm: confirmFieldSchema,
  })
  .strict()
  .refine(
    (body) => body.lines.every((line) => !line.expiresOn || line.expiresOn >= body.receivedOn),
    { message: 'an expiry date cannot be before the received date', path: ['lines'] },
  );
export type ReceiveOrder = z.input<typeof receiveOrderSchema>;
export type ReceiveOrderParsed = z.output<typeof receiveOrderSchema>;

/** One share's portion: before receiving what it will be, after it the container it became. */
export const receivingShareSchema = z.object({
  shareId: z.number().int(),
  userId: z.number().int().nullable(),
  forLab: z.boolean(),
  /** The member's display name, or "Lab" for the lab's own share. */
  holder: z.string(),
  /** In the line's pack unit. */
  quantity: z.number(),
  packUnit: z.enum(packUnits),
  /** The same in the chemical's stock unit; null when it cannot be converted (no density). */
  stockQuantity: z.number().nullable(),
  stockUnit: stockUnitSchema,
  container: z
    .object({
      id: z.number().int(),
      labelCode: z.string(),
      quantity: z.number(),
      unit: stockUnitSchema,
      locationId: z.number().int(),
      locationPath: z.string(),
    })
    .nullable(),
});
export type ReceivingShare = z.infer<typeof receivingShareSchema>;

export const receivingLineSchema = z.object({
  lineId: z.number().int(),
  sku: z.string(),
  chemical: z.object({
    id: z.number().int(),
    name: z.string(),
    ghsPictograms: z.array(ghsCodeSchema),
    hazardStatements: z.array(z.string()),
  }),
  packs: z.number().int(),
  packSize: z.number(),
  packUnit: z.enum(packUnits),
  grade: z.string().nullable(),
  hazardous: z.boolean(),
  /** The lot made on receiving; null before. */
  lot: z.object({ id: z.number().int(), supplierLotNumber: z.string().nullable() }).nullable(),
  shares: z.array(receivingShareSchema),
});
export type ReceivingLine = z.infer<typeof receivingLineSchema>;

/** `GET /api/orders/:id/receiving` and the answer of `POST /api/orders/:id/receive`. */
export const receivingViewSchema = z.object({
  orderId: z.number().int(),
  title: z.string(),
  status: z.enum(orderStatuses),
  supplierName: z.string(),
  supplierReference: z.string(),
  receivedAt: z.string().nullable(),
  /** True when the order may be received now (it is `ordered`). */
  receivable: z.boolean(),
  /** True when it may be closed now: received, nothing owed, no payment or refund in flight. */
  closable: z.boolean(),
  /** Why it cannot be closed yet, in plain words; empty when it can. */
  closeBlockers: z.array(z.string()),
  lines: z.array(receivingLineSchema),
});
export type ReceivingView = z.infer<typeof receivingViewSchema>;
