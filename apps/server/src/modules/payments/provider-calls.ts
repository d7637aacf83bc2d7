import Stripe from 'stripe';
import { nowIso } from '../../db/sql';
import type { Store } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { Logger } from '../../lib/logger';
import { isProviderUnavailable, type PaymentClient } from '../../lib/payments';
import type { PaymentRow } from './payment.entity';
import { settleShare } from './share-money';

/** What checkouts and refunds share: turning provider faults into one error, closing pages. */
export function providerCalls(store: Store, logger: Logger) {
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
      return new AppError(
        'payment_provider_unavailable',
        `The payment service refused this payment (${message}), so nothing was charged and nothing was recorded as paid. A coordinator can record a cash payment instead.`,
      );
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

  return { providerFailure, markExpired, closeSession };
}
export type ProviderCalls = ReturnType<typeof providerCalls>;
