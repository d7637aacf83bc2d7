import type Stripe from 'stripe';
import { newId, unixNow } from './ids';

/**
 * Builders for the provider's objects, typed with the SDK's own interfaces: a field the SDK
 * adds, renames or retypes fails the type check here. Fields Lotwise never reads keep the
 * neutral value the provider answers for a plain card payment.
 */

export interface LineItemInput {
  name: string;
  unitAmount: number;
  quantity: number;
}

export interface SessionInput {
  currency: string;
  lineItems: LineItemInput[];
  metadata: Record<string, string>;
  clientReferenceId: string | null;
  successUrl: string;
  cancelUrl: string | null;
  customerEmail: string | null;
  expiresAt: number;
  url: string;
  id: string;
}

export function checkoutSession(input: SessionInput): Stripe.Checkout.Session {
  const total = input.lineItems.reduce((sum, item) => sum + item.unitAmount * item.quantity, 0);
  return {
    id: input.id,
    object: 'checkout.session',
    adaptive_pricing: null,
    after_expiration: null,
    allow_promotion_codes: null,
    allowed_payment_method_types: null,
    amount_subtotal: total,
    amount_total: total,
    automatic_tax: { enabled: false, liability: null, provider: null, status: null },
    billing_address_collection: null,
    cancel_url: input.cancelUrl,
    client_reference_id: input.clientReferenceId,
    client_secret: null,
    collected_information: null,
    consent: null,
    consent_collection: null,
    created: unixNow(),
    currency: input.currency,
    currency_conversion: null,
    custom_fields: [],
    custom_text: {
      after_submit: null,
      shipping_address: null,
      submit: null,
      terms_of_service_acceptance: null,
    },
    customer: null,
    customer_account: null,
    customer_creation: 'if_required',
    customer_details: null,
    customer_email: input.customerEmail,
    discounts: [],
    expires_at: input.expiresAt,
    integration_identifier: null,
    invoice: null,
    invoice_creation: null,
    livemode: false,
    locale: null,
    managed_payments: null,
    metadata: input.metadata,
    mode: 'payment',
    origin_context: null,
    payment_intent: null,
    payment_link: null,
    payment_method_collection: 'if_required',
    payment_method_configuration_details: null,
    payment_method_options: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    permissions: null,
    recovered_from: null,
    saved_payment_method_options: null,
    setup_intent: null,
    shipping_address_collection: null,
    shipping_cost: null,
    shipping_options: [],
    status: 'open',
    submit_type: null,
    subscription: null,
    success_url: input.successUrl,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: input.url,
    wallet_options: null,
  };
}

export function paymentIntent(input: {
  amount: number;
  currency: string;
  metadata: Record<string, string>;
  description: string | null;
}): Stripe.PaymentIntent {
  return {
    id: newId('pi'),
    object: 'payment_intent',
    allowed_payment_method_types: null,
    amount: input.amount,
    amount_capturable: 0,
    amount_received: 0,
    application: null,
    application_fee_amount: null,
    automatic_payment_methods: null,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: 'automatic',
    client_secret: null,
    confirmation_method: 'automatic',
    created: unixNow(),
    currency: input.currency,
    customer: null,
    customer_account: null,
    description: input.description,
    excluded_payment_method_types: null,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    managed_payments: null,
    metadata: input.metadata,
    next_action: null,
    on_behalf_of: null,
    payment_method: null,
    payment_method_configuration_details: null,
    payment_method_options: null,
    payment_method_types: ['card'],
    payment_record: null,
    processing: null,
    receipt_email: null,
    review: null,
    setup_future_usage: null,
    shipping: null,
    source: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: 'requires_payment_method',
    transfer_group: null,
  };
}

export function charge(intent: Stripe.PaymentIntent, paymentMethod: string): Stripe.Charge {
  return {
    id: newId('ch'),
    object: 'charge',
    amount: intent.amount,
    amount_captured: intent.amount,
    amount_refunded: 0,
    application: null,
    application_fee: null,
    application_fee_amount: null,
    balance_transaction: null,
    billing_details: { address: null, email: null, name: null, phone: null, tax_id: null },
    calculated_statement_descriptor: null,
    captured: true,
    created: unixNow(),
    currency: intent.currency,
    customer: null,
    description: intent.description,
    disputed: false,
    failure_balance_transaction: null,
    failure_code: null,
    failure_message: null,
    fraud_details: {},
    livemode: false,
    metadata: intent.metadata,
    on_behalf_of: null,
    outcome: null,
    paid: true,
    payment_intent: intent.id,
    payment_method: paymentMethod,
    payment_method_details: null,
    receipt_email: null,
    receipt_number: null,
    receipt_url: null,
    refunded: false,
    review: null,
    shipping: null,
    source: null,
    source_transfer: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: 'succeeded',
    transfer_data: null,
    transfer_group: null,
  };
}

export function refund(input: {
  amount: number;
  charge: Stripe.Charge;
  metadata: Record<string, string>;
  reason: Stripe.Refund.Reason | null;
}): Stripe.Refund {
  return {
    id: newId('re'),
    object: 'refund',
    amount: input.amount,
    balance_transaction: null,
    charge: input.charge.id,
    created: unixNow(),
    currency: input.charge.currency,
    customer: null,
    customer_account: null,
    metadata: input.metadata,
    payment_intent:
      typeof input.charge.payment_intent === 'string' ? input.charge.payment_intent : null,
    payment_method: input.charge.payment_method,
    reason: input.reason,
    receipt_number: null,
    source_transfer_reversal: null,
    status: 'succeeded',
    transfer_reversal: null,
  };
}

/** The events the fake sends, each typed as the SDK types that event. */
export type FakeEvent =
  | Stripe.CheckoutSessionCompletedEvent
  | Stripe.CheckoutSessionExpiredEvent
  | Stripe.PaymentIntentSucceededEvent
  | Stripe.PaymentIntentPaymentFailedEvent
  | Stripe.ChargeRefundedEvent
  | Stripe.RefundCreatedEvent;

/** What every event carries besides its type and object. */
export interface EventContext {
  apiVersion: string;
  /** The Idempotency-Key of the API request that caused the event; null for the checkout page. */
  idempotencyKey: string | null;
}

function eventBase(context: EventContext): Omit<Stripe.EventBase, 'data' | 'type'> {
  return {
    id: newId('evt'),
    object: 'event',
    api_version: context.apiVersion,
    created: unixNow(),
    livemode: false,
    pending_webhooks: 1,
    request: {
      id: context.idempotencyKey ? newId('req') : null,
      idempotency_key: context.idempotencyKey,
    },
  };
}

/** Events as the provider sends them; the object is a copy taken when the event happened. */
export const events = {
  sessionCompleted: (
    session: Stripe.Checkout.Session,
    context: EventContext,
  ): Stripe.CheckoutSessionCompletedEvent => ({
    ...eventBase(context),
    type: 'checkout.session.completed',
    data: { object: structuredClone(session) },
  }),
  sessionExpired: (
    session: Stripe.Checkout.Session,
    context: EventContext,
  ): Stripe.CheckoutSessionExpiredEvent => ({
    ...eventBase(context),
    type: 'checkout.session.expired',
    data: { object: structuredClone(session) },
  }),
  paymentSucceeded: (
    intent: Stripe.PaymentIntent,
    context: EventContext,
  ): Stripe.PaymentIntentSucceededEvent => ({
    ...eventBase(context),
    type: 'payment_intent.succeeded',
    data: { object: structuredClone(intent) },
  }),
  paymentFailed: (
    intent: Stripe.PaymentIntent,
    context: EventContext,
  ): Stripe.PaymentIntentPaymentFailedEvent => ({
    ...eventBase(context),
    type: 'payment_intent.payment_failed',
    data: { object: structuredClone(intent) },
  }),
  chargeRefunded: (
    charge: Stripe.Charge,
    previous: Partial<Stripe.Charge>,
    context: EventContext,
  ): Stripe.ChargeRefundedEvent => ({
    ...eventBase(context),
    type: 'charge.refunded',
    data: { object: structuredClone(charge), previous_attributes: previous },
  }),
  refundCreated: (refund: Stripe.Refund, context: EventContext): Stripe.RefundCreatedEvent => ({
    ...eventBase(context),
    type: 'refund.created',
    data: { object: structuredClone(refund) },
  }),
};
