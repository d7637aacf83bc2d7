import {
  can,
  paymentAuditActions,
  type CashPaymentBody,
  type CheckoutAnswer,
  type SharePaymentState,
  type User,
} from '@lotwise/shared';
import type { Config } from '../../config';
import { nowIso } from '../../db/sql';
import type { Repositories, Store } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { Logger } from '../../lib/logger';
import { createPaymentClient, type PaymentClient } from '../../lib/payments';
import type { AlertsService } from '../alerts/alerts.service';
import { fundIfAllPaid, paymentsOpen } from '../orders/order-lifecycle';
import type { OrderShareRow } from '../orders/order-share.entity';
import type { OrderRow } from '../orders/order.entity';
import { paymentMessages } from './payment-messages';
import { paymentRefunds } from './payment-refunds';
import { paymentWebhooks } from './payment-webhooks';
import { providerCalls } from './provider-calls';
import { settleShare } from './share-money';

type PaymentsConfig = Pick<Config, 'publicUrl' | 'payments' | 'text'>;

export interface PaymentsServiceOptions {
  alerts: AlertsService;
  logger: Logger;
}

/** The idempotency key of a share's n-th checkout: a double click or a restart reuses it. */
export const checkoutKey = (shareId: number, attempt: number) =>
  `lotwise-share-${shareId}-checkout-${attempt}`;
export { refundKey } from './payment-refunds';

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

  const calls = providerCalls(store, logger);
  const { providerFailure, markExpired, closeSession } = calls;
  const refunds = paymentRefunds({ store, alerts, logger, messages, client, calls, provider });
  const { refundCardPayment } = refunds;

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

    refundPaidShares: refunds.refundPaidShares,

    /** The provider's webhook: verified, stored by event id, applied once. */
    receiveWebhook: webhooks.receive,
  };
}
export type PaymentsService = ReturnType<typeof paymentsService>;
