import { describe, expect, it, vi } from 'vitest';
import { testContext } from '../../test/harness';
import { createMailTransport } from './mail-transport';
import { outboxWorker } from './outbox-worker';
import { outboxTestKit } from './outbox-test-kit';

const kit = outboxTestKit();
const { workerAt, row, notifyOne } = kit;

describe('outbox worker: claims and leases', () => {
  it('when a sender stops after claiming a message, then another takes it once the lease runs out and it is sent once', async () => {
    const start = new Date('2026-03-04T09:00:00.000Z');
    const id = await notifyOne(kit.admin, start, 'Order #12 is open');
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

    const before = kit.sink.messages.length;
    const { worker, advance, close } = workerAt(new Date(start.getTime() + 30_000));
    expect(await worker.runOnce()).toMatchObject({ claimed: 0 }); // the lease still holds
    advance(16); // 46 s after the claim: within a minute
    expect(await worker.runOnce()).toMatchObject({ claimed: 1, sent: 1 });
    advance(60);
    expect(await worker.runOnce()).toMatchObject({ claimed: 0, sent: 0 });
    const delivered = kit.sink.messages
      .slice(before)
      .filter((m) => m.subject === 'Order #12 is open');
    expect(delivered).toHaveLength(1);
    expect(await row(id)).toMatchObject({ status: 'sent', claimed_by: null, lease_until: null });
    now = new Date(start.getTime() + 10 * 60_000);
    close();
  });

  it('when a sender dies after the mail server accepted an e-mail but before recording it, then the copy sent after the lease carries the same Message-ID', async () => {
    const start = new Date('2026-03-05T09:00:00.000Z');
    const id = await notifyOne(kit.admin, start, 'Order #14 is open');
    const other = await notifyOne(kit.admin, start, 'Order #15 is open');
    const before = kit.sink.messages.length;
    const accepted = workerAt(start);
    const real = createMailTransport({ kind: 'url', url: `smtp://127.0.0.1:${kit.sink.port}` })!;
    // Delivered, then the process is gone before the database hears of it.
    const dies = outboxWorker({
      store: testContext().store,
      config: testContext().config,
      clock: () => start,
      batchSize: 1,
      transport: { sendMail: (mail) => real.sendMail(mail).then(() => new Promise(() => {})) },
    });
    void dies.runOnce();
    await vi.waitFor(() => expect(kit.sink.messages.length).toBe(before + 1));
    expect((await row(id)).status).toBe('sending');

    accepted.advance(46); // the lease ran out
    await accepted.worker.runOnce();
    const copies = kit.sink.messages.slice(before).filter((m) => m.subject === 'Order #14 is open');
    expect(copies).toHaveLength(2);
    expect(copies[0]!.messageId).toMatch(
      /^<lotwise\.outbox\.\d+\.[0-9a-z]+@lotwise\.example\.test>$/,
    );
    expect(copies[1]!.messageId).toBe(copies[0]!.messageId);
    const second = kit.sink.messages.slice(before).find((m) => m.subject === 'Order #15 is open');
    expect(second?.messageId).toMatch(/^<lotwise\.outbox\./);
    expect(second?.messageId).not.toBe(copies[0]!.messageId);
    expect((await row(id)).status).toBe('sent');
    expect((await row(other)).status).toBe('sent');
    accepted.close();
    real.close();
  });

  it('when an e-mail takes longer to send than the lease, then its sender keeps the claim and no other sender sends it again', async () => {
    const id = await notifyOne(kit.admin, new Date(), 'Order #16 is open');
    const { store, config } = testContext();
    const real = createMailTransport({ kind: 'url', url: `smtp://127.0.0.1:${kit.sink.port}` })!;
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
    const before = kit.sink.messages.length;
    const sending = slow.runOnce();
    await vi.waitFor(async () => expect((await row(id)).status).toBe('sending'));
    const holder = (await row(id)).claimed_by;
    await new Promise((resolve) => setTimeout(resolve, 1600)); // past the first lease

    const other = outboxWorker({ store, config, leaseSeconds: 1, transport: real });
    await other.runOnce();
    expect((await row(id)).claimed_by).toBe(holder);
    release();
    await sending;
    const copies = kit.sink.messages.slice(before).filter((m) => m.subject === 'Order #16 is open');
    expect(copies).toHaveLength(1);
    expect((await row(id)).status).toBe('sent');
    real.close();
  });

  it('when two senders run at the same time, then each message is claimed by one of them and sent once', async () => {
    const start = new Date('2026-03-06T09:00:00.000Z');
    const subjects = Array.from({ length: 6 }, (_, i) => `Order #${20 + i} is funded`);
    for (const subject of subjects) await notifyOne(kit.admin, start, subject);
    const before = kit.sink.messages.length;
    const first = workerAt(start);
    const second = workerAt(start);
    const results = await Promise.all([first.worker.runOnce(), second.worker.runOnce()]);
    expect(results[0]!.claimed + results[1]!.claimed).toBe(6);
    expect(results[0]!.sent + results[1]!.sent).toBe(6);
    const delivered = kit.sink.messages.slice(before).map((m) => m.subject);
    expect(delivered.sort()).toEqual([...subjects].sort());
    first.close();
    second.close();
  });

  it('when a slow sender lost its lease before it got to a message, then it neither sends nor records that one', async () => {
    const start = new Date('2026-03-07T09:00:00.000Z');
    const first = await notifyOne(kit.admin, start, 'Order #30 is ready');
    const second = await notifyOne(kit.admin, start, 'Order #31 is ready');
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
});
