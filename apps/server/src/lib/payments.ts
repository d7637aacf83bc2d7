import Stripe from 'stripe';
import type { PaymentsConfig } from '../config';
import { version } from '../version';

/** The SDK client Lotwise uses for card payments. */
export type PaymentClient = Stripe;

/**
 * Builds the provider's SDK from configuration. With `apiUrl` set (the local payments fake)
 * its host, port and protocol are given to the SDK; without it the same code talks to the
 * real service. The API version is the one the pinned SDK was built for.
 */
export function createPaymentClient(config: PaymentsConfig): PaymentClient {
  const options: Stripe.StripeConfig = {
    // The SDK retries connection faults, 409 and 5xx with the same Idempotency-Key.
    maxNetworkRetries: 2,
    timeout: 15_000,
    appInfo: { name: 'Lotwise', version },
  };
  if (config.apiUrl) {
    const url = new URL(config.apiUrl);
    const protocol = url.protocol === 'https:' ? 'https' : 'http';
    options.host = url.hostname;
    options.port = url.port ? Number(url.port) : protocol === 'https' ? 443 : 80;
    options.protocol = protocol;
    options.telemetry = false;
  }
  return new Stripe(config.secretKey, options);
}

/** The signature did not match (or was missing): the webhook is not the provider's. */
export class WebhookSignatureError extends Error {
  override name = 'WebhookSignatureError';
}

/**
 * The event in a webhook, after checking its `Stripe-Signature` over the raw body with the
 * endpoint's signing secret (and its timestamp against the SDK's five-minute tolerance).
 */
export function verifyWebhook(
  client: PaymentClient,
  rawBody: Buffer | string,
  signature: string | undefined,
  secret: string,
): Stripe.Event {
  if (!signature) throw new WebhookSignatureError('The webhook has no Stripe-Signature header');
  try {
    return client.webhooks.constructEvent(rawBody, signature, secret);
  } catch (error) {
    throw new WebhookSignatureError(error instanceof Error ? error.message : String(error));
  }
}

/** True when the provider could not be reached or answered with a server fault. */
export function isProviderUnavailable(error: unknown): boolean {
  return (
    error instanceof Stripe.errors.StripeConnectionError ||
    error instanceof Stripe.errors.StripeAPIError ||
    error instanceof Stripe.errors.StripeRateLimitError ||
    error instanceof Stripe.errors.StripeAuthenticationError
  );
}
