import { addDays } from '@lotwise/chem';
import {
  todayItemsPerSection,
  todayIso,
  todaySchema,
  todaySectionKeys,
  type Today,
  type TodaySectionKey,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { nowIso } from '../../db/sql';
import { signedIn } from '../../test/factories';
import { alertRulesSettled, testContext } from '../../test/harness';
import { preparationFactory } from '../../test/preparations';
import { orderReadyToPay } from '../../test/purchasing';
import { readsOf, recordStatements } from '../../test/statements';

const app = () => testContext().app;
const today = todayIso();
const people = {
  admin: { cookie: '', id: 0 },
  manager: { cookie: '', id: 0 },
  member: { cookie: '', id: 0 },
  viewer: { cookie: '', id: 0 },
};
const make = preparationFactory(() => people.manager.cookie);
const lab = {
  lowName: '',
  expiredLabel: '',
  expiringLabel: '',
  peroxideLabel: '',
  planId: 0,
  shortName: '',
  runId: 0,
  conflictPath: '',
  failedSubject: '',
  orderId: 0,
};

async function startPage(cookie: string): Promise<Today> {
  const response = await request(app()).get('/api/today').set('Cookie', cookie).expect(200);
  return todaySchema.parse(response.body);
}

const visible = (page: Today) =>
  todaySectionKeys.filter((key) => page.sections[key] !== undefined).sort();

beforeAll(async () => {
  for (const role of ['admin', 'manager', 'member', 'viewer'] as const) {
    const signed = await signedIn(role);
    people[role] = { cookie: signed.cookie, id: signed.user.id };
  }
  const shelf = await make.location({ name: 'Today shelf' });

  // Below its reorder point: 50 g left of a 100 g reorder point.
  const low = await make.chemical('Sodium thiosulfate', 'Na2S2O3', {
    reorderPoint: 100,
    ghsPictograms: ['GHS07'],
  });
  lab.lowName = low.name;
  await make.container((await make.lot(low.id)).id, shelf.id, { quantity: 50, unit: 'g' });

  // One expired, one expiring within the window.
  const dated = await make.chemical('Copper(II) sulfate', 'CuSO4', {
    ghsPictograms: ['GHS07', 'GHS09'],
  });
  const old = await make.lot(dated.id, { receivedOn: '2020-01-01', expiresOn: '2021-01-01' });
  const soon = await make.lot(dated.id, { expiresOn: addDays(today, 5) });
  lab.expiredLabel = (
    await make.container(old.id, shelf.id, { quantity: 20, unit: 'g' })
  ).labelCode;
  lab.expiringLabel = (
    await make.container(soon.id, shelf.id, { quantity: 20, unit: 'g' })
  ).labelCode;

  // A peroxide former opened years ago: its test is overdue.
  const ether = await make.chemical('Diethyl ether', 'C4H10O', {
    density: 0.713,
    peroxideClass: 'B',
    storageGroup: 'flammable',
    ghsPictograms: ['GHS02', 'GHS07'],
  });
  const etherShelf = await make.location({ name: 'Today cabinet' });
  lab.peroxideLabel = (
    await make.container((await make.lot(ether.id)).id, etherShelf.id, {
      quantity: 100,
      unit: 'mL',
      status: 'open',
      openedOn: '2020-06-01',
    })
  ).labelCode;
  // An oxidizer beside the ether: a storage conflict there.
  const nitrate = await make.chemical('Potassium nitrate', 'KNO3', {
    storageGroup: 'oxidizer',
    ghsPictograms: ['GHS03'],
  });
  await make.container((await make.lot(nitrate.id)).id, etherShelf.id, {
    quantity: 100,
    unit: 'g',
    confirm: true,
  });
  lab.conflictPath = etherShelf.path;

  // A plan for today, short of salicylic acid (1 g on hand, 2 g needed), holding what there is.
  const aspirin = await make.aspirin();
  lab.shortName = aspirin.sa.name;
  const saLot = await make.lot(aspirin.sa.id);
  await make.container(saLot.id, shelf.id, { quantity: 1, unit: 'g' });
  const ac2oLot = await make.lot(aspirin.ac2o.id);
  await make.container(ac2oLot.id, shelf.id, { quantity: 50, unit: 'mL' });
  const plan = await request(app())
    .post('/api/plans')
    .set('Cookie', people.member.cookie)
    .send({ procedureId: aspirin.procedure.id, scaleFactor: 1, benches: 1, plannedOn: today })
    .expect(201);
  lab.planId = plan.body.id;
  await request(app())
    .post(`/api/plans/${lab.planId}/reservations`)
    .set('Cookie', people.member.cookie)
    .send({})
    .expect(201);

  // The member's open run.
  const run = await request(app())
    .post('/api/runs')
    .set('Cookie', people.member.cookie)
    .send({ procedureId: aspirin.procedure.id })
    .expect(201);
  lab.runId = run.body.id;

  // An e-mail that could not be sent.
  lab.failedSubject = 'Low stock: a test message that failed';
  const at = nowIso();
  await testContext().store.repos.alerts.insertMessage({
    userId: people.manager.id,
    recipientEmail: 'technician.today@example.test',
    kind: 'low-stock',
    subject: lab.failedSubject,
    text: 'Body',
    html: '<p>Body</p>',
    link: null,
    dedupKey: null,
    delivery: 'immediate',
    status: 'failed',
    attempts: 10,
    lastError: '550 mailbox unavailable',
    nextAttemptAt: null,
    claimedBy: null,
    leaseUntil: null,
    createdAt: at,
    updatedAt: at,
    sentAt: null,
  });

  // A shared order whose claims closed: the member owes their share.
  const order = await orderReadyToPay(people.manager.cookie, [
    { userId: people.member.id, quantity: 200 },
    { userId: people.admin.id, quantity: 300 },
  ]);
  lab.orderId = order.orderId;
});

describe('GET /api/today', () => {
  it('when an admin opens the start page, then every section is there, failed e-mails among them', async () => {
    const page = await startPage(people.admin.cookie);
    expect(visible(page)).toEqual([...todaySectionKeys].sort());
    const failed = page.sections.failedEmails!;
    expect(failed.total).toBeGreaterThanOrEqual(1);
    expect(failed.items.find((item) => item.title === lab.failedSubject)).toMatchObject({
      status: 'Not sent',
      link: '/admin/outbox',
    });
    expect(failed.items[0]!.detail).toContain('550 mailbox unavailable');
    expect(page.safetyDeferral.length).toBeGreaterThan(20);
  });

  it('when a manager opens it, then stock, plans and storage sections carry their items with links and pictograms', async () => {
    const page = await startPage(people.manager.cookie);
    expect(visible(page)).toEqual(
      (
        [
          'belowReorderPoint',
          'expiry',
          'peroxideDue',
          'plans',
          'myOpenRuns',
          'storageConflicts',
          'labAreaLimits',
          'ordersWaiting',
        ] as TodaySectionKey[]
      ).sort(),
    );
    const low = page.sections.belowReorderPoint!.items.find((i) => i.title === lab.lowName)!;
    expect(low).toMatchObject({ status: 'Low', severity: 'warning' });
    expect(low.link).toMatch(/^\/stock\/chemicals\/\d+$/);
    expect(low.chemicals[0]!.ghsPictograms).toEqual(['GHS07']);

    const expiry = page.sections.expiry!.items;
    const expired = expiry.find((i) => i.detail.includes(lab.expiredLabel))!;
    const expiring = expiry.find((i) => i.detail.includes(lab.expiringLabel))!;
    expect(expired).toMatchObject({ status: 'Expired', dueOn: '2021-01-01' });
    expect(expiring).toMatchObject({ status: 'Expires soon', dueOn: addDays(today, 5) });
    expect(expired.link).toMatch(/^\/stock\/containers\/\d+$/);
    expect(expired.chemicals[0]!.ghsPictograms).toEqual(['GHS07', 'GHS09']);

    const peroxide = page.sections.peroxideDue!.items.find((i) =>
      i.detail.includes(lab.peroxideLabel),
    )!;
    expect(peroxide).toMatchObject({ status: 'Test overdue', severity: 'critical' });

    const plan = page.sections.plans!.items.find((i) => i.key === `plan:${lab.planId}`)!;
    expect(plan).toMatchObject({
      status: 'Short of 1 reagent',
      severity: 'critical',
      link: `/preparations/plans/${lab.planId}`,
      dueOn: today,
    });
    expect(plan.detail).toMatch(/^Today · 1 bench at ×1 · planned by /);
    // 2.0 g per bench × 1.10 overage = 2.2 g needed, 1 g on hand: short by 1.2 g
    expect(plan.notes).toContain(`${lab.shortName}: short by 1.20 g`); // common practice, no source
    expect(plan.notes.some((note) => /^Reserved: 2 containers until /.test(note))).toBe(true);
    // The optional catalyst is short too (none in stock), and says it is optional.
    expect(plan.notes.some((note) => /^Phosphoric acid .*\(optional\)$/.test(note))).toBe(true);
    expect(plan.chemicals[0]).toMatchObject({
      name: lab.shortName,
      ghsPictograms: ['GHS05', 'GHS07'],
    });

    const conflict = page.sections.storageConflicts!.items.find(
      (i) => i.title === lab.conflictPath,
    )!;
    expect(conflict.status).toBe('Store apart');
    expect(conflict.link).toMatch(/^\/stock\/locations\/\d+$/);
    expect(conflict.chemicals.flatMap((c) => c.ghsPictograms)).toEqual(
      expect.arrayContaining(['GHS02', 'GHS03']),
    );
    expect(page.sections.storageConflicts!.moreLink).toBe('/stock/segregation');

    // The manager opened no run and joined no order.
    expect(page.sections.myOpenRuns).toEqual({
      total: 0,
      items: [],
      moreLink: '/preparations/runs',
    });
    expect(page.sections.ordersWaiting!.total).toBe(0);
  });

  it('when a member opens it, then their open run and the order they must pay for are there, and no outbox', async () => {
    const page = await startPage(people.member.cookie);
    expect(page.sections.failedEmails).toBeUndefined();
    expect(page.sections.myOpenRuns!.items).toEqual([
      expect.objectContaining({
        key: `run:${lab.runId}`,
        status: 'Open',
        link: `/preparations/runs/${lab.runId}`,
      }),
    ]);
    const order = page.sections.ordersWaiting!.items.find((i) => i.key === `order:${lab.orderId}`)!;
    expect(order).toMatchObject({ status: 'To pay', link: `/orders/${lab.orderId}` });
    expect(order.detail).toMatch(/^You owe .+ for your share\.$/);
    expect(page.sections.plans!.items.some((i) => i.key === `plan:${lab.planId}`)).toBe(true);
  });

  it('when a viewer opens it, then only plans, storage conflicts and lab areas are there (read-only lists)', async () => {
    const page = await startPage(people.viewer.cookie);
    expect(visible(page)).toEqual(['labAreaLimits', 'plans', 'storageConflicts']);
    expect(Object.keys(page.sections).sort()).toEqual([
      'labAreaLimits',
      'plans',
      'storageConflicts',
    ]);
  });

  it('when nobody is signed in, then 401', async () => {
    await request(app()).get('/api/today').expect(401);
  });

  it('when there are more plans than the page lists, then it lists the first few, soonest first, and counts them all', async () => {
    const aspirin = await make.aspirin();
    const planOn = (plannedOn: string) =>
      request(app())
        .post('/api/plans')
        .set('Cookie', people.manager.cookie)
        .send({ procedureId: aspirin.procedure.id, scaleFactor: 1, benches: 2, plannedOn })
        .expect(201);
    for (let day = 1; day <= todayItemsPerSection + 2; day++) {
      await planOn(addDays(today, Math.min(day, 6)));
    }
    // A plan next week is not this week's.
    await planOn(addDays(today, 7));
    const page = await startPage(people.manager.cookie);
    const plans = page.sections.plans!;
    expect(plans.total).toBe(todayItemsPerSection + 3);
    expect(plans.items).toHaveLength(todayItemsPerSection);
    expect(plans.items[0]!.key).toBe(`plan:${lab.planId}`);
    const dates = plans.items.map((i) => i.dueOn!);
    expect([...dates].sort()).toEqual(dates);
    expect(plans.items.every((i) => i.dueOn! <= page.weekEnd)).toBe(true);
  });

  it('when the lab grows, then the start page sends no more statements (no reads per item)', async () => {
    const count = async () => {
      const recording = await recordStatements(testContext().dataSource);
      await startPage(people.admin.cookie);
      // The signed-in user is read or taken from its 5-second cache: not the page's own work.
      return recording.stop().filter((s) => readsOf([s], 'users').length === 0).length;
    };
    // Alert rules run after each write: let them finish so only the page's own reads count.
    await alertRulesSettled();
    const before = await count();
    // Many more conditions, conflicts and failed e-mails; the page still lists five of each.
    const shelf = await make.location({ name: 'Growth shelf' });
    for (let i = 0; i < 8; i++) {
      const chemical = await make.chemical(`Growth reagent ${i}`, 'NaCl', {
        reorderPoint: 1000,
        storageGroup: i % 2 ? 'oxidizer' : 'flammable',
      });
      const lot = await make.lot(chemical.id, { expiresOn: addDays(today, 3) });
      const place = await make.location({ name: `Growth place ${i}`, parentId: shelf.id });
      await make.container(lot.id, place.id, { quantity: 10, unit: 'g' });
      await make.container(lot.id, shelf.id, { quantity: 10, unit: 'g', confirm: true });
    }
    await alertRulesSettled();
    const after = await count();
    expect(after).toBe(before);
  });
});
