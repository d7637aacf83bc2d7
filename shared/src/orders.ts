import { z } from 'zod';
import { amountSchema } from './amounts';
import { isoDateSchema } from './dates';
import { ghsCodeSchema } from './hazards';
import { listQuerySchema } from './list';
import { minorAmountSchema } from './money';
import { orderWatchSchema } from './watch-lists';
import {
  feeRules,
  orderStatuses,
  packUnits,
  sharePaymentStatuses,
  type PackUnit,
} from './purchasing';

/**
 * Shared orders: the coordinator's draft, opening, claims, closing claims, ordering and
 * cancelling, and the members' claims. Amounts are integers in minor units of `currency`.
 */

export const orderStatusSchema = z.enum(orderStatuses, {
  message: `must be one of: ${orderStatuses.join(', ')}`,
});
export const feeRuleSchema = z.enum(feeRules, {
  message: `must be one of: ${feeRules.join(', ')}`,
});

/** What the audit trail records of a coordinator's work on an order. */
export const orderAuditActions = [
  'order.drafted',
  'order.updated',
  'order.line_added',
  'order.line_changed',
  'order.line_removed',
  'order.opened',
  'order.lab_remainder_taken',
  'order.claims_closed',
  'order.ordered',
  'order.invoice_recorded',
  'order.cancelled',
  'order.watch_approved',
  'order.watch_approval_cleared',
] as const;
export type OrderAuditAction = (typeof orderAuditActions)[number];

/**
 * The smallest step of a claim on a line, in the line's pack unit: a whole pack, or where the
 * pack may be split, 1 g or 1 mL (1 mg for packs sold in mg). A lab balance and a graduated
 * cylinder measure that well; finer portions are not worth splitting.
 */
export function claimStep(line: {
  splittable: boolean;
  packSize: number;
  packUnit: PackUnit;
}): number {
  if (!line.splittable) return line.packSize;
  if (line.packUnit === 'kg' || line.packUnit === 'L') return 0.001;
  return 1;
}

/** True when `quantity` is a whole number of `step`s (to the millionth the database keeps). */
export function isWholeSteps(quantity: number, step: number): boolean {
  const steps = quantity / step;
  return Math.abs(steps - Math.round(steps)) < 1e-6;
}

const orderLineInputSchema = z.object({
  catalogItemId: z.number().int().positive(),
  packs: z.number().int('packs must be a whole number').min(1, 'at least 1 pack').max(10_000),
});
export type OrderLineInput = z.infer<typeof orderLineInputSchema>;

const titleSchema = z
  .string()
  .trim()
  .min(1, 'give the order a title')
  .max(200, 'at most 200 characters');
const notesSchema = z.string().trim().max(4000, 'at most 4000 characters');

/** `POST /api/orders`: a draft with one supplier; its fees are copied from the supplier. */
export const orderCreateSchema = z.object({
  supplierId: z.number().int().positive(),
  title: titleSchema,
  feeRule: feeRuleSchema.default('value'),
  claimDeadline: isoDateSchema.nullable().default(null),
  lines: z.array(orderLineInputSchema).max(200).default([]),
  notes: notesSchema.default(''),
});
export type OrderCreate = z.input<typeof orderCreateSchema>;

/** `PATCH /api/orders/:id`: title, notes, deadline; fee rule and fees until claims close. */
export const orderPatchSchema = z
  .object({
    title: titleSchema,
    feeRule: feeRuleSchema,
    claimDeadline: isoDateSchema.nullable(),
    notes: notesSchema,
    shippingFeeMinor: minorAmountSchema,
    hazardousFeeMinor: minorAmountSchema,
  })
  .partial();
export type OrderPatch = z.infer<typeof orderPatchSchema>;

/** `POST /api/orders/:id/lines`. */
export const orderLineCreateSchema = orderLineInputSchema;
/** `PATCH /api/orders/:id/lines/:lineId`: packs, never below what members claimed. */
export const orderLinePatchSchema = orderLineInputSchema.pick({ packs: true });

/** `POST /api/orders/:id/shares`: a claim, in the line's pack unit. */
export const shareClaimSchema = z.object({
  lineId: z.number().int().positive(),
  quantity: amountSchema('The quantity', 'positive'),
});
export type ShareClaim = z.infer<typeof shareClaimSchema>;

/** `PATCH /api/orders/:id/shares/:shareId`: the claim's new quantity. */
export const sharePatchSchema = shareClaimSchema.pick({ quantity: true });
export type SharePatch = z.infer<typeof sharePatchSchema>;

/** `POST /api/orders/:id/mark-ordered`. */
export const orderMarkOrderedSchema = z.object({
  supplierReference: z
    .string()
    .trim()
    .min(1, 'give the supplier’s order number or reference')
    .max(120, 'at most 120 characters'),
  supplierInvoiceMinor: minorAmountSchema.nullable().default(null),
});
export type OrderMarkOrdered = z.input<typeof orderMarkOrderedSchema>;

/** `PUT /api/orders/:id/supplier-invoice`: what the supplier's invoice says, for the books. */
export const orderInvoiceSchema = z.object({ supplierInvoiceMinor: minorAmountSchema });

/** `POST /api/orders/:id/cancel`. */
export const orderCancelSchema = z.object({
  reason: z
    .string()
    .trim()
    .min(3, 'say why the order is cancelled (members read it)')
    .max(1000, 'at most 1000 characters'),
});
export type OrderCancel = z.infer<typeof orderCancelSchema>;

export const orderSortFields = ['createdAt', 'claimDeadline', 'title', 'status'] as const;
export const orderListQuerySchema = listQuerySchema(orderSortFields, 'createdAt.desc').extend({
  status: orderStatusSchema.optional(),
});
export type OrderListQuery = z.infer<typeof orderListQuerySchema>;

const personSchema = z.object({ id: z.number().int(), displayName: z.string() });

/** One order in the list, with what the caller has claimed of it. */
export const orderSummarySchema = z.object({
  id: z.number().int(),
  title: z.string(),
  status: orderStatusSchema,
  supplier: z.object({ id: z.number().int(), name: z.string() }),
  feeRule: feeRuleSchema,
  claimDeadline: z.string().nullable(),
  /** Claims closed: amounts are fixed and members pay. */
  claimsClosedAt: z.string().nullable(),
  coordinator: personSchema.nullable(),
  lineCount: z.number().int(),
  totalMinor: z.number().int(),
  currency: z.string(),
  unclaimedMinor: z.number().int(),
  /** The caller's shares: how many, their amount (an estimate while claims are open) and what is still to pay. */
  mine: z.object({
    shareCount: z.number().int(),
    amountMinor: z.number().int(),
    amountFixed: z.boolean(),
    owedMinor: z.number().int(),
  }),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type OrderSummary = z.infer<typeof orderSummarySchema>;

export const orderLineSchema = z.object({
  id: z.number().int(),
  position: z.number().int(),
  catalogItemId: z.number().int(),
  sku: z.string(),
  chemical: z.object({
    id: z.number().int(),
    name: z.string(),
    casNumber: z.string().nullable(),
    ghsPictograms: z.array(ghsCodeSchema),
    hazardStatements: z.array(z.object({ code: z.string(), text: z.string().nullable() })),
  }),
  packs: z.number().int(),
  packSize: z.number(),
  packUnit: z.enum(packUnits),
  unitPriceMinor: z.number().int(),
  /** packs × unit price. */
  totalMinor: z.number().int(),
  grade: z.string().nullable(),
  purityPercent: z.number().nullable(),
  hazardous: z.boolean(),
  splittable: z.boolean(),
  /** packs × pack size, in the pack unit. */
  orderedQuantity: z.number(),
  claimedQuantity: z.number(),
  unclaimedQuantity: z.number(),
  /** Its part of the line price and of the fees while nobody claims it. */
  unclaimedMinor: z.number().int(),
  /** The smallest step a claim may take, in the pack unit (`claimStep`). */
  claimStep: z.number(),
});
export type OrderLine = z.infer<typeof orderLineSchema>;

export const orderShareSchema = z.object({
  id: z.number().int(),
  lineId: z.number().int(),
  /** The member; null for the lab's own share. */
  member: personSchema.nullable(),
  forLab: z.boolean(),
  quantity: z.number(),
  unit: z.enum(packUnits),
  /** Fixed once claims close; before, the current estimate (it moves as others claim). */
  amountMinor: z.number().int(),
  amountFixed: z.boolean(),
  paymentStatus: z.enum(sharePaymentStatuses),
  paidMinor: z.number().int(),
  refundedMinor: z.number().int(),
  /** The caller's own share. */
  mine: z.boolean(),
  /** The caller may change or withdraw it (their own, claims open). */
  mayEdit: z.boolean(),
  /** The caller may pay it online now. */
  mayPay: z.boolean(),
  /** The caller may record cash (or, for the lab's share, lab funds) for it now. */
  mayRecordPayment: z.boolean(),
});
export type OrderShare = z.infer<typeof orderShareSchema>;

/** What the caller may do with the order now; the page shows only these actions. */
export const orderAbilitiesSchema = z.object({
  mayClaim: z.boolean(),
  mayManage: z.boolean(),
  mayEditDraft: z.boolean(),
  mayEditLines: z.boolean(),
  mayOpen: z.boolean(),
  mayTakeRemainder: z.boolean(),
  mayCloseClaims: z.boolean(),
  mayMarkOrdered: z.boolean(),
  mayRecordInvoice: z.boolean(),
  mayCancel: z.boolean(),
});
export type OrderAbilities = z.infer<typeof orderAbilitiesSchema>;

/** `GET /api/orders/:id`: the order with its lines, shares, money and what the caller may do. */
export const orderDetailSchema = orderSummarySchema.extend({
  supplier: z.object({
    id: z.number().int(),
    name: z.string(),
    orderingNotes: z.string(),
    minimumOrderMinor: z.number().int(),
  }),
  notes: z.string(),
  supplierReference: z.string(),
  supplierInvoiceMinor: z.number().int().nullable(),
  cancelReason: z.string(),
  openedAt: z.string().nullable(),
  orderedAt: z.string().nullable(),
  receivedAt: z.string().nullable(),
  closedAt: z.string().nullable(),
  cancelledAt: z.string().nullable(),
  claimsOpen: z.boolean(),
  paymentsOpen: z.boolean(),
  goodsMinor: z.number().int(),
  shippingFeeMinor: z.number().int(),
  /** Charged only when a line is hazardous goods (0 otherwise). */
  hazardousFeeMinor: z.number().int(),
  feesMinor: z.number().int(),
  /** Paid in, before refunds. */
  collectedMinor: z.number().int(),
  refundedMinor: z.number().int(),
  /** What the shares still owe (fixed amounts minus what was paid). */
  owedMinor: z.number().int(),
  lines: z.array(orderLineSchema),
  shares: z.array(orderShareSchema),
  abilities: orderAbilitiesSchema,
  safetyDeferral: z.string(),
  /** Watched or restricted chemicals on the lines and the approval they need. Always sent. */
  watch: orderWatchSchema.optional(),
});
export type OrderDetail = z.infer<typeof orderDetailSchema>;
