import Stripe from 'stripe';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { startPaymentsFake, type PaymentsFake } from './fake-server';
import { startTestEndpoint } from './test-endpoint';
import { signatureHeader } from './webhooks';

const secretKey = 'sk_test_fake_suite';
const webhookSecret = 'whsec_fake_suite';

let fake: PaymentsFake;
let endpoint: Awaited<ReturnType<typeof startTestEndpoint>>;
let stripe: Stripe;

function client(key = secretKey) {
  const url = new URL(fake.url);
  return new Stripe(key, {
    host: url.hostname,
    port: Number(url.port),
    protocol: 'http',
    maxNetworkRetries: 0,
  });
}

const sessionParams = (amount = 1250): Stripe.Checkout.SessionCreateParams => ({
  mode: 'payment',
  currency: 'eur',
  line_items: [
    {
      quantity: 1,
      price_data: {
        currency: 'eur',
        unit_amount: amount,
        product_data: { name: 'Share of order 7: 100 g sodium chloride' },
      },
    },
  ],
  metadata: { orderId: '7', shareId: '21' },
  payment_intent_data: { metadata: { orderId: '7', shareId: '21' } },
  client_reference_id: 'share-21',
  success_url: 'http://lotwise.example.test/orders/7?paid=21&session={CHECKOUT_SESSION_ID}',
  cancel_url: 'http://lotwise.example.test/orders/7?cancelled=21',
});

/** What a browser does on the hosted page: press one of the test-card buttons. */
async function press(sessionUrl: string, button: 'succeed' | 'decline') {
  return fetch(`${sessionUrl}/${button}`, { method: 'POST', redirect: 'manual' });
}

beforeAll(async () => {
  endpoint = await startTestEndpoint();
  fake = await startPaymentsFake({
    port: 0,
    secretKey,
    webhookSecret,
    webhookUrl: endpoint.url,
    retryBaseMs: 50,
    retryMaxMs: 200,
    maxAttempts: 5,
  });
  stripe = client();
});

afterEach(async () => {
  await fake.settled();
});

afterAll(async () => {
  await fake.stop();
  await endpoint.close();
});

describe('requests', () => {
  it('when a session is created twice with one Idempotency-Key, then one session exists and the same answer comes back', async () => {
    const before = fake.sessions().length;
    const first = await stripe.checkout.sessions.create(sessionParams(), {
      idempotencyKey: 'share-21-attempt-1',
    });
    const second = await stripe.checkout.sessions.create(sessionParams(), {
      idempotencyKey: 'share-21-attempt-1',
    });
    expect(second.id).toBe(first.id);
    expect(second).toEqual(first);
    expect(fake.sessions().length).toBe(before + 1);
    expect(first.amount_total).toBe(1250);
    expect(first.status).toBe('open');
    expect(first.url).toBe(`${fake.url}/pay/${first.id}`);
    expect(first.metadata).toEqual({ orderId: '7', shareId: '21' });
  });

  it('when the same Idempotency-Key comes with other parameters, then the idempotency error answers and nothing is created', async () => {
    await stripe.checkout.sessions.create(sessionParams(), {
      idempotencyKey: 'share-22-attempt-1',
    });
    const before = fake.sessions().length;
    const error = await stripe.checkout.sessions
      .create(sessionParams(999), { idempotencyKey: 'share-22-attempt-1' })
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect((error as Stripe.errors.StripeError).statusCode).toBe(400);
    expect(fake.sessions().length).toBe(before);
  });

  it('when the API key is wrong, then the authentication error answers with status 401', async () => {
    const error = await client('sk_test_someone_else')
      .checkout.sessions.create(sessionParams())
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect((error as Stripe.errors.StripeError).statusCode).toBe(401);
    expect((error as Stripe.errors.StripeError).message).not.toContain('someone_else');
  });

  it('when a required parameter is missing or unknown, then the invalid request error names it', async () => {
    const missing = await stripe.checkout.sessions
      .create({ ...sessionParams(), success_url: undefined })
      .catch((e: unknown) => e);
    expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((missing as Stripe.errors.StripeError).param).toBe('success_url');
    const unknown = await stripe.checkout.sessions
      .create({ ...sessionParams(), ...({ colour: 'green' } as object) })
      .catch((e: unknown) => e);
    expect((unknown as Stripe.errors.StripeError).param).toBe('colour');
  });

  it('when a session id is unknown, then resource_missing answers with status 404', async () => {
    const error = await stripe.checkout.sessions
      .retrieve('cs_test_nothing')
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((error as Stripe.errors.StripeError).statusCode).toBe(404);
    expect((error as Stripe.errors.StripeError).code).toBe('resource_missing');
  });
});

describe('hosted checkout page and webhooks', () => {
  it('when the test card succeeds, then the browser returns to success_url and a signed checkout.session.completed arrives', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams(1250));
    const page = await fetch(session.url!);
    const html = await page.text();
    expect(html).toContain('€12.50');
    expect(html).toContain('Share of order 7: 100 g sodium chloride');
    expect(html).toContain('Test card succeeds');
    expect(html).toContain('Test card is declined');

    const answer = await press(session.url!, 'succeed');
    expect(answer.status).toBe(303);
    expect(answer.headers.get('location')).toBe(
      `http://lotwise.example.test/orders/7?paid=21&session=${session.id}`,
    );
    await fake.settled();
    const [hook] = endpoint
      .ofType('checkout.session.completed')
      .filter((h) => h.body.includes(session.id));
    expect(hook).toBeDefined();
    const event = stripe.webhooks.constructEvent(
      hook!.body,
      String(hook!.headers['stripe-signature']),
      webhookSecret,
    );
    expect(event.id).toMatch(/^evt_/);
    expect(event.type).toBe('checkout.session.completed');
    const completed = event.data.object as Stripe.Checkout.Session;
    expect(completed.payment_status).toBe('paid');
    expect(completed.metadata).toEqual({ orderId: '7', shareId: '21' });

    const fetched = await stripe.checkout.sessions.retrieve(session.id, {
      expand: ['payment_intent'],
    });
    const intent = fetched.payment_intent as Stripe.PaymentIntent;
    expect(intent.status).toBe('succeeded');
    expect(intent.amount_received).toBe(1250);
    expect(intent.metadata).toEqual({ orderId: '7', shareId: '21' });
  });

  it('when a signature is checked with another secret or the body is changed, then constructEvent refuses it', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    await press(session.url!, 'succeed');
    await fake.settled();
    const hook = endpoint.received.at(-1)!;
    const header = String(hook.headers['stripe-signature']);
    expect(header).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    expect(() => stripe.webhooks.constructEvent(hook.body, header, 'whsec_other')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() =>
      stripe.webhooks.constructEvent(
        hook.body.replace('"paid"', '"unpaid"'),
        header,
        webhookSecret,
      ),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
    // the same rule as the SDK's own test header
    const payload = '{"id":"evt_1"}';
    const timestamp = Math.floor(Date.now() / 1000);
    expect(signatureHeader(payload, webhookSecret, timestamp)).toBe(
      stripe.webhooks.generateTestHeaderString({ payload, secret: webhookSecret, timestamp }),
    );
  });

  it('when the test card is declined, then the page says so, payment_intent.payment_failed is sent and the other card still pays', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams(800));
    const declined = await press(session.url!, 'decline');
    expect(declined.status).toBe(303);
    expect(declined.headers.get('location')).toBe(`/pay/${session.id}`);
    expect(await (await fetch(session.url!)).text()).toContain('Payment declined');
    await fake.settled();
    const failed = endpoint
      .ofType('payment_intent.payment_failed')
      .map((h) => JSON.parse(h.body) as Stripe.PaymentIntentPaymentFailedEvent)
      .find(
        (e) =>
          e.data.object.id ===
          (fake.sessions().find((s) => s.id === session.id)!.payment_intent as string),
      );
    expect(failed?.data.object.last_payment_error?.decline_code).toBe('generic_decline');
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');

    const paid = await press(session.url!, 'succeed');
    expect(paid.status).toBe(303);
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('complete');
  });

  it('when a session is expired, then checkout.session.expired is sent and the page no longer takes a card', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired.status).toBe('expired');
    await fake.settled();
    expect(
      endpoint.ofType('checkout.session.expired').some((h) => h.body.includes(session.id)),
    ).toBe(true);
    const answer = await press(session.url!, 'succeed');
    expect(answer.status).toBe(303);
    expect(await (await fetch(session.url!)).text()).toContain('Expired');
    const again = await stripe.checkout.sessions.expire(session.id).catch((e: unknown) => e);
    expect(again).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
  });

  it('when the endpoint answers 500 twice, then the same event is sent again with growing waits until it answers 2xx', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    endpoint.failNext(2);
    await stripe.checkout.sessions.expire(session.id);
    await fake.settled();
    const tries = endpoint
      .ofType('checkout.session.expired')
      .filter((h) => h.body.includes(session.id));
    expect(tries).toHaveLength(3);
    const ids = tries.map((h) => (JSON.parse(h.body) as Stripe.Event).id);
    expect(new Set(ids).size).toBe(1);
    // Waits of 50 ms, then 100 ms (retryBaseMs doubled): each gap is at least its wait, less a
    // little for the network, whatever the machine's load does to the time a request takes.
    expect(tries[1]!.at - tries[0]!.at).toBeGreaterThanOrEqual(50 - 20);
    expect(tries[2]!.at - tries[1]!.at).toBeGreaterThanOrEqual(100 - 20);
    const delivery = fake.deliveries().find((d) => d.event.id === ids[0]);
    expect(delivery).toMatchObject({ status: 'delivered', attempts: 3 });
  });

  it('when the endpoint never answers 2xx, then delivery stops after the last attempt', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    endpoint.failNext(100);
    await stripe.checkout.sessions.expire(session.id);
    await fake.settled();
    endpoint.failNext(0);
    const delivery = fake
      .deliveries()
      .find(
        (d) =>
          d.event.type === 'checkout.session.expired' &&
          JSON.stringify(d.event).includes(session.id),
      );
    expect(delivery).toMatchObject({ status: 'failed', attempts: 5 });
  });
});

describe('refunds', () => {
  async function paidIntent(amount: number): Promise<string> {
    const session = await stripe.checkout.sessions.create(sessionParams(amount));
    await press(session.url!, 'succeed');
    const paid = await stripe.checkout.sessions.retrieve(session.id);
    return paid.payment_intent as string;
  }

  it('when a paid intent is refunded, then the refund is stored, charge.refunded is sent and a second full refund is refused', async () => {
    const intent = await paidIntent(1333);
    const refund = await stripe.refunds.create(
      { payment_intent: intent, amount: 1333, metadata: { shareId: '21' } },
      { idempotencyKey: 'refund-share-21' },
    );
    expect(refund).toMatchObject({ amount: 1333, status: 'succeeded', payment_intent: intent });
    const replay = await stripe.refunds.create(
      { payment_intent: intent, amount: 1333, metadata: { shareId: '21' } },
      { idempotencyKey: 'refund-share-21' },
    );
    expect(replay.id).toBe(refund.id);
    expect((await stripe.refunds.retrieve(refund.id)).amount).toBe(1333);
    await fake.settled();
    const hook = endpoint
      .ofType('charge.refunded')
      .map((h) => JSON.parse(h.body) as Stripe.ChargeRefundedEvent)
      .find((e) => e.data.object.payment_intent === intent);
    expect(hook?.data.object).toMatchObject({ amount_refunded: 1333, refunded: true });

    const again = await stripe.refunds.create({ payment_intent: intent }).catch((e: unknown) => e);
    expect(again).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((again as Stripe.errors.StripeError).code).toBe('charge_already_refunded');
  });

  it('when a refund is larger than what is left, then amount_too_large answers', async () => {
    const intent = await paidIntent(500);
    await stripe.refunds.create({ payment_intent: intent, amount: 200 });
    const error = await stripe.refunds
      .create({ payment_intent: intent, amount: 301 })
      .catch((e: unknown) => e);
    expect((error as Stripe.errors.StripeError).code).toBe('amount_too_large');
    expect((await stripe.paymentIntents.retrieve(intent)).amount_received).toBe(500);
  });
});
