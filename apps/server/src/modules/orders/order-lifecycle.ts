import type { OrderStatus } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import type { OrderRow } from './order.entity';

/**
 * Which status an order may move to from which: the one rule every part of purchasing
 * (claims, payments, receiving, cancelling) checks before it changes an order.
 */
export const orderTransitions: Record<OrderStatus, readonly OrderStatus[]> = {
  draft: ['open', 'cancelled'],
  open: ['funded', 'cancelled'],
  funded: ['ordered', 'cancelled'],
  ordered: ['received', 'cancelled'],
  received: ['closed'],
  closed: [],
  cancelled: [],
};

/** Orders whose shares count as the member's own chemicals (not drafts, not cancelled). */
export const claimingStatuses: readonly OrderStatus[] = [
  'open',
  'funded',
  'ordered',
  'received',
  'closed',
];

export function mayMove(from: OrderStatus, to: OrderStatus): boolean {
  return orderTransitions[from].includes(to);
}

/** Members may claim: the order is open and its claims are not closed. */
export function claimsOpen(order: Pick<OrderRow, 'status' | 'claimsClosedAt'>): boolean {
  return order.status === 'open' && order.claimsClosedAt === null;
}

/** Members may pay: claims are closed (amounts are fixed) and the order is not cancelled. */
export function paymentsOpen(order: Pick<OrderRow, 'status' | 'claimsClosedAt'>): boolean {
  return order.status === 'open' && order.claimsClosedAt !== null;
}

/**
 * After a payment: an open order whose claims are closed and whose every share is paid
 * becomes funded. Runs inside the payment's transaction; answers whether it moved.
 */
export async function fundIfAllPaid(
  repos: Repositories,
  orderId: number,
  now: string,
): Promise<boolean> {
  const order = await repos.orders.findOrder(orderId);
  if (!order || !paymentsOpen(order)) return false;
  const shares = await repos.orders.sharesOf(orderId);
  if (shares.length === 0 || shares.some((share) => share.paymentStatus !== 'paid')) return false;
  await repos.orders.updateOrder(orderId, { status: 'funded', updatedAt: now });
  return true;
}
