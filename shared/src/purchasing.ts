/**
 * The words of shared purchasing that every part (suppliers, requests, orders, payments,
 * receiving) uses. Each part's request and response schemas live in its own file.
 */

/**
 * A shared order's life: a coordinator drafts it, opens it for claims, closes the claims
 * (amounts are then fixed and members pay), it is funded when every share is paid, ordered
 * from the supplier, received into stock, and closed. It can be cancelled until received.
 */
export const orderStatuses = [
  'draft',
  'open',
  'funded',
  'ordered',
  'received',
  'closed',
  'cancelled',
] as const;
export type OrderStatus = (typeof orderStatuses)[number];

export const orderStatusLabels: Record<OrderStatus, string> = {
  draft: 'Draft',
  open: 'Open',
  funded: 'Funded',
  ordered: 'Ordered',
  received: 'Received',
  closed: 'Closed',
  cancelled: 'Cancelled',
};

/** Orders that can still be cancelled (a received order's stock is already on the shelf). */
export const cancellableOrderStatuses: readonly OrderStatus[] = [
  'draft',
  'open',
  'funded',
  'ordered',
];

/**
 * How the supplier's fees (shipping, hazardous-goods) are shared: in proportion to the value of
 * each share (the default), equally per member, or in proportion to each share's mass.
 */
export const feeRules = ['value', 'member', 'mass'] as const;
export type FeeRule = (typeof feeRules)[number];

export const feeRuleLabels: Record<FeeRule, string> = {
  value: 'By value of each share',
  member: 'Equally per member',
  mass: 'By mass of each share',
};

/**
 * Where a share's money stands. `pending`: a checkout was started and not yet finished or
 * given up; `refunded`: paid and given back in full.
 */
export const sharePaymentStatuses = ['unpaid', 'pending', 'paid', 'refunded'] as const;
export type SharePaymentStatus = (typeof sharePaymentStatuses)[number];

export const sharePaymentStatusLabels: Record<SharePaymentStatus, string> = {
  unpaid: 'Not paid',
  pending: 'Payment started',
  paid: 'Paid',
  refunded: 'Refunded',
};

/** How money moved for a share: online checkout, cash to the coordinator, the lab's own funds, a refund. */
export const paymentKinds = ['checkout', 'cash', 'lab_funds', 'refund'] as const;
export type PaymentKind = (typeof paymentKinds)[number];

export const paymentStatuses = ['pending', 'succeeded', 'failed', 'expired'] as const;
export type PaymentStatus = (typeof paymentStatuses)[number];

/** A member's request for a chemical: open until folded into an order, withdrawn or declined. */
export const requestStatuses = ['open', 'folded', 'withdrawn', 'declined'] as const;
export type RequestStatus = (typeof requestStatuses)[number];

export const requestStatusLabels: Record<RequestStatus, string> = {
  open: 'Open',
  folded: 'In an order',
  withdrawn: 'Withdrawn',
  declined: 'Declined',
};

/** Units a catalogue pack is sold in: by mass or by volume. */
export const packUnits = ['g', 'kg', 'mg', 'mL', 'L'] as const;
export type PackUnit = (typeof packUnits)[number];
