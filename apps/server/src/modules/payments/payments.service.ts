import {
  can,
  paymentAuditActions,
  type CashPaymentBody,
  type CheckoutAnswer,
  type RefundSummary,
  type SharePaymentState,
  type User,
} from '@lotwise/shared';
import Stripe from 'stripe';
import type { Config } from '../../config';
import { nowIso } from '../../db/sql';
import type { Repositories, Store } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { Logger } from '../../lib/logger';
import { createPaymentClient, isProviderUnavailable, type PaymentClient } from '../../lib/payments';
import type { AlertsService } from '../alerts/alerts.service';
import { fundIfAllPaid, paymentsOpen } from '../orders/order-lifecycle';
import type { OrderShareRow } from '../orders/order-share.entity';
import type { OrderRow } from '../orders/order.entity';
import type { PaymentRow } from './payment.entity';
import { paymentMessages } from './payment-messages';
import { paymentWebhooks } from './payment-webhooks';
import { refundableOf, settleShare } from './share-money';

type PaymentsConfig = Pick<Config, 'publicUrl' | 'payments' | 'text'>;

export interface PaymentsServiceOptions {
  alerts: AlertsService;
  logger: Logger;
}

/** The idempotency key of a share's n-th checkout: a double click or a restart reuses it. */
export const checkoutKey = (shareId: number, attempt: number) =>
  `lotwise-share-${shareId}-checkout-${attempt}`;
/** The idempotency key of the refund of one payment of a share. */
export const refundKey = (shareId: number, paymentId: number) =>
  `lotwise-share-${shareId}-refund-payment-${paymentId}`;

async function loadShare(repos: Repositories, orderId: number, shareId: number) {
  const order = await repos.orders.findOrder(orderId);
  if (!order) throw AppError.notFound(`There is no order #${orderId}.`);
  const share = await repos.orders.findShare(shareId);
  if (!share || share.orderId !== orderId) {
    throw AppError.notFound(`Order #${orderId} has no share #${shareId}.`);
  }
  return { order, share };
}

function state(order: OrderRow, share: OrderShareRow): SharePaymentState {
  return {
    orderId: order.id,
    shareId: share.id,
    paymentStatus: share.paymentStatus,
    amountMinor: share.amountMinor ?? 0,
    paidMinor: share.paidMinor,
    refundedMinor: share.refundedMinor,
    currency: order.currency,
    orderStatus: order.status,
  };
}

/** Refuses (409) paying a share that cannot take money now; answers its fixed amount. */
function payableAmount(order: OrderRow, share: OrderShareRow): number {
  if (order.status === 'cancelled') throw AppError.conflict('This order was cancelled.');
  if (!paymentsOpen(order)) {
    throw AppError.conflict(
      order.status === 'open'
        ? 'Members pay once the coordinator has closed the claims: until then the amounts can still change.'
        : `This order is ${order.status} and takes no more payments.`,
    );
  }
  if (share.paymentStatus === 'paid' || share.paymentStatus === 'refunded') {
    throw AppError.conflict('This share is already paid.');
  }
  if (share.amountMinor === null) throw AppError.conflict('This share has no fixed amount yet.');
  if (share.amountMinor <= 0)
    throw AppError.conflict('This share costs nothing: there is nothing to pay.');
  return share.amountMinor;
}

/**
 * Payments of shares: card checkouts through the provider's SDK, cash recorded by a
 * coordinator, refunds when an order is cancelled, and the provider's webhooks. Money only
 * becomes "paid" from a signed webhook or a coordinator's cash entry, and amounts always come
 * from the share, never from the browser.
 */
export function paymentsService(
  store: Store,
  config: PaymentsConfig,
  options: PaymentsServiceOptions,
) {
  const { alerts, logger } = options;
  const client: PaymentClient | null = config.payments
    ? createPaymentClient(config.payments)
    : null;
  const messages = paymentMessages(config.text);

  function provider(): PaymentClient {
    if (!client) {
      throw new AppError(
        'payment_provider_unavailable',
        'Card payments are not set up on this Lotwise. A coordinator can record a cash payment instead.',
      );
    }
    return client;
  }

  /** The error a person sees when the provider could not do what was asked; logged for the admin. */
  function providerFailure(error: unknown, what: string): AppError {
    if (error instanceof AppError) return error;
    const message = error instanceof Error ? error.message : String(error);
    if (error instanceof Stripe.errors.StripeAuthenticationError) {
      logger.error(
        `The payment service refused Lotwise's key while ${what}: check STRIPE_SECRET_KEY`,
      );
    } else if (isProviderUnavailable(error)) {
      logger.warn(`The payment service did not answer while ${what}`, { message });
    } else {
      logger.error(`The payment service refused a request while ${what}`, { message });
    }
    return new AppError(
      'payment_provider_unavailable',
      'The payment service could not be reached, so nothing was charged and nothing was recorded as paid. Please try again in a few minutes.',
    );
  }

  async function markExpired(paymentId: number) {
    await store.transaction(async (repos) => {
      const payment = await repos.payments.findById(paymentId);
      if (!payment || (payment.status !== 'pending' && payment.status !== 'failed')) return;
      const now = nowIso();
      await repos.payments.update(paymentId, { status: 'expired', updatedAt: now });
      const share = await repos.orders.findShare(payment.shareId);
      if (share) await settleShare(repos, share, now);
    });
  }

  /**
   * Closes a checkout session that must not take money any more (an earlier attempt, or a
   * share paid in cash). Throws 409 when it turns out to have been paid meanwhile.
   */
  async function closeSession(stripe: PaymentClient, payment: PaymentRow): Promise<void> {
    const sessionId = payment.providerSessionId!;
    try {
      await stripe.checkout.sessions.expire(sessionId);
    } catch (error) {
      if (!(error instanceof Stripe.errors.StripeInvalidRequestError)) {
        throw providerFailure(error, 'closing an earlier checkout');
      }
      const session = await stripe.checkout.sessions.retrieve(sessionId).catch((e: unknown) => {
        throw providerFailure(e, 'reading an earlier checkout');
      });
      if (session.status === 'complete') {
        throw AppError.conflict(
          'A card payment for this share has just gone through; Lotwise marks it paid as soon as the payment service confirms it (usually within seconds).',
        );
      }
    }
    await markExpired(payment.id);
  }

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

  const webhooks = paymentWebhooks({
    store,
    logger,
    alerts,
    messages,
    client,
    webhookSecret: config.payments?.webhookSecret ?? null,
    refundExtra: async (paymentId) => {
      if (client) await refundCardPayment(client, paymentId, 'duplicate');
    },
  });

  return {
    /**
     * Starts (or resumes) paying a share by card: answers the provider's hosted page. Each
     * attempt has a deterministic idempotency key, so a double click, a retry or a restart
     * while the provider answers gets the same session instead of a second one.
     */
    async checkout(actor: User, orderId: number, shareId: number): Promise<CheckoutAnswer> {
      const stripe = provider();
      for (let round = 0; round < 3; round++) {
        const plan = await store.transaction(async (repos) => {
          const { order, share } = await loadShare(repos, orderId, shareId);
          const mayPay =
            share.userId === actor.id || (share.forLab && can(actor.role, 'orders.manage'));
          if (!mayPay) {
            throw AppError.forbidden(
              share.forLab
                ? 'Only a coordinator can pay the lab’s share.'
                : 'Only the member who claimed this share can pay it by card; a coordinator can record a cash payment.',
            );
          }
          const amount = payableAmount(order, share);
          const checkouts = (await repos.payments.ofShare(share.id)).filter(
            (row) => row.kind === 'checkout',
          );
          const stale = checkouts.filter(
            (row) => row.status === 'failed' && row.providerSessionId !== null,
          );
          const latest = checkouts.at(-1);
          if (latest?.status === 'pending') return { order, share, payment: latest, stale };
          const now = nowIso();
          const attempt = (latest?.attempt ?? 0) + 1;
          const payment = await repos.payments.insert({
            orderId,
            shareId,
            kind: 'checkout',
            status: 'pending',
            amountMinor: amount,
            currency: order.currency,
            attempt,
            idempotencyKey: checkoutKey(shareId, attempt),
            providerSessionId: null,
            providerPaymentIntentId: null,
            providerRefundId: null,
            note: '',
            recordedById: actor.id,
            createdAt: now,
            updatedAt: now,
          });
          return { order, share, payment, stale };
        });
        // An earlier attempt's page must not take money once a new one exists.
        for (const old of plan.stale) await closeSession(stripe, old);

        const { order, share, payment } = plan;
        if (payment.providerSessionId) {
          const session = await stripe.checkout.sessions
            .retrieve(payment.providerSessionId)
            .catch((error: unknown) => {
              throw providerFailure(error, 'reading a checkout');
            });
          if (session.status === 'open' && session.url) return { url: session.url };
          if (session.status === 'complete') {
            throw AppError.conflict(
              'This share’s card payment has gone through; Lotwise marks it paid as soon as the payment service confirms it (usually within seconds).',
            );
          }
          await markExpired(payment.id);
          continue;
        }
        const metadata = {
          orderId: String(order.id),
          shareId: String(share.id),
          paymentId: String(payment.id),
        };
        const description = `Lotwise shared order #${order.id} "${order.title}": share #${share.id}`;
        const session = await stripe.checkout.sessions
          .create(
            {
              mode: 'payment',
              currency: order.currency.toLowerCase(),
              line_items: [
                {
                  quantity: 1,
                  price_data: {
                    currency: order.currency.toLowerCase(),
                    unit_amount: payment.amountMinor,
                    product_data: { name: description },
                  },
                },
              ],
              metadata,
              payment_intent_data: { metadata, description },
              client_reference_id: `share-${share.id}`,
              ...(share.userId === actor.id ? { customer_email: actor.email } : {}),
              success_url: `${config.publicUrl}/orders/${order.id}?paid=${share.id}`,
              cancel_url: `${config.publicUrl}/orders/${order.id}?cancelled=${share.id}`,
            },
            { idempotencyKey: payment.idempotencyKey! },
          )
          .catch((error: unknown) => {
            throw providerFailure(error, 'starting a checkout');
          });
        await store.transaction(async (repos) => {
          const now = nowIso();
          const current = await repos.payments.findById(payment.id);
          if (current?.status === 'pending' && current.providerSessionId === null) {
            await repos.payments.update(payment.id, {
              providerSessionId: session.id,
              updatedAt: now,
            });
          }
          const fresh = await repos.orders.findShare(share.id);
          if (fresh) await settleShare(repos, fresh, now);
        });
        if (!session.url)
          throw providerFailure(new Error('no page address'), 'starting a checkout');
        return { url: session.url };
      }
      throw AppError.conflict('The payment page could not be prepared; please try again.');
    },

    /**
     * A coordinator records money handed over in cash (or, for the lab's own share, paid from
     * the lab's funds). The amount is the share's; an open card checkout is closed first.
     */
    async recordCash(
      actor: User,
      orderId: number,
      shareId: number,
      body: CashPaymentBody,
    ): Promise<SharePaymentState> {
      const open = await store.transaction(async (repos) => {
        const { order, share } = await loadShare(repos, orderId, shareId);
        payableAmount(order, share);
        return (await repos.payments.ofShare(share.id)).filter(
          (row) =>
            row.kind === 'checkout' &&
            (row.status === 'pending' || row.status === 'failed') &&
            row.providerSessionId !== null,
        );
      });
      if (open.length > 0) {
        const stripe = provider();
        for (const payment of open) await closeSession(stripe, payment);
      }
      return store.transaction(async (repos) => {
        const { order, share } = await loadShare(repos, orderId, shareId);
        const amount = payableAmount(order, share);
        const now = nowIso();
        const kind = share.forLab ? 'lab_funds' : 'cash';
        const payment = await repos.payments.insert({
          orderId,
          shareId,
          kind,
          status: 'succeeded',
          amountMinor: amount,
          currency: order.currency,
          attempt: 0,
          idempotencyKey: null,
          providerSessionId: null,
          providerPaymentIntentId: null,
          providerRefundId: null,
          note: body.note,
          recordedById: actor.id,
          createdAt: now,
          updatedAt: now,
        });
        await settleShare(repos, share, now);
        await repos.audit.insert({
          actorId: actor.id,
          action: share.forLab
            ? paymentAuditActions.labFundsRecorded
            : paymentAuditActions.cashRecorded,
          targetType: 'order_share',
          targetId: share.id,
          detail: {
            orderId,
            paymentId: payment.id,
            amountMinor: amount,
            currency: order.currency,
            memberId: share.userId,
            note: body.note,
          },
          createdAt: now,
        });
        if (share.userId !== null) {
          await alerts.notify(
            repos,
            messages.paid(order, share.userId, amount, 'cash', payment.id),
          );
        }
        if (await fundIfAllPaid(repos, orderId, now)) {
          const members = (await repos.orders.sharesOf(orderId)).flatMap((s) =>
            s.userId === null ? [] : [s.userId],
          );
          await alerts.notify(repos, messages.funded(order, [...new Set(members)]));
        }
        const after = (await repos.orders.findShare(share.id))!;
        const orderAfter = (await repos.orders.findOrder(orderId))!;
        return state(orderAfter, after);
      });
    },

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
        await closeSession(client!, page).catch(() => undefined);
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

    /** The provider's webhook: verified, stored by event id, applied once. */
    receiveWebhook: webhooks.receive,
  };
}
export type PaymentsService = ReturnType<typeof paymentsService>;
