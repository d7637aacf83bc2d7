import { paymentAuditActions, type RefundSummary, type User } from '@lotwise/shared';
import { nowIso } from '../../db/sql';
import type { Store } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { Logger } from '../../lib/logger';
import type { PaymentClient } from '../../lib/payments';
import type { AlertsService } from '../alerts/alerts.service';
import type { paymentMessages } from './payment-messages';
import type { ProviderCalls } from './provider-calls';
import { refundableOf, settleShare } from './share-money';

/** The idempotency key of the refund of one payment of a share. */
export const refundKey = (shareId: number, paymentId: number) =>
  `lotwise-share-${shareId}-refund-payment-${paymentId}`;

interface RefundDeps {
  store: Store;
  alerts: AlertsService;
  logger: Logger;
  messages: ReturnType<typeof paymentMessages>;
  client: PaymentClient | null;
  calls: ProviderCalls;
  /** Throws the "payments are not set up" error. */
  provider(): PaymentClient;
}

/** Giving money back: one card payment, or everything paid for a cancelled order. */
export function paymentRefunds({
  store,
  alerts,
  logger,
  messages,
  client,
  calls,
  provider,
}: RefundDeps) {
  /** Gives one card payment back through the provider (all that is left of it). */
  async function refundCardPayment(
    stripe: PaymentClient,
    paymentId: number,
    reason: 'requested_by_customer' | 'duplicate',
  ): Promise<{ refunded: number; refundId: string } | { failed: string } | null> {
    const planned = await store.transaction(async (repos) => {
      const payment = await repos.payments.findById(paymentId);
      if (!payment?.providerPaymentIntentId || payment.status !== 'succeeded') return null;
      const amount = refundableOf(
        payment,
        await repos.payments.ofPaymentIntent(payment.providerPaymentIntentId),
      );
      if (amount <= 0) return null;
      const now = nowIso();
      // Recorded before asking, so a charge.refunded webhook arriving first is not counted twice.
      const refund = await repos.payments.insert({
        orderId: payment.orderId,
        shareId: payment.shareId,
        kind: 'refund',
        status: 'pending',
        amountMinor: amount,
        currency: payment.currency,
        attempt: payment.attempt,
        idempotencyKey: refundKey(payment.shareId, payment.id),
        providerSessionId: null,
        providerPaymentIntentId: payment.providerPaymentIntentId,
        providerRefundId: null,
        note:
          reason === 'duplicate'
            ? 'Paid twice: the extra payment is given back'
            : 'Order cancelled',
        recordedById: null,
        createdAt: now,
        updatedAt: now,
      });
      return { payment, refund };
    });
    if (!planned) return null;
    const { payment, refund } = planned;
    try {
      const answer = await stripe.refunds.create(
        {
          payment_intent: payment.providerPaymentIntentId!,
          amount: refund.amountMinor,
          reason,
          metadata: {
            orderId: String(payment.orderId),
            shareId: String(payment.shareId),
            paymentId: String(payment.id),
          },
        },
        { idempotencyKey: refund.idempotencyKey! },
      );
      await store.transaction(async (repos) => {
        const now = nowIso();
        await repos.payments.update(refund.id, {
          status: 'succeeded',
          providerRefundId: answer.id,
          updatedAt: now,
        });
        const share = await repos.orders.findShare(payment.shareId);
        const order = await repos.orders.findOrder(payment.orderId);
        if (!share || !order) return;
        await settleShare(repos, share, now);
        if (share.userId !== null) {
          const mail =
            reason === 'duplicate'
              ? messages.duplicateRefunded(order, share.userId, refund.amountMinor, refund.id)
              : messages.refunded(order, share.userId, refund.amountMinor, refund.id);
          await alerts.notify(repos, mail);
        }
      });
      return { refunded: refund.amountMinor, refundId: answer.id };
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      logger.warn('A refund was not taken by the payment service', {
        paymentId: payment.id,
        message,
      });
      await store.transaction((repos) =>
        repos.payments.update(refund.id, {
          status: 'failed',
          note: `${refund.note}; not taken: ${message}`.slice(0, 500),
          updatedAt: nowIso(),
        }),
      );
      return { failed: message };
    }
  }

  return {
    refundCardPayment,
    /**
     * Gives back what was paid for a cancelled order: every card payment through the provider
     * (one idempotency key per payment, so calling again after a failure never refunds twice),
     * and cash as refunds the coordinator hands back (recorded as pending). Open checkout
     * pages are closed first. Call it after the cancellation has been committed.
     */
    async refundPaidShares(orderId: number, actor: User | null): Promise<RefundSummary> {
      const { order, rows } = await store.transaction(async (repos) => {
        const found = await repos.orders.findOrder(orderId);
        if (!found) throw AppError.notFound(`There is no order #${orderId}.`);
        if (found.status !== 'cancelled') {
          throw AppError.conflict('Payments are refunded once the order is cancelled.');
        }
        return { order: found, rows: await repos.payments.ofOrder(orderId) };
      });
      const summary: RefundSummary = { orderId, refunded: [], handBack: [], failed: [] };
      const cardPayments = rows.filter(
        (row) => row.kind === 'checkout' && row.status === 'succeeded',
      );
      const openPages = rows.filter(
        (row) =>
          row.kind === 'checkout' &&
          (row.status === 'pending' || row.status === 'failed') &&
          row.providerSessionId !== null,
      );
      if ((cardPayments.length > 0 || openPages.length > 0) && !client) {
        throw provider();
      }
      for (const page of openPages) {
        // A page paid after all is refunded when its webhook arrives (the order is cancelled).
        await calls.closeSession(client!, page).catch(() => undefined);
      }
      for (const payment of cardPayments) {
        const result = await refundCardPayment(client!, payment.id, 'requested_by_customer');
        if (result && 'refundId' in result) {
          summary.refunded.push({
            shareId: payment.shareId,
            amountMinor: result.refunded,
            refundId: result.refundId,
          });
        } else if (result) {
          summary.failed.push({ shareId: payment.shareId, message: result.failed });
        }
      }
      await store.transaction(async (repos) => {
        const now = nowIso();
        const all = await repos.payments.ofOrder(orderId);
        for (const payment of all.filter(
          (row) => (row.kind === 'cash' || row.kind === 'lab_funds') && row.status === 'succeeded',
        )) {
          const key = refundKey(payment.shareId, payment.id);
          if (all.some((row) => row.idempotencyKey === key)) continue;
          const refund = await repos.payments.insert({
            orderId,
            shareId: payment.shareId,
            kind: 'refund',
            status: 'pending',
            amountMinor: payment.amountMinor,
            currency: payment.currency,
            attempt: 0,
            idempotencyKey: key,
            providerSessionId: null,
            providerPaymentIntentId: null,
            providerRefundId: null,
            note:
              payment.kind === 'cash'
                ? 'Order cancelled: to be handed back in cash by the coordinator'
                : 'Order cancelled: back to the lab’s funds',
            recordedById: actor?.id ?? null,
            createdAt: now,
            updatedAt: now,
          });
          summary.handBack.push({ shareId: payment.shareId, amountMinor: payment.amountMinor });
          const share = await repos.orders.findShare(payment.shareId);
          if (share?.userId != null) {
            await alerts.notify(
              repos,
              messages.handBack(order, share.userId, payment.amountMinor, refund.id),
            );
          }
        }
        if (summary.refunded.length + summary.handBack.length + summary.failed.length > 0) {
          await repos.audit.insert({
            actorId: actor?.id ?? null,
            action: paymentAuditActions.refundsIssued,
            targetType: 'order',
            targetId: orderId,
            detail: { ...summary },
            createdAt: now,
          });
        }
      });
      return summary;
    },
  };
}
