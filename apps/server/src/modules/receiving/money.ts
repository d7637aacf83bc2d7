import type { MoneyFigures, MoneyMovement } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { OrderRow } from '../orders/order.entity';
import type { OrderRecord } from '../orders/orders.repository';
import type { OrderShareRow } from '../orders/order-share.entity';
import type { PaymentRow } from '../payments/payment.entity';

/**
 * Where the money of shares stands, read from the payment rows: collected is every succeeded
 * checkout, cash or lab-funds payment, refunded every succeeded refund. Owed is the share's
 * fixed amount not yet collected; nothing is owed on a cancelled order or while the amount is
 * not fixed (claims open). Integers throughout, so sums of rows equal the totals exactly.
 */
export function shareFigures(
  order: Pick<OrderRow, 'status'>,
  share: Pick<OrderShareRow, 'id' | 'amountMinor'>,
  payments: readonly PaymentRow[],
): MoneyFigures {
  let collectedMinor = 0;
  let refundedMinor = 0;
  for (const payment of payments) {
    if (payment.shareId !== share.id || payment.status !== 'succeeded') continue;
    if (payment.kind === 'refund') refundedMinor += payment.amountMinor;
    else collectedMinor += payment.amountMinor;
  }
  const owedMinor =
    order.status === 'cancelled' || share.amountMinor === null
      ? 0
      : Math.max(0, share.amountMinor - collectedMinor);
  return { amountMinor: share.amountMinor, collectedMinor, refundedMinor, owedMinor };
}

/** The sum of several shares' figures; the amount is null only when every one is. */
export function sumFigures(figures: readonly MoneyFigures[]): MoneyFigures {
  const fixed = figures.filter((f) => f.amountMinor !== null);
  return {
    amountMinor: fixed.length === 0 ? null : fixed.reduce((sum, f) => sum + f.amountMinor!, 0),
    collectedMinor: figures.reduce((sum, f) => sum + f.collectedMinor, 0),
    refundedMinor: figures.reduce((sum, f) => sum + f.refundedMinor, 0),
    owedMinor: figures.reduce((sum, f) => sum + f.owedMinor, 0),
  };
}

/** Succeeded payment rows as movements: money in, and refunds, apart. */
export function movementsOf(payments: readonly PaymentRow[]): {
  payments: MoneyMovement[];
  refunds: MoneyMovement[];
} {
  const succeeded = payments
    .filter((payment) => payment.status === 'succeeded')
    .map((payment): MoneyMovement => ({
      id: payment.id,
      shareId: payment.shareId,
      kind: payment.kind,
      amountMinor: payment.amountMinor,
      at: payment.updatedAt,
      note: payment.note,
    }));
  return {
    payments: succeeded.filter((m) => m.kind !== 'refund'),
    refunds: succeeded.filter((m) => m.kind === 'refund'),
  };
}

/**
 * What still stands in the way of closing a received order, in plain words: money owed, a
 * payment or refund still in flight. Empty when it may close.
 */
export function closeBlockers(
  order: Pick<OrderRow, 'status'>,
  shares: readonly Pick<OrderShareRow, 'id' | 'amountMinor'>[],
  payments: readonly PaymentRow[],
  holderOf: (shareId: number) => string,
): string[] {
  const blockers: string[] = [];
  if (order.status !== 'received') {
    blockers.push(
      order.status === 'closed'
        ? 'The order is already closed.'
        : 'Only a received order can be closed: receive the delivery first.',
    );
  }
  const owing = shares.filter((share) => shareFigures(order, share, payments).owedMinor > 0);
  if (owing.length > 0) {
    blockers.push(`Still to pay: ${owing.map((share) => holderOf(share.id)).join(', ')}.`);
  }
  const inFlight = payments.filter((payment) => payment.status === 'pending');
  if (inFlight.some((payment) => payment.kind === 'refund')) {
    blockers.push('A refund is still being processed by the payment provider.');
  }
  if (inFlight.some((payment) => payment.kind !== 'refund')) {
    blockers.push('A payment is still being processed by the payment provider.');
  }
  return blockers;
}

/** The order with its lines, shares and cost; 404 for an unknown id. */
export async function requireOrder(repos: Repositories, id: number): Promise<OrderRecord> {
  const record = await repos.orders.load(id);
  if (!record) throw AppError.notFound(`There is no order #${id}.`);
  return record;
}
