import { safetyDeferral } from '@lotwise/shared';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testConfig, testContext } from '../../test/harness';
import { startSmtpSink, type SmtpSink } from '../../test/smtp-sink';
import { alertsService, nextDigestAt } from './alerts.service';
import { createMailTransport } from './mail-transport';
import { outboxWorker } from './outbox-worker';

type Person = Awaited<ReturnType<typeof signedIn>>;
let sink: SmtpSink;
let admin: Person;
let manager: Person;

beforeAll(async () => {
  sink = await startSmtpSink();
  admin = await signedIn('admin');
  manager = await signedIn('manager');
});
afterAll(async () => {
  await sink.close();
});

/** A worker on the test database sending to the sink, on a clock the test moves. */
function workerAt(start: Date, env: NodeJS.ProcessEnv = {}, port = sink.port) {
  let now = start;
  const config = { ...testContext().config, ...pickAlerts(env) };
  const transport = createMailTransport({ kind: 'url', url: `smtp://127.0.0.1:${port}` })!;
  const worker = outboxWorker({ store: testContext().store, transport, config, clock: () => now });
  return {
    worker,
    advance(seconds: number) {
      now = new Date(now.getTime() + seconds * 1000);
    },
    now: () => now,
    close: () => transport.close(),
  };
}

function pickAlerts(env: NodeJS.ProcessEnv) {
  const config = testConfig(testContext().dir, env);
  return { alerts: config.alerts };
}

async function row(id: number) {
  const [found] = await testContext().dataSource.query('SELECT * FROM outbox WHERE id = ?', [id]);
  return found as {
    status: string;
    attempts: number;
    last_error: string | null;
    next_attempt_at: string | null;
    sent_at: string | null;
    claimed_by: string | null;
    lease_until: string | null;
  };
}

/** The failure notices written about outbox message `id`. */
async function notices(id: number) {
  return (await testContext().dataSource.query(
    'SELECT recipient_email, kind, status FROM outbox WHERE dedup_key = ? ORDER BY id',
    [`outbox-failed:${id}`],
  )) as { recipient_email: string; kind: string; status: string }[];
}

/** Queues one message to `person` through the general message API, as an order would. */
async function notifyOne(person: Person, at: Date, subject = 'Shared order #7 is open') {
  const { store, config, dataSource } = testContext();
  const alerts = alertsService(store, config);
  await store.transaction((repos) =>
    alerts.notify(
      repos,
      {
        kind: 'order-opened',
        recipients: [person.user.id],
        subject,
        text: 'Claim your share of the sodium chloride by Friday.',
        link: '/orders/7',
        dedupKey: `order-opened:7:${subject}`,
      },
      at,
    ),
  );
  const [last] = await dataSource.query('SELECT MAX(id) AS id FROM outbox');
  return Number(last.id);
}

describe('outbox worker', () => {
  it('when the mail server refuses twice (451), then the message is retried with back-off and delivered on the third attempt', async () => {
    const start = new Date('2026-03-02T09:00:00.000Z');
    const id = await notifyOne(admin, start);
    const { worker, advance, now, close } = workerAt(start);
    sink.refuseNext(2);
    const before = sink.messages.length;

    expect(await worker.runOnce()).toMatchObject({ sent: 0, retrying: 1 });
    let state = await row(id);
    expect(state).toMatchObject({ status: 'queued', attempts: 1 });
    expect(state.last_error).toMatch(/451/);
    expect(state.next_attempt_at).toBe(new Date(now().getTime() + 30_000).toISOString());

    advance(10); // not due yet
    expect(await worker.runOnce()).toMatchObject({ sent: 0, retrying: 0 });
    expect(sink.attempts()).toBe(1);

    advance(21);
    expect(await worker.runOnce()).toMatchObject({ retrying: 1 });
    state = await row(id);
    expect(state.attempts).toBe(2);
    expect(state.next_attempt_at).toBe(new Date(now().getTime() + 120_000).toISOString());

    advance(121);
    expect(await worker.runOnce()).toMatchObject({ sent: 1 });
    state = await row(id);
    expect(state).toMatchObject({ status: 'sent', attempts: 3, next_attempt_at: null });
    expect(state.sent_at).toBe(now().toISOString());
    expect(sink.attempts()).toBe(3);
    expect(sink.messages).toHaveLength(before + 1);

    const mail = sink.messages.at(-1)!;
    expect(mail.subject).toBe('Shared order #7 is open');
    expect(mail.to && 'text' in mail.to ? mail.to.text : '').toContain(admin.email);
    expect(mail.from?.text).toContain('lotwise@example.test');
    expect(mail.text).toContain('http://lotwise.example.test/orders/7');
    expect(mail.text).toMatch(/unsubscribe\?token=/);
    const unsubscribeHeader = mail.headerLines
      .find((h) => h.key === 'list-unsubscribe')
      ?.line.replace(/\r?\n\s+/g, ' ');
    expect(unsubscribeHeader).toMatch(
      /^List-Unsubscribe: <http:\/\/lotwise\.example\.test\/api\/alerts\/unsubscribe\?token=/,
    );
    expect(String(mail.html)).not.toMatch(/<img|<script|<style/i);
    close();
  });

  it('when the mail server is down for a while, then nothing is lost: it is delivered once it is back', async () => {
    const start = new Date('2026-03-03T09:00:00.000Z');
    const down = await startSmtpSink();
    const port = down.port;
    await down.close(); // nobody listens on that port now
    const id = await notifyOne(admin, start, 'Deadline near for order #8');
    const { worker, advance, close } = workerAt(start, {}, port);
    expect(await worker.runOnce()).toMatchObject({ retrying: 1 });
    expect((await row(id)).last_error).toMatch(/ECONNREFUSED|connect/i);
    close();

    // The same port answers again a minute later.
    const back = await startSmtpSink(port);
    const again = workerAt(new Date(start.getTime() + 60_000), {}, port);
    advance(60);
    expect(await again.worker.runOnce()).toMatchObject({ sent: 1 });
    expect(back.messages.map((m) => m.subject)).toEqual(['Deadline near for order #8']);
    again.close();
    await back.close();
  });

  it('when every attempt fails, then the last one tells the admins as it marks it failed, and an admin resend delivers it', async () => {
    const start = new Date();
    const id = await notifyOne(manager, start, 'Order #9 was cancelled');
    const { worker, advance, close } = workerAt(start, { OUTBOX_MAX_ATTEMPTS: '2' });
    sink.refuseNext(2);
    await worker.runOnce();
    expect(await notices(id)).toEqual([]); // not yet: one attempt is left
    advance(31);
    expect(await worker.runOnce()).toMatchObject({ failed: 1 });
    expect(await row(id)).toMatchObject({ status: 'failed', attempts: 2, next_attempt_at: null });
    // Written in the same transaction that marked it failed: one notice per admin.
    const queuedNotices = await notices(id);
    expect(queuedNotices.map((n) => n.recipient_email)).toEqual([admin.email]);
    expect(queuedNotices[0]).toMatchObject({ status: 'queued', kind: 'outbox-failed' });

    const before = sink.messages.length;
    advance(1);
    expect(await worker.runOnce()).toMatchObject({ sent: 1, failed: 0 });
    const notice = sink.messages.at(-1)!;
    expect(sink.messages).toHaveLength(before + 1);
    expect(notice.subject).toBe('E-mail not delivered: “Order #9 was cancelled”');
    expect(notice.to && 'text' in notice.to ? notice.to.text : '').toContain(admin.email);
    expect(notice.text).toContain(`To: ${manager.email}`);
    expect(notice.text).toMatch(/Last error: .*451/);
    expect(notice.text).toContain('http://lotwise.example.test/admin/outbox');
    advance(100_000);
    expect(await worker.runOnce()).toMatchObject({ sent: 0, failed: 0 });

    await request(testContext().app)
      .post(`/api/outbox/${id}/resend`)
      .set('Cookie', admin.cookie)
      .expect(200);
    // The resend is due now (real time), long before this test's clock.
    expect(await worker.runOnce()).toMatchObject({ sent: 1 });
    expect(await row(id)).toMatchObject({ status: 'sent' });
    close();
  });

  it('when a sender stops after claiming a message, then another takes it once the lease runs out and it is sent once', async () => {
    const start = new Date('2026-03-04T09:00:00.000Z');
    const id = await notifyOne(admin, start, 'Order #12 is open');
    // The first sender claims it and never finishes (the process stopped mid-send).
    let now = start;
    const stuck = outboxWorker({
      store: testContext().store,
      transport: { sendMail: () => new Promise(() => {}) },
      config: testContext().config,
      clock: () => now,
    });
    void stuck.runOnce();
    await vi.waitFor(async () => expect((await row(id)).status).toBe('sending'));
    const claim = await row(id);
    expect(claim.claimed_by).toMatch(/^\d+:[0-9a-f-]{36}$/);
    expect(claim.lease_until).toBe(new Date(start.getTime() + 45_000).toISOString());

    const before = sink.messages.length;
    const { worker, advance, close } = workerAt(new Date(start.getTime() + 30_000));
    expect(await worker.runOnce()).toMatchObject({ claimed: 0 }); // the lease still holds
    advance(16); // 46 s after the claim: within a minute
    expect(await worker.runOnce()).toMatchObject({ claimed: 1, sent: 1 });
    advance(60);
    expect(await worker.runOnce()).toMatchObject({ claimed: 0, sent: 0 });
    const delivered = sink.messages.slice(before).filter((m) => m.subject === 'Order #12 is open');
    expect(delivered).toHaveLength(1);
    expect(await row(id)).toMatchObject({ status: 'sent', claimed_by: null, lease_until: null });
    now = new Date(start.getTime() + 10 * 60_000);
    close();
  });

  it('when a sender dies after the mail server accepted an e-mail but before recording it, then the copy sent after the lease carries the same Message-ID', async () => {
    const start = new Date('2026-03-05T09:00:00.000Z');
    const id = await notifyOne(admin, start, 'Order #14 is open');
    const other = await notifyOne(admin, start, 'Order #15 is open');
    const before = sink.messages.length;
    const accepted = workerAt(start);
    const real = createMailTransport({ kind: 'url', url: `smtp://127.0.0.1:${sink.port}` })!;
    // Delivered, then the process is gone before the database hears of it.
    const dies = outboxWorker({
      store: testContext().store,
      config: testContext().config,
      clock: () => start,
      batchSize: 1,
      transport: { sendMail: (mail) => real.sendMail(mail).then(() => new Promise(() => {})) },
    });
    void dies.runOnce();
    await vi.waitFor(() => expect(sink.messages.length).toBe(before + 1));
    expect((await row(id)).status).toBe('sending');

    accepted.advance(46); // the lease ran out
    await accepted.worker.runOnce();
    const copies = sink.messages.slice(before).filter((m) => m.subject === 'Order #14 is open');
    expect(copies).toHaveLength(2);
    expect(copies[0]!.messageId).toMatch(
      /^<lotwise\.outbox\.\d+\.[0-9a-z]+@lotwise\.example\.test>$/,
    );
    expect(copies[1]!.messageId).toBe(copies[0]!.messageId);
    const second = sink.messages.slice(before).find((m) => m.subject === 'Order #15 is open');
    expect(second?.messageId).toMatch(/^<lotwise\.outbox\./);
    expect(second?.messageId).not.toBe(copies[0]!.messageId);
    expect((await row(id)).status).toBe('sent');
    expect((await row(other)).status).toBe('sent');
    accepted.close();
    real.close();
  });

  it('when an e-mail takes longer to send than the lease, then its sender keeps the claim and no other sender sends it again', async () => {
    const id = await notifyOne(admin, new Date(), 'Order #16 is open');
    const { store, config } = testContext();
    const real = createMailTransport({ kind: 'url', url: `smtp://127.0.0.1:${sink.port}` })!;
    let release = () => {};
    const slow = outboxWorker({
      store,
      config,
      leaseSeconds: 1,
      transport: {
        async sendMail(mail) {
          if (mail.subject === 'Order #16 is open') {
            await new Promise<void>((resolve) => (release = resolve));
          }
          return real.sendMail(mail);
        },
      },
    });
    const before = sink.messages.length;
    const sending = slow.runOnce();
    await vi.waitFor(async () => expect((await row(id)).status).toBe('sending'));
    const holder = (await row(id)).claimed_by;
    await new Promise((resolve) => setTimeout(resolve, 1600)); // past the first lease

    const other = outboxWorker({ store, config, leaseSeconds: 1, transport: real });
    await other.runOnce();
    expect((await row(id)).claimed_by).toBe(holder);
    release();
    await sending;
    const copies = sink.messages.slice(before).filter((m) => m.subject === 'Order #16 is open');
    expect(copies).toHaveLength(1);
    expect((await row(id)).status).toBe('sent');
    real.close();
  });

  it('when two senders run at the same time, then each message is claimed by one of them and sent once', async () => {
    const start = new Date('2026-03-06T09:00:00.000Z');
    const subjects = Array.from({ length: 6 }, (_, i) => `Order #${20 + i} is funded`);
    for (const subject of subjects) await notifyOne(admin, start, subject);
    const before = sink.messages.length;
    const first = workerAt(start);
    const second = workerAt(start);
    const results = await Promise.all([first.worker.runOnce(), second.worker.runOnce()]);
    expect(results[0]!.claimed + results[1]!.claimed).toBe(6);
    expect(results[0]!.sent + results[1]!.sent).toBe(6);
    const delivered = sink.messages.slice(before).map((m) => m.subject);
    expect(delivered.sort()).toEqual([...subjects].sort());
    first.close();
    second.close();
  });

  it('when a slow sender lost its lease before it got to a message, then it neither sends nor records that one', async () => {
    const start = new Date('2026-03-07T09:00:00.000Z');
    const first = await notifyOne(admin, start, 'Order #30 is ready');
    const second = await notifyOne(admin, start, 'Order #31 is ready');
    const { dataSource, store, config } = testContext();
    const sent: string[] = [];
    const worker = outboxWorker({
      store,
      config,
      clock: () => start,
      transport: {
        async sendMail(mail) {
          sent.push(mail.subject);
          // Meanwhile this sender's lease on the second ran out and another sender took it.
          await dataSource.query(
            "UPDATE outbox SET claimed_by = 'other:claim', lease_until = ? WHERE id = ?",
            [new Date(start.getTime() + 90_000).toISOString(), second],
          );
        },
      },
    });
    expect(await worker.runOnce()).toMatchObject({ claimed: 2, sent: 1, lost: 1 });
    expect(sent).toEqual(['Order #30 is ready']);
    expect(await row(first)).toMatchObject({ status: 'sent', claimed_by: null });
    expect(await row(second)).toMatchObject({ status: 'sending', claimed_by: 'other:claim' });
    await dataSource.query(
      "UPDATE outbox SET status = 'sent', claimed_by = NULL, lease_until = NULL WHERE id = ?",
      [second],
    );
  });

  it('when someone chose the daily digest, then their messages wait for the digest hour and go out as one e-mail', async () => {
    const reader = await signedIn('member');
    await request(testContext().app)
      .put('/api/alerts/preferences')
      .set('Cookie', reader.cookie)
      .send({ delivery: 'digest', kinds: ['order-opened', 'order-funded'] })
      .expect(200);
    const start = new Date(2026, 2, 5, 10, 0); // 10:00 server time
    const first = await notifyOne(reader, start, 'Order #10 is open');
    const second = await notifyOne(reader, start, 'Order #11 is open');
    const digestAt = nextDigestAt(start, testContext().config.alerts.digestHour);
    expect((await row(first)).next_attempt_at).toBe(digestAt.toISOString());

    const { worker, advance, close } = workerAt(start);
    const before = sink.messages.length;
    expect(await worker.runOnce()).toMatchObject({ sent: 0 });
    advance((digestAt.getTime() - start.getTime()) / 1000);
    expect(await worker.runOnce()).toMatchObject({ sent: 2 });
    expect(sink.messages).toHaveLength(before + 1);
    const digest = sink.messages.at(-1)!;
    expect(digest.subject).toBe('Lotwise daily digest: 2 alerts');
    expect(digest.text).toContain('Order #10 is open');
    expect(digest.text).toContain('Order #11 is open');
    expect((await row(second)).status).toBe('sent');
    close();
  });

  it('when a draw crosses the reorder point, then the e-mail in the inbox says what, how much, where, and links to it', async () => {
    const make = stockFactory(() => manager.cookie);
    const chemical = await make.chemical({
      name: 'Acetone (demo)',
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 0.79,
      formula: 'C3H6O',
      reorderPoint: 500,
      ghsPictograms: ['GHS02', 'GHS07'],
    });
    const shelf = await make.location({ name: 'Flammables cabinet' });
    const lot = await make.lot(chemical.id);
    const container = await make.container(lot.id, shelf.id, { quantity: 600, unit: 'mL' });
    await request(testContext().app)
      .post(`/api/containers/${container.id}/draws`)
      .set('Cookie', manager.cookie)
      .send({ amount: 200, unit: 'mL' })
      .expect(201);

    const { worker, close } = workerAt(new Date(Date.now() + 1000));
    const before = sink.messages.length;
    await worker.runOnce();
    const mails = sink.messages.slice(before).filter((m) => m.subject?.includes('Acetone'));
    expect(mails.map((m) => (m.to && 'text' in m.to ? m.to.text : '')).sort()).toEqual(
      [admin.email, manager.email].sort(),
    );
    const mail = mails[0]!;
    expect(mail.subject).toBe(
      'Low stock: Acetone (demo) — 400.00 mL left (reorder point 500.00 mL)',
    );
    expect(mail.text).toContain(`${container.labelCode} · 400.00 mL · ${shelf.path}`);
    expect(mail.text).toContain(`http://lotwise.example.test/stock/chemicals/${chemical.id}`);
    expect(mail.text).toContain(safetyDeferral);
    const html = String(mail.html);
    expect(html).toContain(container.labelCode);
    expect(html).toContain(`href="http://lotwise.example.test/stock/chemicals/${chemical.id}"`);
    expect(html).not.toMatch(/<img|<script|<link|url\(/i);
    close();
  });
});
