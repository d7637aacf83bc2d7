import { createHmac } from 'node:crypto';
import { unixNow } from './ids';
import type { FakeEvent } from './objects';

/**
 * The `Stripe-Signature` header for `payload`: `t=<unix seconds>,v1=<hex HMAC-SHA256 of
 * "<t>.<payload>" under the endpoint's signing secret>` — what the SDK's `constructEvent` checks.
 */
export function signatureHeader(payload: string, secret: string, timestamp = unixNow()): string {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`).digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

export type DeliveryStatus = 'pending' | 'delivered' | 'failed' | 'no_endpoint';

/** One event and how its delivery went. */
export interface Delivery {
  event: FakeEvent;
  status: DeliveryStatus;
  attempts: number;
  /** The last answer: an HTTP status line or the network error. */
  lastResult: string | null;
}

export interface WebhookSenderOptions {
  secret: string;
  endpoint(): string | null;
  /** Wait before the first retry; doubled after each failed attempt up to `retryMaxMs`. */
  retryBaseMs: number;
  retryMaxMs: number;
  /** Attempts before the event is given up (status `failed`). */
  maxAttempts: number;
  /** Time allowed for the endpoint to answer one attempt. */
  timeoutMs: number;
  log(line: string): void;
}

/**
 * Sends each event to the endpoint as a signed JSON POST (signed afresh on every attempt, so
 * a retry never carries a stale timestamp) and retries with doubling waits until a 2xx answer
 * or `maxAttempts`.
 */
export function webhookSender(options: WebhookSenderOptions) {
  const deliveries: Delivery[] = [];
  const timers = new Set<NodeJS.Timeout>();
  let idleWaiters: Array<() => void> = [];
  let stopped = false;

  const pending = () => deliveries.some((d) => d.status === 'pending');
  const changed = () => {
    if (pending()) return;
    const waiters = idleWaiters;
    idleWaiters = [];
    for (const resolve of waiters) resolve();
  };

  async function attempt(delivery: Delivery): Promise<void> {
    if (stopped) return;
    const url = options.endpoint();
    if (!url) {
      delivery.status = 'no_endpoint';
      changed();
      return;
    }
    delivery.attempts++;
    const payload = JSON.stringify(delivery.event, null, 2);
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'Stripe-Signature': signatureHeader(payload, options.secret),
          'User-Agent': 'Lotwise-PaymentsFake/1.0',
        },
        body: payload,
        signal: AbortSignal.timeout(options.timeoutMs),
      });
      await response.arrayBuffer().catch(() => undefined);
      delivery.lastResult = `HTTP ${response.status}`;
      if (response.ok) {
        delivery.status = 'delivered';
        changed();
        return;
      }
    } catch (error) {
      delivery.lastResult = error instanceof Error ? error.message : String(error);
    }
    if (stopped) return;
    if (delivery.attempts >= options.maxAttempts) {
      delivery.status = 'failed';
      options.log(
        `Gave up on ${delivery.event.type} ${delivery.event.id} after ${delivery.attempts} attempts (${delivery.lastResult})`,
      );
      changed();
      return;
    }
    const wait = Math.min(options.retryBaseMs * 2 ** (delivery.attempts - 1), options.retryMaxMs);
    options.log(
      `${delivery.event.type} ${delivery.event.id} not accepted (${delivery.lastResult}); attempt ${delivery.attempts + 1} in ${wait} ms`,
    );
    const timer = setTimeout(() => {
      timers.delete(timer);
      void attempt(delivery);
    }, wait);
    timers.add(timer);
  }

  return {
    deliveries: deliveries as readonly Delivery[],

    send(event: FakeEvent): void {
      const delivery: Delivery = { event, status: 'pending', attempts: 0, lastResult: null };
      deliveries.push(delivery);
      void attempt(delivery);
    },

    /** Resolves once no event is waiting for (another) delivery attempt. */
    settled(): Promise<void> {
      if (!pending()) return Promise.resolve();
      return new Promise((resolve) => idleWaiters.push(resolve));
    },

    stop(): void {
      stopped = true;
      for (const timer of timers) clearTimeout(timer);
      timers.clear();
      for (const delivery of deliveries) {
        if (delivery.status === 'pending') delivery.status = 'failed';
      }
      changed();
    },
  };
}
export type WebhookSender = ReturnType<typeof webhookSender>;
