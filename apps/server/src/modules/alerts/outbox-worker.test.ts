import { safetyDeferral } from '@lotwise/shared';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { alertRulesSettled, testContext } from '../../test/harness';
import { startSmtpSink } from '../../test/smtp-sink';
import { nextDigestAt } from './alerts.service';
import { outboxTestKit } from './outbox-test-kit';

const kit = outboxTestKit();
const { workerAt, row, notices, notifyOne } = kit;

describe('outbox worker', () => {
  it('when the mail server refuses twice (451), then the message is retried with back-off and delivered on the third attempt', async () => {
    const start = new Date('2026-03-02T09:00:00.000Z');
    const id = await notifyOne(kit.admin, start);
    const { worker, advance, now, close } = workerAt(start);
    kit.sink.refuseNext(2);
    const before = kit.sink.messages.length;

    expect(await worker.runOnce()).toMatchObject({ sent: 0, retrying: 1 });
    let state = await row(id);
    expect(state).toMatchObject({ status: 'queued', attempts: 1 });
    expect(state.last_error).toMatch(/451/);
    expect(state.next_attempt_at).toBe(new Date(now().getTime() + 30_000).toISOString());

    advance(10); // not due yet
    expect(await worker.runOnce()).toMatchObject({ sent: 0, retrying: 0 });
    expect(kit.sink.attempts()).toBe(1);

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
    expect(kit.sink.attempts()).toBe(3);
    expect(kit.sink.messages).toHaveLength(before + 1);

    const mail = kit.sink.messages.at(-1)!;
    expect(mail.subject).toBe('Shared order #7 is open');
    expect(mail.to && 'text' in mail.to ? mail.to.text : '').toContain(kit.admin.email);
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
    const id = await notifyOne(kit.admin, start, 'Deadline near for order #8');
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
    const id = await notifyOne(kit.manager, start, 'Order #9 was cancelled');
    const { worker, advance, close } = workerAt(start, { OUTBOX_MAX_ATTEMPTS: '2' });
    kit.sink.refuseNext(2);
    await worker.runOnce();
    expect(await notices(id)).toEqual([]); // not yet: one attempt is left
    advance(31);
    expect(await worker.runOnce()).toMatchObject({ failed: 1 });
    expect(await row(id)).toMatchObject({ status: 'failed', attempts: 2, next_attempt_at: null });
    // Written in the same transaction that marked it failed: one notice per admin.
    const queuedNotices = await notices(id);
    expect(queuedNotices.map((n) => n.recipient_email)).toEqual([kit.admin.email]);
    expect(queuedNotices[0]).toMatchObject({ status: 'queued', kind: 'outbox-failed' });

    const before = kit.sink.messages.length;
    advance(1);
    expect(await worker.runOnce()).toMatchObject({ sent: 1, failed: 0 });
    const notice = kit.sink.messages.at(-1)!;
    expect(kit.sink.messages).toHaveLength(before + 1);
    expect(notice.subject).toBe('E-mail not delivered: “Order #9 was cancelled”');
    expect(notice.to && 'text' in notice.to ? notice.to.text : '').toContain(kit.admin.email);
    expect(notice.text).toContain(`To: ${kit.manager.email}`);
    expect(notice.text).toMatch(/Last error: .*451/);
    expect(notice.text).toContain('http://lotwise.example.test/admin/outbox');
    advance(100_000);
    expect(await worker.runOnce()).toMatchObject({ sent: 0, failed: 0 });

    await request(testContext().app)
      .post(`/api/outbox/${id}/resend`)
      .set('Cookie', kit.admin.cookie)
      .expect(200);
    // The resend is due now (real time), long before this test's clock.
    expect(await worker.runOnce()).toMatchObject({ sent: 1 });
    expect(await row(id)).toMatchObject({ status: 'sent' });
    close();
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
    const before = kit.sink.messages.length;
    expect(await worker.runOnce()).toMatchObject({ sent: 0 });
    advance((digestAt.getTime() - start.getTime()) / 1000);
    expect(await worker.runOnce()).toMatchObject({ sent: 2 });
    expect(kit.sink.messages).toHaveLength(before + 1);
    const digest = kit.sink.messages.at(-1)!;
    expect(digest.subject).toBe('Lotwise daily digest: 2 alerts');
    expect(digest.text).toContain('Order #10 is open');
    expect(digest.text).toContain('Order #11 is open');
    expect((await row(second)).status).toBe('sent');
    close();
  });

  it('when a draw crosses the reorder point, then the e-mail in the inbox says what, how much, where, and links to it', async () => {
    const make = stockFactory(() => kit.manager.cookie);
    const chemical = await make.chemical({
      name: 'Acetone (demo)',
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 0.79,
      formula: 'C3H6O',
      reorderPoint: 500,
      ghsPictograms: ['GHS02', 'GHS07'],
      hazardStatements: ['H225', 'H319', 'H336'],
    });
    const shelf = await make.location({ name: 'Flammables cabinet' });
    const lot = await make.lot(chemical.id);
    const container = await make.container(lot.id, shelf.id, { quantity: 600, unit: 'mL' });
    await request(testContext().app)
      .post(`/api/containers/${container.id}/draws`)
      .set('Cookie', kit.manager.cookie)
      .send({ amount: 200, unit: 'mL' })
      .expect(201);
    // the alert rules run after the draw's commit (on PostgreSQL nothing queues them first)
    await alertRulesSettled();

    const { worker, close } = workerAt(new Date(Date.now() + 1000));
    const before = kit.sink.messages.length;
    await worker.runOnce();
    const mails = kit.sink.messages.slice(before).filter((m) => m.subject?.includes('Acetone'));
    expect(mails.map((m) => (m.to && 'text' in m.to ? m.to.text : '')).sort()).toEqual(
      [kit.admin.email, kit.manager.email].sort(),
    );
    const mail = mails[0]!;
    expect(mail.subject).toBe(
      'Low stock: Acetone (demo) — 400.00 mL left (reorder point 500.00 mL)',
    );
    expect(mail.text).toContain(`${container.labelCode} · 400.00 mL · ${shelf.path}`);
    expect(mail.text).toContain(`http://lotwise.example.test/stock/chemicals/${chemical.id}`);
    expect(mail.text).toContain(safetyDeferral);
    // The chemical's H-statements travel with it: codes with their text, in both parts.
    expect(mail.text).toContain('Hazards of Acetone (demo):');
    expect(mail.text).toContain('- H225 Highly flammable liquid and vapour.');
    expect(mail.text).toContain('- H319 Causes serious eye irritation.');
    expect(mail.text).toContain('- H336 May cause drowsiness or dizziness.');
    const html = String(mail.html);
    expect(html).toContain('<li>H225 Highly flammable liquid and vapour.</li>');
    expect(html).toContain(safetyDeferral);
    expect(html).toContain(container.labelCode);
    expect(html).toContain(`href="http://lotwise.example.test/stock/chemicals/${chemical.id}"`);
    expect(html).not.toMatch(/<img|<script|<link|url\(/i);
    close();
  });
});
