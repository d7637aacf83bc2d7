import { z } from 'zod';

/**
 * Paying shares of a shared order. The amount of a payment is never sent by the browser: the
 * server takes it from the share (fixed when claims closed).
 */

/** Answer of `POST /api/orders/:id/shares/:shareId/checkout`: the provider's hosted page to open. */
export const checkoutAnswerSchema = z.object({
  url: z.url(),
});
export type CheckoutAnswer = z.infer<typeof checkoutAnswerSchema>;

/** Body of `POST /api/orders/:id/shares/:shareId/cash-payment` (the amount is the share's). */
export const cashPaymentBodySchema = z
  .object({
    /** Who handed over the money and when, for the books. */
    note: z
      .string()
      .trim()
      .min(1, 'say who paid and when, e.g. "handed to the technician on 3 March"')
      .max(500, 'must be at most 500 characters'),
  })
  .strict();
export type CashPaymentBody = z.infer<typeof cashPaymentBodySchema>;

/** Where one share's money stands after a payment was recorded. */
export const sharePaymentStateSchema = z.object({
  orderId: z.number().int(),
  shareId: z.number().int(),
  paymentStatus: z.enum(['unpaid', 'pending', 'paid', 'refunded']),
  amountMinor: z.number().int(),
  paidMinor: z.number().int(),
  refundedMinor: z.number().int(),
  currency: z.string(),
  /** The order's status afterwards (`funded` once every share is paid). */
  orderStatus: z.string(),
});
export type SharePaymentState = z.infer<typeof sharePaymentStateSchema>;

/** Answer of refunding a cancelled order's payments. */
export const refundSummarySchema = z.object({
  orderId: z.number().int(),
  /** Card payments given back through the provider. */
  refunded: z.array(
    z.object({ shareId: z.number().int(), amountMinor: z.number().int(), refundId: z.string() }),
  ),
  /** Cash (or lab funds) the coordinator hands back: recorded as pending refunds. */
  handBack: z.array(z.object({ shareId: z.number().int(), amountMinor: z.number().int() })),
  /** Card refunds the provider did not take now; refunding again retries them safely. */
  failed: z.array(z.object({ shareId: z.number().int(), message: z.string() })),
});
export type RefundSummary = z.infer<typeof refundSummarySchema>;

/** Audit trail actions of payments (target type `order_share`). */
export const paymentAuditActions = {
  cashRecorded: 'payment.cash_recorded',
  labFundsRecorded: 'payment.lab_funds_recorded',
  refundsIssued: 'payment.refunds_issued',
} as const;
