import { formatMoney } from '@lotwise/shared';
import type { TextConfig } from '../../config';
import type { NotifyInput } from '../alerts/alerts.service';
import type { OrderRow } from '../orders/order.entity';

/** The e-mails of payments, in the server's text locale; each links to the order page. */
export function paymentMessages(text: TextConfig) {
  const money = (minor: number, currency: string) => formatMoney(minor, currency, text.locale);
  const about = (order: OrderRow) => `shared order #${order.id} "${order.title}"`;
  const link = (order: OrderRow) => `/orders/${order.id}`;
  return {
    paid(
      order: OrderRow,
      userId: number,
      amountMinor: number,
      how: 'card' | 'cash' | 'lab',
      paymentId: number,
    ): NotifyInput {
      const way =
        how === 'card'
          ? 'by card'
          : how === 'cash'
            ? 'in cash (recorded by the coordinator)'
            : 'from the lab’s funds';
      return {
        kind: 'order-payment',
        recipients: [userId],
        subject: `Payment received: ${money(amountMinor, order.currency)} for ${about(order)}`,
        text: `Your payment of ${money(amountMinor, order.currency)} ${way} for your share of ${about(order)} has been received. Keep this e-mail as your receipt.`,
        link: link(order),
        dedupKey: `payment-${paymentId}`,
      };
    },
    funded(order: OrderRow, userIds: number[]): NotifyInput {
      return {
        kind: 'order-funded',
        recipients: userIds,
        subject: `Fully paid: ${about(order)}`,
        text: `Every share of ${about(order)} is now paid. The coordinator can place the order with the supplier.`,
        link: link(order),
        dedupKey: `order-${order.id}-funded`,
      };
    },
    refunded(
      order: OrderRow,
      userId: number,
      amountMinor: number,
      refundRowId: number,
    ): NotifyInput {
      return {
        kind: 'order-cancelled',
        recipients: [userId],
        subject: `Refund: ${money(amountMinor, order.currency)} for ${about(order)}`,
        text: `${money(amountMinor, order.currency)} paid by card for your share of ${about(order)} has been refunded to your card. Your bank may take a few days to show it.`,
        link: link(order),
        dedupKey: `refund-${refundRowId}`,
      };
    },
    handBack(
      order: OrderRow,
      userId: number,
      amountMinor: number,
      refundRowId: number,
    ): NotifyInput {
      return {
        kind: 'order-cancelled',
        recipients: [userId],
        subject: `Cancelled: ${about(order)} — ${money(amountMinor, order.currency)} to give back`,
        text: `${about(order)} was cancelled. The ${money(amountMinor, order.currency)} you paid in cash will be handed back to you by the coordinator.`,
        link: link(order),
        dedupKey: `refund-${refundRowId}`,
      };
    },
    duplicateRefunded(
      order: OrderRow,
      userId: number,
      amountMinor: number,
      refundRowId: number,
    ): NotifyInput {
      return {
        kind: 'order-cancelled',
        recipients: [userId],
        subject: `Refund: ${money(amountMinor, order.currency)} paid twice for ${about(order)}`,
        text: `Your share of ${about(order)} was already paid (or the order can no longer take payments), so the card payment of ${money(amountMinor, order.currency)} has been refunded.`,
        link: link(order),
        dedupKey: `refund-${refundRowId}`,
      };
    },
  };
}
