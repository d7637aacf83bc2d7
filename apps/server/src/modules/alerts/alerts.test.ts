import { addDays } from '@lotwise/chem';
import {
  alertListSchema,
  alertPreferencesSchema,
  outboxMessageDetailSchema,
  outboxMessageSchema,
  pageSchema,
  todayIso,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { alertRulesSettled, testContext } from '../../test/harness';
import { alertsService } from './alerts.service';

type Person = Awaited<ReturnType<typeof signedIn>>;
const app = () => testContext().app;
let admin: Person;
let manager: Person;
let member: Person;
let otherMember: Person;
let viewer: Person;
const make = stockFactory(() => manager.cookie);

beforeAll(async () => {
  admin = await signedIn('admin');
  manager = await signedIn('manager');
  member = await signedIn('member');
  otherMember = await signedIn('member');
  viewer = await signedIn('viewer');
});

interface OutboxDbRow {
  id: number;
  user_id: number;
  recipient_email: string;
  status: string;
  delivery: string;
  text: string;
  html: string;
  dedup_key: string;
}

async function outboxRows(keyPrefix: string): Promise<OutboxDbRow[]> {
  // the rules run after a ledger change commits: wait for them before reading the outbox
  await alertRulesSettled();
  return testContext().dataSource.query(
    'SELECT * FROM outbox WHERE dedup_key LIKE ? ORDER BY user_id',
    [`${keyPrefix}%`],
  );
}

const draw = (containerId: number, amount: number, who: Person = member) =>
  request(app())
    .post(`/api/containers/${containerId}/draws`)
    .set('Cookie', who.cookie)
    .send({ amount, unit: 'g' })
    .expect(201);

/** A chemical with a reorder point of 100 g and one container of `quantity` g. */
async function stocked(quantity = 150, lot: object = {}) {
  const chemical = await make.chemical({ reorderPoint: 100, reorderQuantity: 500 });
  const shelf = await make.location({ name: `Shelf ${chemical.id}` });
  const madeLot = await make.lot(chemical.id, lot);
  const container = await make.container(madeLot.id, shelf.id, { quantity, unit: 'g' });
  return { chemical, shelf, container };
}

describe('a draw that crosses the reorder point', () => {
  it('when a draw takes stock below the reorder point, then exactly one message per recipient is queued, and a second draw queues none', async () => {
    const { chemical, shelf, container } = await stocked(150);
    const key = `low-stock:chemical:${chemical.id}:`;

    await draw(container.id, 30); // 120 g: still above
    expect(await outboxRows(key)).toEqual([]);

    await draw(container.id, 30); // 90 g: crossed
    const rows = await outboxRows(key);
    // Managers and admins for everything; the member who drew it; not the other member or the viewer.
    expect(rows.map((r) => r.user_id).sort((a, b) => a - b)).toEqual(
      [admin.user.id, manager.user.id, member.user.id].sort((a, b) => a - b),
    );
    expect(rows.every((r) => r.status === 'queued' && r.delivery === 'immediate')).toBe(true);
    const text = rows[0]!.text;
    expect(text).toContain(chemical.name);
    expect(text).toContain('Usable stock: 90.00 g');
    expect(text).toContain('Reorder point: 100.00 g');
    expect(text).toContain(`${container.labelCode} · 90.00 g · ${shelf.path}`);
    expect(text).toContain(`http://lotwise.example.test/stock/chemicals/${chemical.id}`);

    await draw(container.id, 10); // 80 g: same condition, inside the window
    expect(await outboxRows(key)).toHaveLength(3);
  });

  it('when the draw is refused, then no message is written either (same transaction)', async () => {
    const { chemical, container } = await stocked(150);
    await request(app())
      .post(`/api/containers/${container.id}/draws`)
      .set('Cookie', member.cookie)
      .send({ amount: 500, unit: 'g' })
      .expect(409);
    expect(await outboxRows(`low-stock:chemical:${chemical.id}:`)).toEqual([]);
  });

  it('when an adjustment or a disposal empties it, then "out of stock" is a new condition and mails again', async () => {
    const { chemical, container } = await stocked(90);
    expect(await outboxRows(`low-stock:chemical:${chemical.id}:warning`)).toHaveLength(2);
    await request(app())
      .post(`/api/containers/${container.id}/disposal`)
      .set('Cookie', manager.cookie)
      .send({ note: 'Spilled' })
      .expect(201);
    const out = await outboxRows(`low-stock:chemical:${chemical.id}:critical`);
    expect(out.map((r) => r.user_id).sort()).toEqual([admin.user.id, manager.user.id].sort());
  });
});

describe('evaluating on demand and deduplication', () => {
  it('when the admin evaluates twice, then the second run finds duplicates and queues nothing new for them', async () => {
    const { chemical } = await stocked(50);
    const key = `low-stock:chemical:${chemical.id}:`;
    const before = (await outboxRows(key)).length;
    expect(before).toBe(2); // admin and manager, from receiving it already low
    const first = await request(app())
      .post('/api/alerts/evaluate')
      .set('Cookie', admin.cookie)
      .expect(200);
    expect(first.body.duplicates).toBeGreaterThanOrEqual(2);
    expect(await outboxRows(key)).toHaveLength(before);
    await request(app()).post('/api/alerts/evaluate').set('Cookie', manager.cookie).expect(403);
  });

  it('when the window has passed, then the same condition mails the same people again', async () => {
    const { store, config } = testContext();
    const { chemical } = await stocked(40);
    const key = `low-stock:chemical:${chemical.id}:`;
    const alerts = alertsService(store, config);
    const soon = new Date(Date.now() + 23 * 3600_000);
    const later = new Date(Date.now() + 25 * 3600_000);
    await store.transaction((repos) => alerts.evaluate(repos, { now: soon }));
    expect(await outboxRows(key)).toHaveLength(2);
    await store.transaction((repos) => alerts.evaluate(repos, { now: later }));
    expect(await outboxRows(key)).toHaveLength(4);
  });
});

describe('GET /api/alerts: current conditions', () => {
  it('when stock is low and a container expires soon, then both are listed with severity and links', async () => {
    const { chemical } = await stocked(80);
    const expiring = await stocked(400, { expiresOn: addDays(todayIso(), 10) });
    const response = await request(app()).get('/api/alerts').set('Cookie', member.cookie);
    const list = alertListSchema.parse(response.body);
    expect(list.expiryWindowDays).toBe(30);
    expect(list.items).toContainEqual(
      expect.objectContaining({
        key: `low-stock:chemical:${chemical.id}`,
        kind: 'low-stock',
        severity: 'warning',
        link: `/stock/chemicals/${chemical.id}`,
        container: null,
      }),
    );
    const soon = list.items.find((a) => a.key === `expiring:container:${expiring.container.id}`);
    expect(soon).toMatchObject({
      kind: 'expiring',
      link: `/stock/containers/${expiring.container.id}`,
      container: { labelCode: expiring.container.labelCode, locationPath: expiring.shelf.path },
      dueOn: addDays(todayIso(), 10),
    });
    const onlyExpiring = await request(app())
      .get('/api/alerts?kind=expiring')
      .set('Cookie', member.cookie)
      .expect(200);
    expect(onlyExpiring.body.items.every((a: { kind: string }) => a.kind === 'expiring')).toBe(
      true,
    );
    await request(app()).get('/api/alerts').set('Cookie', viewer.cookie).expect(403);
    await request(app()).get('/api/alerts?kind=nonsense').set('Cookie', member.cookie).expect(400);
  });
});

describe('preferences', () => {
  it('when nothing was chosen, then the role decides: viewers get nothing, members their own chemicals', async () => {
    const forViewer = alertPreferencesSchema.parse(
      (await request(app()).get('/api/alerts/preferences').set('Cookie', viewer.cookie).expect(200))
        .body,
    );
    expect(forViewer).toMatchObject({ kinds: [], isDefault: true, scope: 'mine' });
    const forManager = await request(app())
      .get('/api/alerts/preferences')
      .set('Cookie', manager.cookie)
      .expect(200);
    expect(forManager.body).toMatchObject({ scope: 'all', delivery: 'immediate', digestHour: 7 });
    await request(app()).get('/api/alerts/preferences').expect(401);
  });

  it('when a member saves a choice, then it is kept; unknown kinds and fields are refused', async () => {
    const saved = await request(app())
      .put('/api/alerts/preferences')
      .set('Cookie', otherMember.cookie)
      .send({ delivery: 'digest', kinds: ['expired', 'low-stock'] })
      .expect(200);
    expect(saved.body).toMatchObject({
      delivery: 'digest',
      kinds: ['low-stock', 'expired'],
      isDefault: false,
    });
    const bad = await request(app())
      .put('/api/alerts/preferences')
      .set('Cookie', otherMember.cookie)
      .send({ delivery: 'hourly', kinds: ['everything'], extra: 1 })
      .expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(
      expect.arrayContaining(['delivery', 'kinds.0', 'extra']),
    );
  });
});

describe('unsubscribe links', () => {
  const pathOf = (url: string) => url.replace('http://lotwise.example.test', '');

  it('when the link is opened (GET), then a page asks to confirm and nothing changes', async () => {
    const alerts = alertsService(testContext().store, testContext().config);
    const url = pathOf(alerts.unsubscribeUrl(member.user.id, 'low-stock'));
    for (let i = 0; i < 3; i++) {
      // a link scanner may open it several times, with HEAD too
      const response = await request(app()).get(url).expect(200);
      expect(response.headers['content-type']).toMatch(/text\/html/);
      expect(response.text).toContain('Stop these e-mails?');
      expect(response.text).toContain('Nothing has changed yet');
      expect(response.text).toContain(member.email);
      expect(response.text).toMatch(
        /<form method="post" action="\/api\/alerts\/unsubscribe\?token=/,
      );
      expect(response.text).toContain(
        'Stop e-mails about: stock at or below its reorder point</button>',
      );
      await request(app()).head(url).expect(200);
    }
    const preferences = await request(app())
      .get('/api/alerts/preferences')
      .set('Cookie', member.cookie)
      .expect(200);
    expect(preferences.body.isDefault).toBe(true);
    expect(preferences.body.kinds).toContain('low-stock');
  });

  it('when the confirmation button posts the form, then that kind stops and a page confirms it', async () => {
    const alerts = alertsService(testContext().store, testContext().config);
    const url = pathOf(alerts.unsubscribeUrl(member.user.id, 'low-stock'));
    const page = await request(app()).get(url).expect(200);
    const action = /<form method="post" action="([^"]+)"/
      .exec(page.text)![1]!
      .replace(/&amp;/g, '&');
    const response = await request(app())
      .post(action)
      .type('form')
      .send('List-Unsubscribe=One-Click')
      .expect(200);
    expect(response.text).toContain('Unsubscribed');
    expect(response.text).toContain(member.email);
    const preferences = await request(app())
      .get('/api/alerts/preferences')
      .set('Cookie', member.cookie)
      .expect(200);
    expect(preferences.body.kinds).not.toContain('low-stock');
    expect(preferences.body.kinds).toContain('expired');
    // Opening the link again says so instead of offering the button.
    const again = await request(app()).get(url).expect(200);
    expect(again.text).toContain('Already unsubscribed');
    expect(again.text).not.toContain('<form');

    // And the member is no longer mailed about low stock of chemicals they drew.
    const { chemical, container } = await stocked(150);
    await draw(container.id, 60);
    const rows = await outboxRows(`low-stock:chemical:${chemical.id}:`);
    expect(rows.map((r) => r.user_id)).not.toContain(member.user.id);
    expect(rows).toHaveLength(2);
  });

  it('when the token was tampered with, then a 400 page says so and nothing changes', async () => {
    const alerts = alertsService(testContext().store, testContext().config);
    const url = pathOf(alerts.unsubscribeUrl(manager.user.id, 'all'));
    const token = new URL(`http://x${url}`).searchParams.get('token')!;
    const [, signature] = token.split('.');
    const forged = `${Buffer.from(JSON.stringify({ u: admin.user.id, k: 'all' })).toString('base64url')}.${signature}`;
    for (const bad of [forged, `${token}x`, 'nonsense', '']) {
      for (const method of ['get', 'post'] as const) {
        const target = `/api/alerts/unsubscribe?token=${encodeURIComponent(bad)}`;
        const agent = request(app());
        const response = await (method === 'get' ? agent.get(target) : agent.post(target)).expect(
          400,
        );
        expect(response.text).toContain('does not work');
      }
    }
    await request(app()).get('/api/alerts/unsubscribe').expect(400);
    const adminPreferences = await request(app())
      .get('/api/alerts/preferences')
      .set('Cookie', admin.cookie)
      .expect(200);
    expect(adminPreferences.body.isDefault).toBe(true);
  });

  it('when a mail client posts the one-click form (RFC 8058), then it unsubscribes at once', async () => {
    const alerts = alertsService(testContext().store, testContext().config);
    await request(app())
      .post(pathOf(alerts.unsubscribeUrl(otherMember.user.id, 'all')))
      .type('form')
      .send('List-Unsubscribe=One-Click')
      .expect(200);
    const preferences = await request(app())
      .get('/api/alerts/preferences')
      .set('Cookie', otherMember.cookie)
      .expect(200);
    expect(preferences.body.kinds).toEqual([]);
  });
});

describe('outbox admin routes', () => {
  it('when the admin lists the outbox, then it is paged and filtered by status; others may not', async () => {
    const response = await request(app())
      .get('/api/outbox?status=queued&pageSize=2')
      .set('Cookie', admin.cookie)
      .expect(200);
    const page = pageSchema(outboxMessageSchema).parse(response.body);
    expect(page.items).toHaveLength(2);
    expect(page.total).toBeGreaterThan(2);
    expect(page.items.every((m) => m.status === 'queued')).toBe(true);
    expect(page.items[0]!.recipient.displayName).toBeTruthy();
    const none = await request(app())
      .get('/api/outbox?status=failed')
      .set('Cookie', admin.cookie)
      .expect(200);
    expect(none.body.total).toBe(0);
    await request(app()).get('/api/outbox').set('Cookie', manager.cookie).expect(403);
    await request(app()).get('/api/outbox?status=lost').set('Cookie', admin.cookie).expect(400);
  });

  it('when the admin resends a failed message, then it is queued again with its last error kept', async () => {
    const { dataSource } = testContext();
    const [row] = await dataSource.query('SELECT id FROM outbox ORDER BY id LIMIT 1');
    await dataSource.query(
      "UPDATE outbox SET status = 'failed', attempts = 10, last_error = '451 Try again later', next_attempt_at = NULL WHERE id = ?",
      [row.id],
    );
    const detail = outboxMessageDetailSchema.parse(
      (await request(app()).get(`/api/outbox/${row.id}`).set('Cookie', admin.cookie).expect(200))
        .body,
    );
    expect(detail).toMatchObject({ status: 'failed', attempts: 10 });
    expect(detail.text.length).toBeGreaterThan(20);
    const resent = await request(app())
      .post(`/api/outbox/${row.id}/resend`)
      .set('Cookie', admin.cookie)
      .expect(200);
    expect(resent.body).toMatchObject({
      status: 'queued',
      attempts: 0,
      lastError: '451 Try again later',
    });
    expect(resent.body.nextAttemptAt).toBeTruthy();
    await request(app()).post('/api/outbox/999999/resend').set('Cookie', admin.cookie).expect(404);
  });
});
