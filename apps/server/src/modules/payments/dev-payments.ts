import type { PaymentsConfig } from '../../config';

export interface DevPaymentsServer {
  url: string;
  stop(): Promise<void>;
}

/** The app's webhook endpoint as the local fake reaches it. */
export function webhookEndpoint(host: string, port: number): string {
  const reachable = host === '0.0.0.0' || host === '::' ? '127.0.0.1' : host;
  return `http://${reachable.includes(':') ? `[${reachable}]` : reachable}:${port}/api/webhooks/stripe`;
}

/**
 * Starts the local payments fake in this process at the configured address, sending its
 * webhooks to `webhookUrl`. Answers null (and says why) when it cannot: card payments then
 * answer "provider unavailable" until a payment service answers at STRIPE_API_URL.
 */
export async function startDevPayments(
  payments: PaymentsConfig,
  webhookUrl: string,
  print: (line: string) => void = console.log,
): Promise<DevPaymentsServer | null> {
  const address = new URL(payments.apiUrl ?? 'http://127.0.0.1:4242');
  try {
    const { startPaymentsFake } = await import('@lotwise/payments-fake');
    const fake = await startPaymentsFake({
      host: address.hostname.replace(/^\[|\]$/g, ''),
      port: Number(address.port || 80),
      secretKey: payments.secretKey,
      webhookSecret: payments.webhookSecret,
      webhookUrl,
      log: (line) => print(`[payments fake] ${line}`),
    });
    return { url: fake.url, stop: () => fake.stop() };
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    print(
      `The local payments fake could not start at ${address.origin} (${reason}): card payments answer "unavailable" until a payment service answers there. Set STRIPE_API_URL to a free port, or PAYMENTS_FAKE=false when one already runs.`,
    );
    return null;
  }
}
