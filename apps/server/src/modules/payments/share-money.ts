import type { SharePaymentStatus } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import type { OrderShareRow } from '../orders/order-share.entity';
import type { PaymentRow } from './payment.entity';

export interface ShareMoney {
  paidMinor: number;
  refundedMinor: number;
  paymentStatus: SharePaymentStatus;
}

/**
 * Where a share's money stands, worked out from its payment rows alone — the one rule, so
 * events arriving late, twice or out of order cannot leave a share in a state its money trail
 * does not show. Paid: what came in covers the amount; refunded: everything that came in went
 * back; pending: a checkout is waiting on the provider's page; else unpaid (payable).
 */
export function shareMoney(amountMinor: number | null, rows: PaymentRow[]): ShareMoney {
  const succeeded = rows.filter((row) => row.status === 'succeeded');
  const paidMinor = succeeded
    .filter((row) => row.kind !== 'refund')
    .reduce((sum, row) => sum + row.amountMinor, 0);
  const refundedMinor = succeeded
    .filter((row) => row.kind === 'refund')
    .reduce((sum, row) => sum + row.amountMinor, 0);
  const waiting = rows.some(
    (row) => row.kind === 'checkout' && row.status === 'pending' && row.providerSessionId !== null,
  );
  const paymentStatus: SharePaymentStatus =
    paidMinor > 0 && refundedMinor >= paidMinor
      ? 'refunded'
      : amountMinor !== null && paidMinor > 0 && paidMinor >= amountMinor
        ? 'paid'
        : waiting
          ? 'pending'
          : 'unpaid';
  return { paidMinor, refundedMinor, paymentStatus };
}

/** Writes the share's money as its payment rows say (inside the caller's transaction). */
export async function settleShare(
  repos: Repositories,
  share: OrderShareRow,
  now: string,
): Promise<ShareMoney> {
  const money = shareMoney(share.amountMinor, await repos.payments.ofShare(share.id));
  if (
    money.paidMinor !== share.paidMinor ||
    money.refundedMinor !== share.refundedMinor ||
    money.paymentStatus !== share.paymentStatus
  ) {
    await repos.orders.updateShare(share.id, { ...money, updatedAt: now });
  }
  return money;
}

/** What is still refundable of a paid provider payment: paid minus refunds not failed. */
export function refundableOf(payment: PaymentRow, rowsOfIntent: PaymentRow[]): number {
  const refunds = rowsOfIntent
    .filter((row) => row.kind === 'refund' && row.status !== 'failed' && row.status !== 'expired')
    .reduce((sum, row) => sum + row.amountMinor, 0);
  return Math.max(0, payment.amountMinor - refunds);
}
