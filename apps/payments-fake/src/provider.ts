import type Stripe from 'stripe';
import { FakeApiError } from './api-error';
import { newId, unixNow } from './ids';
import {
  charge as newCharge,
  checkoutSession,
  events,
  paymentIntent as newPaymentIntent,
  refund as newRefund,
  type EventContext,
  type LineItemInput,
} from './objects';
import {
  asParams,
  metadata,
  onlyKnown,
  optionalInteger,
  optionalString,
  requiredInteger,
  requiredString,
  type Params,
} from './params';
import type { WebhookSender } from './webhooks';

export interface ProviderOptions {
  /** Where the fake is reachable; the hosted checkout page lives under it. */
  baseUrl(): string;
  sender: WebhookSender;
  /** Lifetime of a Checkout Session without `expires_at`, in seconds (the provider's is 24 h). */
  sessionLifetimeSeconds: number;
}

/** What the person chose on the hosted checkout page. */
export type TestCard = 'succeeds' | 'declined';

const sessionParams = [
  'mode',
  'line_items',
  'metadata',
  'client_reference_id',
  'success_url',
  'cancel_url',
  'currency',
  'expires_at',
  'customer_email',
  'payment_intent_data',
  'payment_method_types',
  'expand',
  'locale',
] as const;

const refundParams = [
  'payment_intent',
  'charge',
  'amount',
  'metadata',
  'reason',
  'expand',
] as const;
const refundReasons = ['duplicate', 'fraudulent', 'requested_by_customer'] as const;

function isUrl(text: string): boolean {
  try {
    const url = new URL(text);
    return url.protocol === 'http:' || url.protocol === 'https:';
  } catch {
    return false;
  }
}

function currencyCode(text: string, param: string): string {
  if (!/^[a-zA-Z]{3}$/.test(text)) throw FakeApiError.invalid(`Invalid currency: ${text}`, param);
  return text.toLowerCase();
}

function listOf(value: unknown, param: string): Params[] {
  if (value === undefined || value === '') return [];
  const items = Array.isArray(value)
    ? value
    : typeof value === 'object' && value !== null
      ? Object.entries(value)
          .sort(([a], [b]) => Number(a) - Number(b))
          .map(([, item]) => item)
      : null;
  if (!items) throw FakeApiError.invalid('Invalid array', param);
  return items.map((item, index) => asParams(item, `${param}[${index}]`));
}

/**
 * The fake's state and rules: Checkout Sessions, PaymentIntents, charges and refunds, kept in
 * memory, with the events each change sends.
 */
export function fakeProvider(options: ProviderOptions) {
  const sessions = new Map<string, Stripe.Checkout.Session>();
  const intents = new Map<string, Stripe.PaymentIntent>();
  const charges = new Map<string, Stripe.Charge>();
  const refunds = new Map<string, Stripe.Refund>();
  /** `payment_intent_data` of each session, applied to the PaymentIntent its first attempt creates. */
  const intentData = new Map<
    string,
    { metadata: Record<string, string>; description: string | null }
  >();
  const descriptions = new Map<string, string[]>();

  function session(id: string, param = 'session'): Stripe.Checkout.Session {
    const found = sessions.get(id);
    if (!found) throw FakeApiError.noSuch('checkout.session', id, param);
    return found;
  }

  function intent(id: string, param = 'id'): Stripe.PaymentIntent {
    const found = intents.get(id);
    if (!found) throw FakeApiError.noSuch('payment_intent', id, param);
    return found;
  }

  function expanded(found: Stripe.Checkout.Session, expand: string[]): Stripe.Checkout.Session {
    const copy = structuredClone(found);
    if (expand.includes('payment_intent') && typeof copy.payment_intent === 'string') {
      copy.payment_intent = structuredClone(intent(copy.payment_intent));
    }
    return copy;
  }

  function expire(found: Stripe.Checkout.Session, context: EventContext) {
    found.status = 'expired';
    found.url = null;
    options.sender.send(events.sessionExpired(found, context));
  }

  /** The PaymentIntent of the session's payment attempts, created by the first one. */
  function intentFor(found: Stripe.Checkout.Session): Stripe.PaymentIntent {
    if (typeof found.payment_intent === 'string') return intent(found.payment_intent);
    const data = intentData.get(found.id) ?? { metadata: {}, description: null };
    const created = newPaymentIntent({
      amount: found.amount_total ?? 0,
      currency: found.currency ?? 'eur',
      metadata: data.metadata,
      description: data.description,
    });
    intents.set(created.id, created);
    found.payment_intent = created.id;
    return created;
  }

  return {
    createSession(body: Params, expand: string[]): Stripe.Checkout.Session {
      onlyKnown(body, sessionParams);
      const mode = requiredString(body, 'mode');
      if (mode !== 'payment') {
        throw FakeApiError.invalid(`This stand-in only takes mode=payment (got ${mode})`, 'mode');
      }
      const successUrl = requiredString(body, 'success_url');
      if (!isUrl(successUrl)) throw FakeApiError.invalid('Not a valid URL', 'success_url');
      const cancelUrl = optionalString(body, 'cancel_url');
      if (cancelUrl !== null && !isUrl(cancelUrl)) {
        throw FakeApiError.invalid('Not a valid URL', 'cancel_url');
      }
      const rawItems = listOf(body.line_items, 'line_items');
      if (rawItems.length === 0) throw FakeApiError.missingParam('line_items');
      let currency =
        body.currency === undefined
          ? null
          : currencyCode(requiredString(body, 'currency'), 'currency');
      const lineItems: LineItemInput[] = rawItems.map((item, index) => {
        const param = `line_items[${index}]`;
        onlyKnown(item, ['price_data', 'quantity'], param);
        const price = asParams(item.price_data, `${param}[price_data]`);
        if (Object.keys(price).length === 0) {
          throw FakeApiError.missingParam(`${param}[price_data]`);
        }
        onlyKnown(price, ['currency', 'unit_amount', 'product_data'], `${param}[price_data]`);
        const itemCurrency = currencyCode(
          requiredString(price, 'currency', `${param}[price_data][currency]`),
          `${param}[price_data][currency]`,
        );
        if (currency !== null && currency !== itemCurrency) {
          throw FakeApiError.invalid(
            'All line items must be in the currency of the session',
            `${param}[price_data][currency]`,
          );
        }
        currency = itemCurrency;
        const product = asParams(price.product_data, `${param}[price_data][product_data]`);
        onlyKnown(product, ['name', 'description'], `${param}[price_data][product_data]`);
        return {
          name: requiredString(product, 'name', `${param}[price_data][product_data][name]`),
          unitAmount: requiredInteger(price, 'unit_amount', `${param}[price_data][unit_amount]`),
          quantity: requiredInteger(item, 'quantity', `${param}[quantity]`, 1),
        };
      });
      const now = unixNow();
      const expiresAt = optionalInteger(body, 'expires_at');
      if (expiresAt !== null && (expiresAt < now + 1800 || expiresAt > now + 86400)) {
        throw FakeApiError.invalid(
          'The Checkout Session expires_at must be between 30 minutes and 24 hours from now',
          'expires_at',
        );
      }
      const clientReferenceId = optionalString(body, 'client_reference_id');
      if (clientReferenceId !== null && clientReferenceId.length > 200) {
        throw FakeApiError.invalid(
          'client_reference_id is longer than 200 characters',
          'client_reference_id',
        );
      }
      const intentParams = asParams(body.payment_intent_data, 'payment_intent_data');
      onlyKnown(intentParams, ['metadata', 'description'], 'payment_intent_data');
      const id = newId('cs_test');
      const created = checkoutSession({
        id,
        currency: currency ?? 'eur',
        lineItems,
        metadata: metadata(body, 'metadata'),
        clientReferenceId,
        successUrl,
        cancelUrl,
        customerEmail: optionalString(body, 'customer_email'),
        expiresAt: expiresAt ?? now + options.sessionLifetimeSeconds,
        url: `${options.baseUrl()}/pay/${id}`,
      });
      sessions.set(id, created);
      intentData.set(id, {
        metadata: metadata(intentParams, 'metadata', 'payment_intent_data[metadata]'),
        description: optionalString(
          intentParams,
          'description',
          'payment_intent_data[description]',
        ),
      });
      descriptions.set(
        id,
        lineItems.map((item) =>
          item.quantity > 1 ? `${item.quantity} × ${item.name}` : item.name,
        ),
      );
      return expanded(created, expand);
    },

    retrieveSession(id: string, expand: string[]): Stripe.Checkout.Session {
      return expanded(session(id, 'id'), expand);
    },

    expireSession(id: string, context: EventContext, expand: string[]): Stripe.Checkout.Session {
      const found = session(id, 'session');
      if (found.status !== 'open') {
        throw FakeApiError.invalid(
          `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${found.status}".`,
          null,
          'checkout_session_not_open',
        );
      }
      expire(found, context);
      return expanded(found, expand);
    },

    retrievePaymentIntent(id: string): Stripe.PaymentIntent {
      return structuredClone(intent(id));
    },

    retrieveRefund(id: string): Stripe.Refund {
      const found = refunds.get(id);
      if (!found) throw FakeApiError.noSuch('refund', id);
      return structuredClone(found);
    },

    createRefund(body: Params, context: EventContext): Stripe.Refund {
      onlyKnown(body, refundParams);
      const intentId = optionalString(body, 'payment_intent');
      const chargeId = optionalString(body, 'charge');
      if (!intentId && !chargeId) {
        throw FakeApiError.invalid(
          'One of the following params should be provided for this request: payment_intent or charge.',
          'payment_intent',
          'parameter_missing',
        );
      }
      let paid: Stripe.Charge | undefined;
      if (intentId) {
        const found = intent(intentId, 'payment_intent');
        if (found.status !== 'succeeded' || typeof found.latest_charge !== 'string') {
          throw FakeApiError.invalid(
            `This PaymentIntent (${found.id}) does not have a successful charge to refund.`,
            'payment_intent',
          );
        }
        paid = charges.get(found.latest_charge);
      } else {
        paid = charges.get(chargeId!);
        if (!paid) throw FakeApiError.noSuch('charge', chargeId!, 'charge');
      }
      if (!paid) throw FakeApiError.invalid('No charge to refund', 'payment_intent');
      const remaining = paid.amount - paid.amount_refunded;
      if (remaining === 0) {
        throw FakeApiError.invalid(
          `Charge ${paid.id} has already been refunded.`,
          null,
          'charge_already_refunded',
        );
      }
      const amount = optionalInteger(body, 'amount', 'amount', 1) ?? remaining;
      if (amount > remaining) {
        throw FakeApiError.invalid(
          `Refund amount (${amount}) is greater than unrefunded amount on charge (${remaining})`,
          'amount',
          'amount_too_large',
        );
      }
      const reason = optionalString(body, 'reason');
      if (reason !== null && !(refundReasons as readonly string[]).includes(reason)) {
        throw FakeApiError.invalid(
          `Invalid reason: must be one of ${refundReasons.join(', ')}`,
          'reason',
        );
      }
      const created = newRefund({
        amount,
        charge: paid,
        metadata: metadata(body, 'metadata'),
        reason: reason as Stripe.Refund.Reason | null,
      });
      refunds.set(created.id, created);
      const previous = { amount_refunded: paid.amount_refunded, refunded: paid.refunded };
      paid.amount_refunded += amount;
      paid.refunded = paid.amount_refunded === paid.amount;
      options.sender.send(events.refundCreated(created, context));
      options.sender.send(events.chargeRefunded(paid, previous, context));
      return structuredClone(created);
    },

    /** The hosted page's view of a session: what is paid for and how the last attempt went. */
    page(id: string) {
      const found = sessions.get(id);
      if (!found) return null;
      const paymentIntent =
        typeof found.payment_intent === 'string' ? intents.get(found.payment_intent) : undefined;
      return {
        session: structuredClone(found),
        items: descriptions.get(id) ?? [],
        lastError: paymentIntent?.last_payment_error?.message ?? null,
      };
    },

    /**
     * One payment attempt on the hosted page. A success completes the session and answers where
     * to send the browser; a decline leaves it open for another try.
     */
    attempt(id: string, card: TestCard, context: EventContext): { redirect: string | null } {
      const found = sessions.get(id);
      if (!found || found.status !== 'open') return { redirect: null };
      const paying = intentFor(found);
      if (card === 'declined') {
        paying.status = 'requires_payment_method';
        paying.last_payment_error = {
          type: 'card_error',
          code: 'card_declined',
          decline_code: 'generic_decline',
          message: 'Your card was declined.',
        };
        options.sender.send(events.paymentFailed(paying, context));
        return { redirect: null };
      }
      const paymentMethod = newId('pm');
      const paidCharge = newCharge(paying, paymentMethod);
      charges.set(paidCharge.id, paidCharge);
      paying.status = 'succeeded';
      paying.amount_received = paying.amount;
      paying.latest_charge = paidCharge.id;
      paying.payment_method = paymentMethod;
      paying.last_payment_error = null;
      found.status = 'complete';
      found.payment_status = 'paid';
      found.url = null;
      options.sender.send(events.paymentSucceeded(paying, context));
      options.sender.send(events.sessionCompleted(found, context));
      const redirect = (found.success_url ?? '').replaceAll('{CHECKOUT_SESSION_ID}', found.id);
      return { redirect };
    },

    /** Expires every open session whose `expires_at` has passed. */
    expireDue(context: EventContext, now = unixNow()): number {
      let count = 0;
      for (const found of sessions.values()) {
        if (found.status === 'open' && found.expires_at <= now) {
          expire(found, context);
          count++;
        }
      }
      return count;
    },

    /** Every session created so far, oldest first (tests count them). */
    sessions(): Stripe.Checkout.Session[] {
      return [...sessions.values()].map((found) => structuredClone(found));
    },
  };
}
export type FakeProvider = ReturnType<typeof fakeProvider>;
