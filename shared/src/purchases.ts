import { z } from 'zod';
import { ghsCodeSchema } from './hazards';
import { orderStatuses, packUnits, paymentKinds, sharePaymentStatuses } from './purchasing';

/**
 * Where the money of shared orders stands: a member's own purchases and receipts, and the
 * coordinator's summary per order. Every amount is whole minor units of `currency`, read from
 * the shares' fixed amounts and the payment rows, so the figures add up to the cent:
 * owed = amount − collected (never below 0, and 0 on a cancelled order or while claims are
 * open), net = collected − refunded.
 */

const minor = z.number().int();

/** Money of one share or of a sum of shares. */
export const moneyFiguresSchema = z.object({
  /** The fixed amounts (null while claims are still open: nothing is owed yet). */
  amountMinor: minor.nullable(),
  /** Succeeded payments: online, cash and lab funds. */
  collectedMinor: minor,
  /** Succeeded refunds. */
  refundedMinor: minor,
  /** Fixed amounts not yet collected. */
  owedMinor: minor,
});
export type MoneyFigures = z.infer<typeof moneyFiguresSchema>;

/** One row of "My purchases". */
export const purchaseSummarySchema = moneyFiguresSchema.extend({
  orderId: z.number().int(),
  title: z.string(),
  supplierName: z.string(),
  status: z.enum(orderStatuses),
  currency: z.string(),
  shareCount: z.number().int(),
  updatedAt: z.string(),
});
export type PurchaseSummary = z.infer<typeof purchaseSummarySchema>;

/** `GET /api/purchases`: the signed-in member's orders, newest first, with their totals. */
export const purchaseListSchema = z.object({
  currency: z.string(),
  items: z.array(purchaseSummarySchema),
  totals: moneyFiguresSchema.omit({ amountMinor: true }),
});
export type PurchaseList = z.infer<typeof purchaseListSchema>;

/** A movement of money on a receipt or in the coordinator's view. */
export const moneyMovementSchema = z.object({
  id: z.number().int(),
  shareId: z.number().int(),
  kind: z.enum(paymentKinds),
  amountMinor: minor,
  /** When it was recorded (ISO date-time). */
  at: z.string(),
  note: z.string(),
});
export type MoneyMovement = z.infer<typeof moneyMovementSchema>;

/** One share on a receipt: what was taken and what it cost, goods and fees apart. */
export const receiptLineSchema = z.object({
  shareId: z.number().int(),
  sku: z.string(),
  chemicalName: z.string(),
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.string()),
  quantity: z.number(),
  unit: z.enum(packUnits),
  goodsMinor: minor,
  feesMinor: minor,
  amountMinor: minor,
  paymentStatus: z.enum(sharePaymentStatuses),
  /** The container the portion became, once received. */
  labelCode: z.string().nullable(),
});
export type ReceiptLine = z.infer<typeof receiptLineSchema>;

/** `GET /api/orders/:id/receipt`: the signed-in member's receipt for one order. */
export const receiptSchema = z.object({
  labName: z.string(),
  orderId: z.number().int(),
  title: z.string(),
  status: z.enum(orderStatuses),
  currency: z.string(),
  supplier: z.object({ name: z.string(), reference: z.string() }),
  member: z.object({ id: z.number().int(), displayName: z.string(), email: z.string() }),
  /** When claims closed, it was ordered, received: the dates a receipt names. */
  claimsClosedAt: z.string().nullable(),
  orderedAt: z.string().nullable(),
  receivedAt: z.string().nullable(),
  lines: z.array(receiptLineSchema),
  payments: z.array(moneyMovementSchema),
  refunds: z.array(moneyMovementSchema),
  totals: moneyFiguresSchema.extend({
    goodsMinor: minor,
    feesMinor: minor,
    /** collected − refunded: what the member has paid in the end. */
    netPaidMinor: minor,
  }),
  issuedAt: z.string(),
});
export type Receipt = z.infer<typeof receiptSchema>;

/** One share in the coordinator's money view. */
export const moneyShareRowSchema = moneyFiguresSchema.extend({
  shareId: z.number().int(),
  holder: z.string(),
  userId: z.number().int().nullable(),
  forLab: z.boolean(),
  sku: z.string(),
  chemicalName: z.string(),
  ghsPictograms: z.array(ghsCodeSchema),
  hazardStatements: z.array(z.string()),
  quantity: z.number(),
  unit: z.enum(packUnits),
  goodsMinor: minor,
  feesMinor: minor,
  paymentStatus: z.enum(sharePaymentStatuses),
});
export type MoneyShareRow = z.infer<typeof moneyShareRowSchema>;

/** `GET /api/orders/:id/money`: an order's money for its coordinator. */
export const orderMoneySchema = z.object({
  orderId: z.number().int(),
  title: z.string(),
  status: z.enum(orderStatuses),
  currency: z.string(),
  supplierName: z.string(),
  supplierReference: z.string(),
  /** Goods plus fees, as priced (what the shares add up to once claims are closed). */
  totalMinor: minor,
  goodsMinor: minor,
  feesMinor: minor,
  /** Part of the total no share pays yet (claims still open). */
  unclaimedMinor: minor,
  collectedMinor: minor,
  refundedMinor: minor,
  owedMinor: minor,
  /** collected − refunded. */
  netCollectedMinor: minor,
  /** The supplier's invoice, when recorded. */
  supplierInvoiceMinor: minor.nullable(),
  /** invoice − total: positive when the supplier billed more than the order's total. */
  invoiceDifferenceMinor: minor.nullable(),
  shares: z.array(moneyShareRowSchema),
  movements: z.array(moneyMovementSchema),
});
export type OrderMoney = z.infer<typeof orderMoneySchema>;
