import type Stripe from 'stripe';
import { nowIso } from '../../db/sql';
import type { Repositories, Store } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { Logger } from '../../lib/logger';
import { verifyWebhook, WebhookSignatureError, type PaymentClient } from '../../lib/payments';
import type { AlertsService } from '../alerts/alerts.service';
import { fundIfAllPaid } from '../orders/order-lifecycle';
import type { PaymentRow } from './payment.entity';
import type { paymentMessages } from './payment-messages';
import { refundableOf, settleShare, shareMoney } from './share-money';

interface WebhookDeps {
  store: Store;
  logger: Logger;
  alerts: AlertsService;
  messages: ReturnType<typeof paymentMessages>;
  client: PaymentClient | null;
  webhookSecret: string | null;
  /** Gives back a card payment that arrived for a share already paid (or an order closed to payments). */
  refundExtra(paymentId: number): Promise<void>;
}

interface Handled {
  outcome: string;
  /** Work after the transaction committed (calls to the provider). */
  after?: () => Promise<void>;
}

const idOf = (value: string | { id: string } | null | undefined): string | null =>
  value == null ? null : typeof value === 'string' ? value : value.id;

/**
 * The provider's webhooks. Each event is verified over the raw body, then applied and stored
 * by its id in one transaction: a replay finds the id and changes nothing.
 */
export function paymentWebhooks(deps: WebhookDeps) {
  const { store, logger, alerts, messages } = deps;

  /** The checkout row an event is about: by session id, else by the ids Lotwise put in metadata. */
  async function checkoutRow(
    repos: Repositories,
    sessionId: string | null,
    metadata: Record<string, string> | null | undefined,
  ): Promise<PaymentRow | null> {
    if (sessionId) {
      const found = await repos.payments.findBySession(sessionId);
      if (found) return found;
    }
    const paymentId = Number(metadata?.paymentId);
    if (!Number.isSafeInteger(paymentId) || paymentId <= 0) return null;
    const found = await repos.payments.findById(paymentId);
    return found && found.kind === 'checkout' && String(found.shareId) === metadata?.shareId
      ? found
      : null;
  }

  async function sessionCompleted(
    repos: Repositories,
    session: Stripe.Checkout.Session,
    now: string,
  ): Promise<Handled> {
    const payment = await checkoutRow(repos, session.id, session.metadata);
    if (!payment) return { outcome: 'not a checkout of Lotwise' };
    if (session.payment_status !== 'paid') return { outcome: 'completed, payment not yet taken' };
    if (payment.status === 'succeeded')
      return { outcome: `payment #${payment.id} already recorded` };
    const share = await repos.orders.findShare(payment.shareId);
    const order = await repos.orders.findOrder(payment.orderId);
    if (!share || !order) return { outcome: 'share no longer exists' };
    const before = shareMoney(share.amountMinor, await repos.payments.ofShare(share.id));
    const amount = session.amount_total ?? payment.amountMinor;
    if (amount !== payment.amountMinor || session.currency?.toUpperCase() !== payment.currency) {
      logger.error('A checkout was paid with another amount than the share asked for', {
        paymentId: payment.id,
        asked: payment.amountMinor,
        paid: amount,
        currency: session.currency,
      });
    }
    await repos.payments.update(payment.id, {
      status: 'succeeded',
      amountMinor: amount,
      providerSessionId: session.id,
      providerPaymentIntentId: idOf(session.payment_intent),
      note: payment.note ? `${payment.note}; then paid` : '',
      updatedAt: now,
    });
    await settleShare(repos, share, now);
    const extra =
      before.paymentStatus === 'paid' ||
      before.paymentStatus === 'refunded' ||
      order.status !== 'open';
    if (extra) {
      return {
        outcome: `payment #${payment.id} came for a share already paid or an order not taking payments: refunded`,
        after: () => deps.refundExtra(payment.id),
      };
    }
    if (share.userId !== null) {
      await alerts.notify(repos, messages.paid(order, share.userId, amount, 'card', payment.id));
    }
    if (await fundIfAllPaid(repos, order.id, now)) {
      const members = (await repos.orders.sharesOf(order.id)).flatMap((s) =>
        s.userId === null ? [] : [s.userId],
      );
      await alerts.notify(repos, messages.funded(order, [...new Set(members)]));
      return { outcome: `payment #${payment.id} recorded; order funded` };
    }
    return { outcome: `payment #${payment.id} recorded` };
  }

  async function sessionExpired(
    repos: Repositories,
    session: Stripe.Checkout.Session,
    now: string,
  ): Promise<Handled> {
    const payment = await checkoutRow(repos, session.id, session.metadata);
    if (!payment) return { outcome: 'not a checkout of Lotwise' };
    if (payment.status !== 'pending' && payment.status !== 'failed') {
      return { outcome: `payment #${payment.id} is ${payment.status}: unchanged` };
    }
    await repos.payments.update(payment.id, { status: 'expired', updatedAt: now });
    const share = await repos.orders.findShare(payment.shareId);
    if (share) await settleShare(repos, share, now);
    return { outcome: `payment #${payment.id} expired; the share is payable again` };
  }

  async function paymentFailed(
    repos: Repositories,
    intent: Stripe.PaymentIntent,
    now: string,
  ): Promise<Handled> {
    const payment = await checkoutRow(repos, null, intent.metadata);
    if (!payment) return { outcome: 'not a payment of Lotwise' };
    if (payment.status !== 'pending') {
      return { outcome: `payment #${payment.id} is ${payment.status}: unchanged` };
    }
    const reason = intent.last_payment_error?.message ?? 'declined';
    await repos.payments.update(payment.id, {
      status: 'failed',
      providerPaymentIntentId: intent.id,
      note: `Declined: ${reason}`.slice(0, 500),
      updatedAt: now,
    });
    const share = await repos.orders.findShare(payment.shareId);
    if (share) await settleShare(repos, share, now);
    return { outcome: `payment #${payment.id} declined; the share is payable again` };
  }

  async function chargeRefunded(
    repos: Repositories,
    charge: Stripe.Charge,
    now: string,
  ): Promise<Handled> {
    const intentId = idOf(charge.payment_intent);
    if (!intentId) return { outcome: 'no payment named' };
    const rows = await repos.payments.ofPaymentIntent(intentId);
    const paid = rows.find((row) => row.kind === 'checkout' && row.status === 'succeeded');
    if (!paid) return { outcome: 'not a payment of Lotwise' };
    // Refunds Lotwise asked for are recorded before the request; only the rest is new.
    const alreadyRecorded = paid.amountMinor - refundableOf(paid, rows);
    const fresh = charge.amount_refunded - alreadyRecorded;
    if (fresh <= 0) return { outcome: `refunds of payment #${paid.id} already recorded` };
    const refund = await repos.payments.insert({
      orderId: paid.orderId,
      shareId: paid.shareId,
      kind: 'refund',
      status: 'succeeded',
      amountMinor: fresh,
      currency: paid.currency,
      attempt: paid.attempt,
      idempotencyKey: null,
      providerSessionId: null,
      providerPaymentIntentId: intentId,
      providerRefundId: null,
      note: 'Refunded at the payment service',
      recordedById: null,
      createdAt: now,
      updatedAt: now,
    });
    const share = await repos.orders.findShare(paid.shareId);
    const order = await repos.orders.findOrder(paid.orderId);
    if (share) await settleShare(repos, share, now);
    if (share?.userId != null && order) {
      await alerts.notify(repos, messages.refunded(order, share.userId, fresh, refund.id));
    }
    return { outcome: `refund of ${fresh} recorded for payment #${paid.id}` };
  }

  async function apply(repos: Repositories, event: Stripe.Event, now: string): Promise<Handled> {
    switch (event.type) {
      case 'checkout.session.completed':
        return sessionCompleted(repos, event.data.object, now);
      case 'checkout.session.expired':
        return sessionExpired(repos, event.data.object, now);
      case 'payment_intent.payment_failed':
        return paymentFailed(repos, event.data.object, now);
      case 'charge.refunded':
        return chargeRefunded(repos, event.data.object, now);
      default:
        return { outcome: 'not used by Lotwise' };
    }
  }

  return {
    async receive(
      rawBody: unknown,
      signature: string | undefined,
    ): Promise<{ received: true; duplicate: boolean }> {
      if (!deps.client || !deps.webhookSecret) {
        logger.warn('A payment webhook arrived, but card payments are not set up');
        throw AppError.validation('Card payments are not set up on this Lotwise.');
      }
      let event: Stripe.Event;
      try {
        if (!Buffer.isBuffer(rawBody) || rawBody.length === 0) {
          throw new WebhookSignatureError('The webhook has no JSON body');
        }
        event = verifyWebhook(deps.client, rawBody, signature, deps.webhookSecret);
      } catch (error) {
        const reason = error instanceof Error ? error.message : String(error);
        logger.warn('Refused a payment webhook that is not signed by the payment service', {
          reason,
        });
        throw AppError.validation('The webhook signature is missing or does not match.');
      }
      const result = await store.transaction(async (repos) => {
        if (await repos.payments.findEvent(event.id)) return { duplicate: true } as const;
        const now = nowIso();
        const handled = await apply(repos, event, now);
        await repos.payments.insertEvent({
          id: event.id,
          type: event.type,
          outcome: handled.outcome,
          receivedAt: now,
        });
        return { duplicate: false, after: handled.after } as const;
      });
      if (!result.duplicate && result.after) {
        await result.after().catch((error: unknown) =>
          logger.error('Follow-up of a payment webhook failed', {
            eventId: event.id,
            message: error instanceof Error ? error.message : String(error),
          }),
        );
      }
      return { received: true, duplicate: result.duplicate };
    },
  };
}
