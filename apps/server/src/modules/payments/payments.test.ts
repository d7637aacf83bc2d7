import { createServer } from 'node:net';
import { signatureHeader } from '@lotwise/payments-fake';
import type Stripe from 'stripe';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../app';
import type { Logger } from '../../lib/logger';
import { signedIn } from '../../test/factories';
import { testConfig, testContext } from '../../test/harness';
import {
  startPaymentsTestbed,
  testStripeKey,
  testWebhookSecret,
  type PaymentsTestbed,
} from '../../test/payments-fake';
import { orderReadyToPay } from '../../test/purchasing';
import { OutboxMessageEntity } from '../alerts/outbox-message.entity';
import { PaymentEventEntity } from './payment-event.entity';

let bed: PaymentsTestbed;
const warnings: string[] = [];
const logger: Logger = {
  debug: () => undefined,
  info: () => undefined,
  warn: (message) => warnings.push(message),
  error: (message) => warnings.push(message),
};
let manager: Awaited<ReturnType<typeof signedIn>>;
let alice: Awaited<ReturnType<typeof signedIn>>;
let bob: Awaited<ReturnType<typeof signedIn>>;
let carol: Awaited<ReturnType<typeof signedIn>>;

beforeAll(async () => {
  bed = await startPaymentsTestbed({}, logger);
  manager = await signedIn('manager', bed.app);
  alice = await signedIn('member', bed.app);
  bob = await signedIn('member', bed.app);
  carol = await signedIn('member', bed.app);
});

afterAll(async () => {
  await bed.close();
});

const repos = () => testContext().store.repos;
const share = async (id: number) => (await repos().orders.findShare(id))!;
const order = async (id: number) => (await repos().orders.findOrder(id))!;
const paymentsOf = (shareId: number) => repos().payments.ofShare(shareId);

async function mailsTo(userId: number, kind: string) {
  return testContext().dataSource.getRepository(OutboxMessageEntity).findBy({ userId, kind });
}

function checkout(cookie: string, orderId: number, shareId: number) {
  return request(bed.app)
    .post(`/api/orders/${orderId}/shares/${shareId}/checkout`)
    .set('Cookie', cookie);
}

async function startCheckout(cookie: string, orderId: number, shareId: number): Promise<string> {
  const response = await checkout(cookie, orderId, shareId).expect(200);
  return (response.body as { url: string }).url;
}

/** What the member's browser does on the hosted page; waits for the webhooks to be handled. */
async function press(url: string, card: 'succeed' | 'decline') {
  const answer = await fetch(`${url}/${card}`, { method: 'POST', redirect: 'manual' });
  await bed.fake.settled();
  return answer;
}

function sendWebhook(body: string, signature?: string) {
  const test = request(bed.app)
    .post('/api/webhooks/stripe')
    .set('Content-Type', 'application/json')
    .set('Origin', 'https://elsewhere.example.test');
  if (signature) test.set('Stripe-Signature', signature);
  return test.send(body);
}

describe('paying a share by card', () => {
  it('when both members pay on the hosted page, then signed webhooks mark each share paid with its own amount, e-mail them, and fund the order', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: alice.user.id, quantity: 300 },
      { userId: bob.user.id, quantity: 200 },
    ]);
    const [aliceShare, bobShare] = fixture.shares;
    const url = await startCheckout(alice.cookie, fixture.orderId, aliceShare!.id);
    expect(url.startsWith(`${bed.fake.url}/pay/`)).toBe(true);
    expect((await share(aliceShare!.id)).paymentStatus).toBe('pending');
    const session = bed.fake.sessions().at(-1)!;
    expect(session.amount_total).toBe(aliceShare!.amountMinor);
    expect(session.metadata).toMatchObject({
      orderId: String(fixture.orderId),
      shareId: String(aliceShare!.id),
    });

    const back = await press(url, 'succeed');
    expect(back.status).toBe(303);
    expect(back.headers.get('location')).toBe(
      `${bed.config.publicUrl}/orders/${fixture.orderId}?paid=${aliceShare!.id}`,
    );
    expect(await share(aliceShare!.id)).toMatchObject({
      paymentStatus: 'paid',
      paidMinor: aliceShare!.amountMinor,
      refundedMinor: 0,
    });
    const [paid] = await paymentsOf(aliceShare!.id);
    expect(paid).toMatchObject({ kind: 'checkout', status: 'succeeded', attempt: 1 });
    expect(paid!.providerPaymentIntentId).toMatch(/^pi_/);
    expect(await mailsTo(alice.user.id, 'order-payment')).toHaveLength(1);
    expect((await order(fixture.orderId)).status).toBe('open');

    await press(await startCheckout(bob.cookie, fixture.orderId, bobShare!.id), 'succeed');
    expect((await share(bobShare!.id)).paidMinor).toBe(bobShare!.amountMinor);
    expect((await order(fixture.orderId)).status).toBe('funded');
    expect(aliceShare!.amountMinor + bobShare!.amountMinor).toBe(fixture.totalMinor);
    expect(await mailsTo(bob.user.id, 'order-funded')).toHaveLength(1);
  });

  it('when the card is declined, then the share is payable again and the retry with the other card pays it once', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: alice.user.id, quantity: 250 },
      { userId: bob.user.id, quantity: 250 },
    ]);
    const target = fixture.shares[0]!;
    const first = await startCheckout(alice.cookie, fixture.orderId, target.id);
    await press(first, 'decline');
    expect(await (await fetch(first)).text()).toContain('Payment declined');
    expect(await share(target.id)).toMatchObject({ paymentStatus: 'unpaid', paidMinor: 0 });
    expect((await paymentsOf(target.id))[0]).toMatchObject({ status: 'failed', attempt: 1 });

    const second = await startCheckout(alice.cookie, fixture.orderId, target.id);
    expect(second).not.toBe(first);
    await bed.fake.settled();
    // The declined attempt's page no longer takes a card: nobody can pay twice.
    const firstId = first.split('/').at(-1)!;
    expect(bed.fake.sessions().find((s) => s.id === firstId)?.status).toBe('expired');

    await press(second, 'succeed');
    const rows = await paymentsOf(target.id);
    expect(rows.map((row) => [row.attempt, row.status])).toEqual([
      [1, 'expired'],
      [2, 'succeeded'],
    ]);
    expect(await share(target.id)).toMatchObject({
      paymentStatus: 'paid',
      paidMinor: target.amountMinor,
    });
  });

  it('when the same checkout is requested twice at once and again later, then one session is created and the same page answers', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: carol.user.id, quantity: 500 },
    ]);
    const target = fixture.shares[0]!;
    const before = bed.fake.sessions().length;
    const [one, two] = await Promise.all([
      startCheckout(carol.cookie, fixture.orderId, target.id),
      startCheckout(carol.cookie, fixture.orderId, target.id),
    ]);
    const three = await startCheckout(carol.cookie, fixture.orderId, target.id);
    expect(two).toBe(one);
    expect(three).toBe(one);
    expect(bed.fake.sessions().length).toBe(before + 1);
    const rows = await paymentsOf(target.id);
    expect(rows).toHaveLength(1);
    expect(rows[0]!.idempotencyKey).toBe(`lotwise-share-${target.id}-checkout-1`);
  });

  it('when someone else, a viewer or anyone before claims close asks to pay a share, then it is refused and nothing starts', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: alice.user.id, quantity: 400 },
      { userId: null, quantity: 100 },
    ]);
    const [aliceShare, labShare] = fixture.shares;
    await checkout(bob.cookie, fixture.orderId, aliceShare!.id).expect(403);
    await checkout(manager.cookie, fixture.orderId, aliceShare!.id).expect(403);
    await checkout(alice.cookie, fixture.orderId, labShare!.id).expect(403);
    const viewer = await signedIn('viewer', bed.app);
    await checkout(viewer.cookie, fixture.orderId, aliceShare!.id).expect(403);
    await checkout(alice.cookie, fixture.orderId + 1000, aliceShare!.id).expect(404);
    await testContext().store.repos.orders.updateOrder(fixture.orderId, { claimsClosedAt: null });
    const early = await checkout(alice.cookie, fixture.orderId, aliceShare!.id).expect(409);
    expect(early.body.error.message).toMatch(/closed the claims/);
    expect(await paymentsOf(aliceShare!.id)).toHaveLength(0);
    // the lab's share is the coordinator's to pay
    await testContext().store.repos.orders.updateOrder(fixture.orderId, {
      claimsClosedAt: new Date().toISOString(),
    });
    await checkout(manager.cookie, fixture.orderId, labShare!.id).expect(200);
  });

  it('when the payment service is down, then the member gets a clear 503, nothing is recorded as paid, and paying later creates one session', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: alice.user.id, quantity: 500 },
    ]);
    const target = fixture.shares[0]!;
    const closedPort = await new Promise<number>((resolve) => {
      const probe = createServer().listen(0, '127.0.0.1', () => {
        const { port } = probe.address() as { port: number };
        probe.close(() => resolve(port));
      });
    });
    const { dir, dataSource } = testContext();
    const offline = createApp({
      dataSource,
      logger,
      config: testConfig(dir, {
        STRIPE_API_URL: `http://127.0.0.1:${closedPort}`,
        STRIPE_SECRET_KEY: testStripeKey,
        STRIPE_WEBHOOK_SECRET: testWebhookSecret,
      }),
    });
    const answer = await request(offline)
      .post(`/api/orders/${fixture.orderId}/shares/${target.id}/checkout`)
      .set('Cookie', alice.cookie)
      .expect(503);
    expect(answer.body.error.code).toBe('payment_provider_unavailable');
    expect(answer.body.error.message).toMatch(/nothing was charged/);
    expect(await share(target.id)).toMatchObject({ paymentStatus: 'unpaid', paidMinor: 0 });
    expect((await paymentsOf(target.id)).every((row) => row.status !== 'succeeded')).toBe(true);

    const before = bed.fake.sessions().length;
    await press(await startCheckout(alice.cookie, fixture.orderId, target.id), 'succeed');
    expect(bed.fake.sessions().length).toBe(before + 1);
    expect((await share(target.id)).paidMinor).toBe(target.amountMinor);
    expect(await paymentsOf(target.id)).toHaveLength(1);
  });
});

describe('a payment the service refuses', () => {
  it('when the payment service refuses the checkout, then the member is told it was refused and nothing is recorded as paid', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [{ userId: bob.user.id, quantity: 500 }]);
    const target = fixture.shares[0]!;
    // a currency code the service does not take
    await testContext().store.repos.orders.updateOrder(fixture.orderId, { currency: 'E1R' });
    const answer = await checkout(bob.cookie, fixture.orderId, target.id).expect(503);
    expect(answer.body.error.code).toBe('payment_provider_unavailable');
    expect(answer.body.error.message).toMatch(/refused this payment .*Invalid currency/);
    expect(await share(target.id)).toMatchObject({ paymentStatus: 'unpaid', paidMinor: 0 });
  });
});

describe('webhooks', () => {
  it('when a completed event is delivered again three times, then the share is credited once', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: alice.user.id, quantity: 100 },
      { userId: bob.user.id, quantity: 400 },
    ]);
    const target = fixture.shares[0]!;
    const url = await startCheckout(alice.cookie, fixture.orderId, target.id);
    await press(url, 'succeed');
    const sessionId = url.split('/').at(-1)!;
    const delivered = bed.fake
      .deliveries()
      .find(
        (d) =>
          d.event.type === 'checkout.session.completed' &&
          (d.event.data.object as Stripe.Checkout.Session).id === sessionId,
      )!;
    const body = JSON.stringify(delivered.event);
    const mailsBefore = (await mailsTo(alice.user.id, 'order-payment')).length;
    for (let i = 0; i < 3; i++) {
      const replay = await sendWebhook(body, signatureHeader(body, testWebhookSecret)).expect(200);
      expect(replay.body).toEqual({ received: true, duplicate: true });
    }
    expect(await share(target.id)).toMatchObject({
      paymentStatus: 'paid',
      paidMinor: target.amountMinor,
    });
    expect(await paymentsOf(target.id)).toHaveLength(1);
    expect(await mailsTo(alice.user.id, 'order-payment')).toHaveLength(mailsBefore);
    const stored = await testContext()
      .dataSource.getRepository(PaymentEventEntity)
      .findBy({ id: delivered.event.id });
    expect(stored).toHaveLength(1);
    expect(stored[0]!.outcome).toMatch(/recorded/);
  });

  it('when a webhook is forged, altered or unsigned, then it answers 400, changes nothing and is logged', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [{ userId: bob.user.id, quantity: 500 }]);
    const target = fixture.shares[0]!;
    await startCheckout(bob.cookie, fixture.orderId, target.id);
    const [pending] = await paymentsOf(target.id);
    const forged = JSON.stringify({
      id: 'evt_forged_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: {
        object: {
          id: pending!.providerSessionId,
          object: 'checkout.session',
          payment_status: 'paid',
          amount_total: target.amountMinor,
          currency: 'eur',
          payment_intent: 'pi_forged',
          metadata: { orderId: String(fixture.orderId), shareId: String(target.id) },
        },
      },
    });
    warnings.length = 0;
    await sendWebhook(forged, signatureHeader(forged, 'whsec_someone_else')).expect(400);
    await sendWebhook(forged).expect(400);
    const signed = signatureHeader(forged, testWebhookSecret);
    await sendWebhook(forged.replace('"paid"', '"paid" '), signed).expect(400);
    const stale = signatureHeader(forged, testWebhookSecret, Math.floor(Date.now() / 1000) - 600);
    const refused = await sendWebhook(forged, stale).expect(400);
    expect(refused.body.error.code).toBe('validation_failed');

    expect(await share(target.id)).toMatchObject({ paymentStatus: 'pending', paidMinor: 0 });
    expect((await paymentsOf(target.id))[0]!.status).toBe('pending');
    const stored = await testContext()
      .dataSource.getRepository(PaymentEventEntity)
      .findBy({ id: 'evt_forged_1' });
    expect(stored).toHaveLength(0);
    expect(warnings.filter((w) => w.includes('not signed by the payment service'))).toHaveLength(4);
  });

  it('when a checkout expires, then the share is payable again', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: carol.user.id, quantity: 500 },
    ]);
    const target = fixture.shares[0]!;
    const url = await startCheckout(carol.cookie, fixture.orderId, target.id);
    const sessionId = url.split('/').at(-1)!;
    await fetch(`${bed.fake.url}/v1/checkout/sessions/${sessionId}/expire`, {
      method: 'POST',
      headers: { Authorization: `Bearer ${testStripeKey}` },
    });
    await bed.fake.settled();
    expect((await paymentsOf(target.id))[0]!.status).toBe('expired');
    expect((await share(target.id)).paymentStatus).toBe('unpaid');
    const again = await startCheckout(carol.cookie, fixture.orderId, target.id);
    expect(again).not.toBe(url);
  });
});

describe('cash and refunds', () => {
  it('when a coordinator records cash, then the share is paid its own amount with an audit entry and an e-mail; a member may not, and no amount is taken from the browser', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: bob.user.id, quantity: 350 },
      { userId: null, quantity: 150 },
    ]);
    const [bobShare, labShare] = fixture.shares;
    const mailsBefore = (await mailsTo(bob.user.id, 'order-payment')).length;
    const path = (id: number) => `/api/orders/${fixture.orderId}/shares/${id}/cash-payment`;
    await request(bed.app)
      .post(path(bobShare!.id))
      .set('Cookie', bob.cookie)
      .send({ note: 'paid myself' })
      .expect(403);
    const withAmount = await request(bed.app)
      .post(path(bobShare!.id))
      .set('Cookie', manager.cookie)
      .send({ note: 'handed over', amountMinor: 1 })
      .expect(400);
    expect(withAmount.body.error.fields).toHaveProperty('amountMinor');
    const recorded = await request(bed.app)
      .post(path(bobShare!.id))
      .set('Cookie', manager.cookie)
      .send({ note: 'Handed to the technician after the club evening' })
      .expect(201);
    expect(recorded.body).toMatchObject({
      paymentStatus: 'paid',
      paidMinor: bobShare!.amountMinor,
      amountMinor: bobShare!.amountMinor,
      orderStatus: 'open',
    });
    await request(bed.app)
      .post(path(bobShare!.id))
      .set('Cookie', manager.cookie)
      .send({ note: 'again' })
      .expect(409);
    const lab = await request(bed.app)
      .post(path(labShare!.id))
      .set('Cookie', manager.cookie)
      .send({ note: 'From the club budget' })
      .expect(201);
    expect(lab.body.orderStatus).toBe('funded');
    expect((await paymentsOf(labShare!.id))[0]!.kind).toBe('lab_funds');
    const audit = await request(bed.app)
      .get(`/api/audit?targetType=order_share&targetId=${bobShare!.id}`)
      .set('Cookie', (await signedIn('admin', bed.app)).cookie)
      .expect(200);
    expect(audit.body.items[0]).toMatchObject({
      action: 'payment.cash_recorded',
      detail: {
        amountMinor: bobShare!.amountMinor,
        note: 'Handed to the technician after the club evening',
      },
    });
    expect(await mailsTo(bob.user.id, 'order-payment')).toHaveLength(mailsBefore + 1);
  });

  it('when a funded order is cancelled, then every card payment is refunded through the provider to the cent, cash is listed to hand back, and refunding again changes nothing', async () => {
    const fixture = await orderReadyToPay(
      manager.cookie,
      [
        { userId: alice.user.id, quantity: 123 },
        { userId: bob.user.id, quantity: 211 },
        { userId: carol.user.id, quantity: 166 },
      ],
      { priceMinor: 5003, shippingFeeMinor: 997 },
    );
    const [a, b, c] = fixture.shares;
    const alicesBefore = (await mailsTo(alice.user.id, 'order-cancelled')).length;
    const carolsBefore = (await mailsTo(carol.user.id, 'order-cancelled')).length;
    await press(await startCheckout(alice.cookie, fixture.orderId, a!.id), 'succeed');
    await press(await startCheckout(bob.cookie, fixture.orderId, b!.id), 'succeed');
    await request(bed.app)
      .post(`/api/orders/${fixture.orderId}/shares/${c!.id}/cash-payment`)
      .set('Cookie', manager.cookie)
      .send({ note: 'cash at the club' })
      .expect(201);
    expect((await order(fixture.orderId)).status).toBe('funded');
    expect(a!.amountMinor + b!.amountMinor + c!.amountMinor).toBe(fixture.totalMinor);

    const early = await request(bed.app)
      .post(`/api/orders/${fixture.orderId}/refunds`)
      .set('Cookie', manager.cookie)
      .expect(409);
    expect(early.body.error.message).toMatch(/once the order is cancelled/);
    await testContext().store.repos.orders.updateOrder(fixture.orderId, { status: 'cancelled' });
    const summary = await request(bed.app)
      .post(`/api/orders/${fixture.orderId}/refunds`)
      .set('Cookie', manager.cookie)
      .expect(200);
    await bed.fake.settled();
    expect(
      summary.body.refunded.map((r: { shareId: number; amountMinor: number }) => [
        r.shareId,
        r.amountMinor,
      ]),
    ).toEqual([
      [a!.id, a!.amountMinor],
      [b!.id, b!.amountMinor],
    ]);
    expect(summary.body.handBack).toEqual([{ shareId: c!.id, amountMinor: c!.amountMinor }]);
    expect(summary.body.failed).toEqual([]);
    for (const paid of [a!, b!]) {
      expect(await share(paid.id)).toMatchObject({
        paymentStatus: 'refunded',
        paidMinor: paid.amountMinor,
        refundedMinor: paid.amountMinor,
      });
      const refunds = (await paymentsOf(paid.id)).filter((row) => row.kind === 'refund');
      expect(refunds).toHaveLength(1);
      expect(refunds[0]).toMatchObject({ status: 'succeeded', amountMinor: paid.amountMinor });
      expect(refunds[0]!.providerRefundId).toMatch(/^re_/);
    }
    expect(await mailsTo(alice.user.id, 'order-cancelled')).toHaveLength(alicesBefore + 1);
    expect(await mailsTo(carol.user.id, 'order-cancelled')).toHaveLength(carolsBefore + 1);

    const again = await request(bed.app)
      .post(`/api/orders/${fixture.orderId}/refunds`)
      .set('Cookie', manager.cookie)
      .expect(200);
    await bed.fake.settled();
    expect(again.body).toMatchObject({ refunded: [], handBack: [], failed: [] });
    for (const paid of [a!, b!, c!]) {
      expect((await paymentsOf(paid.id)).filter((row) => row.kind === 'refund')).toHaveLength(1);
    }
  });

  it('when a card payment is confirmed only after the order was cancelled, then cash cannot be recorded over it and the late payment is refunded automatically', async () => {
    const fixture = await orderReadyToPay(manager.cookie, [
      { userId: alice.user.id, quantity: 200 },
      { userId: bob.user.id, quantity: 300 },
    ]);
    const target = fixture.shares[0]!;
    const url = await startCheckout(alice.cookie, fixture.orderId, target.id);
    // The payment goes through while its webhook has not reached Lotwise yet.
    bed.fake.setWebhookUrl(null);
    await press(url, 'succeed');
    bed.fake.setWebhookUrl(`${bed.appUrl}/api/webhooks/stripe`);
    const cash = await request(bed.app)
      .post(`/api/orders/${fixture.orderId}/shares/${target.id}/cash-payment`)
      .set('Cookie', manager.cookie)
      .send({ note: 'cash' })
      .expect(409);
    expect(cash.body.error.message).toMatch(/just gone through/);

    await testContext().store.repos.orders.updateOrder(fixture.orderId, { status: 'cancelled' });
    await request(bed.app)
      .post(`/api/orders/${fixture.orderId}/refunds`)
      .set('Cookie', manager.cookie)
      .expect(200);
    const sessionId = url.split('/').at(-1)!;
    const late = bed.fake
      .deliveries()
      .find(
        (d) =>
          d.event.type === 'checkout.session.completed' &&
          (d.event.data.object as Stripe.Checkout.Session).id === sessionId,
      )!;
    expect(late.status).toBe('no_endpoint');
    const body = JSON.stringify(late.event);
    await sendWebhook(body, signatureHeader(body, testWebhookSecret)).expect(200);
    await bed.fake.settled();
    expect(await share(target.id)).toMatchObject({
      paymentStatus: 'refunded',
      paidMinor: target.amountMinor,
      refundedMinor: target.amountMinor,
    });
    const refunds = (await paymentsOf(target.id)).filter((row) => row.kind === 'refund');
    expect(refunds).toHaveLength(1);
  });
});
