import { addDays } from '@lotwise/chem';
import {
  orderDetailSchema,
  todayIso,
  type FeeRule,
  type OrderDetail,
  type PackUnit,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { nowIso } from '../../db/sql';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';
import { CatalogItemEntity } from '../suppliers/catalog-item.entity';
import { SupplierEntity } from '../suppliers/supplier.entity';
import { fundIfAllPaid } from './order-lifecycle';

const app = () => testContext().app;
let manager = '';
let member = '';
let otherMember = '';
let viewer = '';
let admin = '';
let memberId = 0;
let otherMemberId = 0;
const stock = stockFactory(() => manager);
const deadline = addDays(todayIso(), 14);
let sequence = 0;

beforeAll(async () => {
  const m = await signedIn('member');
  const o = await signedIn('member');
  member = m.cookie;
  memberId = m.user.id;
  otherMember = o.cookie;
  otherMemberId = o.user.id;
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
  admin = (await signedIn('admin')).cookie;
});

const send = (
  method: 'post' | 'patch' | 'put' | 'delete',
  path: string,
  body: object,
  cookie: string,
) => request(app())[method](path).set('Cookie', cookie).send(body);
const get = (path: string, cookie: string) => request(app()).get(path).set('Cookie', cookie);

/** A supplier with fees, straight into its table (its own routes belong to the suppliers module). */
async function supplier(fees: { shipping: number; hazardous: number }) {
  const now = nowIso();
  const repo = testContext().dataSource.getRepository(SupplierEntity);
  const row = await repo.save({
    name: `Fictional Reagents ${++sequence}`,
    contactName: 'Order desk',
    email: 'orders@supplier.example.test',
    phone: '',
    website: '',
    orderingNotes: 'Orders before noon ship the same day.',
    minimumOrderMinor: 0,
    shippingFeeMinor: fees.shipping,
    hazardousFeeMinor: fees.hazardous,
    archived: false,
    createdAt: now,
    updatedAt: now,
  });
  return row.id;
}

async function catalogItem(
  supplierId: number,
  chemicalId: number,
  pack: {
    size: number;
    unit: PackUnit;
    priceMinor: number;
    splittable: boolean;
    hazardous?: boolean;
  },
) {
  const now = nowIso();
  const repo = testContext().dataSource.getRepository(CatalogItemEntity);
  const row = await repo.save({
    supplierId,
    sku: `SKU-${++sequence}`,
    chemicalId,
    packSize: pack.size,
    packUnit: pack.unit,
    grade: 'reagent',
    purityPercent: 99,
    priceMinor: pack.priceMinor,
    currency: 'EUR',
    hazardous: pack.hazardous ?? false,
    splittable: pack.splittable,
    discontinued: false,
    createdAt: now,
    updatedAt: now,
  });
  return row.id;
}

/**
 * An open order: 2 × 500 g of a splittable hazardous solid (€23.33 a pack) and 3 × 100 mL of a
 * liquid sold only in whole bottles (€9.99 a bottle), €12.95 shipping, €7.77 hazardous fee.
 */
async function openOrder(feeRule: FeeRule = 'value') {
  const supplierId = await supplier({ shipping: 1295, hazardous: 777 });
  const solid = await stock.chemical({
    ghsPictograms: ['GHS03', 'GHS07'],
    hazardStatements: ['H272', 'H302'],
  });
  const liquid = await stock.chemical({
    physicalState: 'liquid',
    stockUnit: 'mL',
    density: 0.79,
    formula: 'C2H6O',
  });
  const solidItem = await catalogItem(supplierId, solid.id, {
    size: 500,
    unit: 'g',
    priceMinor: 2333,
    splittable: true,
    hazardous: true,
  });
  const liquidItem = await catalogItem(supplierId, liquid.id, {
    size: 100,
    unit: 'mL',
    priceMinor: 999,
    splittable: false,
  });
  const created = await send(
    'post',
    '/api/orders',
    {
      supplierId,
      title: `Autumn order ${sequence}`,
      feeRule,
      claimDeadline: deadline,
      lines: [
        { catalogItemId: solidItem, packs: 2 },
        { catalogItemId: liquidItem, packs: 3 },
      ],
      notes: '',
    },
    manager,
  );
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  const draft = orderDetailSchema.parse(created.body);
  const opened = await send('post', `/api/orders/${draft.id}/open`, {}, manager).expect(200);
  const order = orderDetailSchema.parse(opened.body);
  const [solidLine, liquidLine] = order.lines;
  return { order, solidLine: solidLine!, liquidLine: liquidLine!, solid, liquid };
}

function claim(orderId: number, lineId: number, quantity: number, cookie = member) {
  return send('post', `/api/orders/${orderId}/shares`, { lineId, quantity }, cookie);
}

const sumOfShares = (order: OrderDetail) =>
  order.shares.reduce((sum, share) => sum + share.amountMinor, 0);

describe('shared orders: drafting and opening', () => {
  it('when a coordinator drafts an order, then fees come from the supplier, lines from the catalogue, and members do not see the draft', async () => {
    const supplierId = await supplier({ shipping: 500, hazardous: 0 });
    const chem = await stock.chemical();
    const item = await catalogItem(supplierId, chem.id, {
      size: 250,
      unit: 'g',
      priceMinor: 1450,
      splittable: false,
    });
    const created = await send(
      'post',
      '/api/orders',
      { supplierId, title: 'Draft only', lines: [{ catalogItemId: item, packs: 2 }] },
      manager,
    ).expect(201);
    const draft = orderDetailSchema.parse(created.body);
    expect(draft).toMatchObject({
      status: 'draft',
      shippingFeeMinor: 500,
      goodsMinor: 2900,
      totalMinor: 3400,
      currency: 'EUR',
      feeRule: 'value',
    });
    expect(draft.lines[0]).toMatchObject({
      sku: expect.stringMatching(/^SKU-/),
      packs: 2,
      orderedQuantity: 500,
    });
    await get(`/api/orders/${draft.id}`, member).expect(404);
    const list = await get('/api/orders?pageSize=200', member).expect(200);
    expect(list.body.items.map((item: { id: number }) => item.id)).not.toContain(draft.id);
    const managed = await get(`/api/orders?q=${encodeURIComponent('Draft only')}`, manager).expect(
      200,
    );
    expect(managed.body.items.map((item: { id: number }) => item.id)).toContain(draft.id);
    // no deadline yet: opening is refused and says why
    const open = await send('post', `/api/orders/${draft.id}/open`, {}, manager).expect(400);
    expect(open.body.error.fields.claimDeadline).toBeTruthy();
  });

  it('when an order opens, then members get an e-mail and the audit trail records it', async () => {
    const { order } = await openOrder();
    expect(order.status).toBe('open');
    expect(order.claimsOpen).toBe(true);
    const outbox = await get('/api/outbox?kind=order-opened&pageSize=200', admin).expect(200);
    const mails = outbox.body.items.filter((m: { link: string | null }) =>
      m.link?.endsWith(`/orders/${order.id}`),
    );
    expect(mails.length).toBeGreaterThanOrEqual(2);
    expect(mails.map((m: { recipient: { userId: number } }) => m.recipient.userId)).toEqual(
      expect.arrayContaining([memberId, otherMemberId]),
    );
    const audit = await get(`/api/audit?targetType=order&targetId=${order.id}`, admin).expect(200);
    expect(audit.body.items.map((e: { action: string }) => e.action)).toEqual(
      expect.arrayContaining(['order.drafted', 'order.opened']),
    );
  });
});

describe('shared orders: claims', () => {
  it('when a member claims whole packs and part of a splittable pack, then the shares hold them and a second claim adds to the first', async () => {
    const { order, solidLine, liquidLine } = await openOrder();
    await claim(order.id, liquidLine.id, 200).expect(201);
    await claim(order.id, solidLine.id, 100).expect(201);
    const again = await claim(order.id, solidLine.id, 150).expect(201);
    const detail = orderDetailSchema.parse(again.body);
    const mine = detail.shares.filter((share) => share.mine);
    expect(mine).toHaveLength(2);
    expect(mine.find((s) => s.lineId === solidLine.id)).toMatchObject({
      quantity: 250,
      unit: 'g',
      amountFixed: false,
      paymentStatus: 'unpaid',
    });
    const solid = detail.lines.find((line) => line.id === solidLine.id)!;
    expect(solid).toMatchObject({ claimedQuantity: 250, unclaimedQuantity: 750, claimStep: 1 });
    // while claims are open, shares plus the unclaimed rest make the total
    expect(sumOfShares(detail) + detail.unclaimedMinor).toBe(detail.totalMinor);
    expect(detail.lines[0]!.chemical.ghsPictograms).toEqual(['GHS03', 'GHS07']);
    expect(detail.lines[0]!.chemical.hazardStatements[0]).toEqual({
      code: 'H272',
      text: 'May intensify fire; oxidizer',
    });
    expect(detail.safetyDeferral).toMatch(/SDS/);
  });

  it('when a member claims part of a bottle that cannot be split, then it is refused with 400 and nothing is claimed', async () => {
    const { order, liquidLine } = await openOrder();
    const response = await claim(order.id, liquidLine.id, 50).expect(400);
    expect(response.body.error.fields.quantity).toMatch(/whole packs of 100/);
    const detail = orderDetailSchema.parse((await get(`/api/orders/${order.id}`, member)).body);
    expect(detail.shares).toHaveLength(0);
  });

  it('when a claim is more than what remains, then 409 says what remains and nothing changes', async () => {
    const { order, solidLine } = await openOrder();
    await claim(order.id, solidLine.id, 850, otherMember).expect(201);
    const response = await claim(order.id, solidLine.id, 200).expect(409);
    expect(response.body.error.message).toMatch(/Only 150\.00 g of this line remains unclaimed/);
    const detail = orderDetailSchema.parse((await get(`/api/orders/${order.id}`, member)).body);
    expect(detail.shares.filter((share) => share.mine)).toHaveLength(0);
  });

  it('when a member changes and withdraws their claim, then only their own can be touched', async () => {
    const { order, solidLine } = await openOrder();
    const claimed = orderDetailSchema.parse((await claim(order.id, solidLine.id, 100)).body);
    const share = claimed.shares.find((s) => s.mine)!;
    const path = `/api/orders/${order.id}/shares/${share.id}`;
    await send('patch', path, { quantity: 300 }, otherMember).expect(403);
    const changed = orderDetailSchema.parse(
      (await send('patch', path, { quantity: 300 }, member).expect(200)).body,
    );
    expect(changed.shares.find((s) => s.id === share.id)?.quantity).toBe(300);
    await send('patch', path, { quantity: 1001 }, member).expect(409);
    await send('delete', path, {}, member).expect(200);
    const after = orderDetailSchema.parse((await get(`/api/orders/${order.id}`, member)).body);
    expect(after.shares).toHaveLength(0);
  });
});

describe('shared orders: closing claims', () => {
  it('when part of the order is unclaimed, then closing claims is refused with 409 and no amount is fixed', async () => {
    const { order, solidLine } = await openOrder();
    await claim(order.id, solidLine.id, 400).expect(201);
    const response = await send('post', `/api/orders/${order.id}/close-claims`, {}, manager).expect(
      409,
    );
    expect(response.body.error.message).toMatch(
      /unclaimed .*600\.00 g.*300\.00 mL.*Take the rest for the lab/,
    );
    const detail = orderDetailSchema.parse((await get(`/api/orders/${order.id}`, manager)).body);
    expect(detail.claimsOpen).toBe(true);
    expect(detail.shares.every((share) => !share.amountFixed)).toBe(true);
  });

  for (const rule of ['value', 'member', 'mass'] as const) {
    it(`when the lab takes the rest and claims close under the "${rule}" fee rule, then the fixed shares add up exactly to the total`, async () => {
      const { order, solidLine, liquidLine } = await openOrder(rule);
      await claim(order.id, solidLine.id, 333).expect(201);
      await claim(order.id, solidLine.id, 401, otherMember).expect(201);
      await claim(order.id, liquidLine.id, 100).expect(201);
      await claim(order.id, liquidLine.id, 100, otherMember).expect(201);
      const taken = orderDetailSchema.parse(
        (await send('post', `/api/orders/${order.id}/lab-remainder`, {}, manager).expect(200)).body,
      );
      const lab = taken.shares.filter((share) => share.forLab);
      expect(lab.map((s) => [s.lineId, s.quantity])).toEqual([
        [solidLine.id, 266],
        [liquidLine.id, 100],
      ]);
      expect(taken.unclaimedMinor).toBe(0);
      const closed = orderDetailSchema.parse(
        (await send('post', `/api/orders/${order.id}/close-claims`, {}, manager).expect(200)).body,
      );
      // calc: goods 2 × 2333 + 3 × 999 = 7663; fees 1295 + 777 = 2072; total 9735
      expect(closed.totalMinor).toBe(9735);
      expect(closed.goodsMinor).toBe(7663);
      expect(closed.feesMinor).toBe(2072);
      expect(closed.shares.every((share) => share.amountFixed)).toBe(true);
      expect(sumOfShares(closed)).toBe(closed.totalMinor);
      expect(closed).toMatchObject({ claimsOpen: false, paymentsOpen: true, status: 'open' });
      expect(closed.owedMinor).toBe(closed.totalMinor);
      // the member pays online; the coordinator records the lab's share
      const mine = closed.shares.filter((share) => share.mine);
      expect(mine.every((share) => share.mayPay && !share.mayEdit)).toBe(true);
      // amounts never move again: a late claim is refused
      await claim(order.id, solidLine.id, 1).expect(409);
      const mails = await get('/api/outbox?kind=order-deadline&pageSize=200', admin).expect(200);
      const mine2 = mails.body.items.filter(
        (m: { link: string | null; recipient: { userId: number } }) =>
          m.link?.endsWith(`/orders/${order.id}`) && m.recipient.userId === memberId,
      );
      expect(mine2).toHaveLength(1);
      expect(mine2[0].subject).toMatch(/^Please pay €\d+\.\d\d for /);
    });
  }
});

describe('shared orders: status moves and permissions', () => {
  it('when the order is not funded, then marking it ordered is refused; once every share is paid it is funded and may be ordered', async () => {
    const { order, solidLine, liquidLine } = await openOrder();
    await claim(order.id, solidLine.id, 1000).expect(201);
    await claim(order.id, liquidLine.id, 300).expect(201);
    await send('post', `/api/orders/${order.id}/open`, {}, manager).expect(409);
    await send('post', `/api/orders/${order.id}/close-claims`, {}, manager).expect(200);
    await send(
      'post',
      `/api/orders/${order.id}/mark-ordered`,
      { supplierReference: 'Q-1' },
      manager,
    ).expect(409);
    await send(
      'put',
      `/api/orders/${order.id}/supplier-invoice`,
      { supplierInvoiceMinor: 9735 },
      manager,
    ).expect(409);
    // the payments module records payments; here the shares are marked paid as it would
    const { store } = testContext();
    await store.transaction(async (repos) => {
      for (const share of await repos.orders.sharesOf(order.id)) {
        await repos.orders.updateShare(share.id, {
          paymentStatus: 'paid',
          paidMinor: share.amountMinor ?? 0,
        });
      }
      expect(await fundIfAllPaid(repos, order.id, nowIso())).toBe(true);
    });
    const ordered = orderDetailSchema.parse(
      (
        await send(
          'post',
          `/api/orders/${order.id}/mark-ordered`,
          { supplierReference: 'Q-1', supplierInvoiceMinor: 9735 },
          manager,
        ).expect(200)
      ).body,
    );
    expect(ordered).toMatchObject({
      status: 'ordered',
      supplierReference: 'Q-1',
      supplierInvoiceMinor: 9735,
      collectedMinor: 9735,
      owedMinor: 0,
    });
    const invoiced = await send(
      'put',
      `/api/orders/${order.id}/supplier-invoice`,
      { supplierInvoiceMinor: 9802 },
      manager,
    ).expect(200);
    expect(invoiced.body.supplierInvoiceMinor).toBe(9802);
    // cancelling an order with money paid refunds it: payments.test.ts, through the provider
  });

  it('when an order without payments is cancelled, then members are told why and it cannot be cancelled twice', async () => {
    const { order, solidLine } = await openOrder();
    await claim(order.id, solidLine.id, 10).expect(201);
    await send('post', `/api/orders/${order.id}/cancel`, { reason: '' }, manager).expect(400);
    const cancelled = orderDetailSchema.parse(
      (
        await send(
          'post',
          `/api/orders/${order.id}/cancel`,
          { reason: 'Found a cheaper source' },
          manager,
        ).expect(200)
      ).body,
    );
    expect(cancelled).toMatchObject({
      status: 'cancelled',
      cancelReason: 'Found a cheaper source',
    });
    expect(cancelled.abilities.mayCancel).toBe(false);
    await send('post', `/api/orders/${order.id}/cancel`, { reason: 'Again' }, manager).expect(409);
    await claim(order.id, solidLine.id, 10).expect(409);
    const mails = await get('/api/outbox?kind=order-cancelled&pageSize=200', admin).expect(200);
    expect(
      mails.body.items.filter(
        (m: { link: string | null; recipient: { userId: number } }) =>
          m.link?.endsWith(`/orders/${order.id}`) && m.recipient.userId === memberId,
      ),
    ).toHaveLength(1);
  });

  it('when a member tries to manage or a viewer to claim, then both are refused with 403', async () => {
    const { order, solidLine } = await openOrder();
    expect(order.abilities).toMatchObject({ mayManage: true });
    const seen = orderDetailSchema.parse((await get(`/api/orders/${order.id}`, member)).body);
    expect(seen.abilities).toMatchObject({
      mayManage: false,
      mayClaim: true,
      mayCloseClaims: false,
    });
    await send('post', `/api/orders/${order.id}/close-claims`, {}, member).expect(403);
    await send('post', `/api/orders/${order.id}/lab-remainder`, {}, member).expect(403);
    await send('post', `/api/orders/${order.id}/cancel`, { reason: 'not mine' }, member).expect(
      403,
    );
    await claim(order.id, solidLine.id, 10, viewer).expect(403);
    await get('/api/orders', viewer).expect(403);
  });

  it('when a coordinator reduces packs below what is claimed, then it is refused; reducing to the claims lets claims close', async () => {
    const { order, solidLine, liquidLine } = await openOrder();
    await claim(order.id, solidLine.id, 600).expect(201);
    await claim(order.id, liquidLine.id, 100).expect(201);
    const tooFew = await send(
      'patch',
      `/api/orders/${order.id}/lines/${solidLine.id}`,
      { packs: 1 },
      manager,
    ).expect(409);
    expect(tooFew.body.error.message).toMatch(/at least 2 packs/);
    await send(
      'patch',
      `/api/orders/${order.id}/lines/${liquidLine.id}`,
      { packs: 1 },
      manager,
    ).expect(200);
    await claim(order.id, solidLine.id, 400, otherMember).expect(201);
    const closed = orderDetailSchema.parse(
      (await send('post', `/api/orders/${order.id}/close-claims`, {}, manager).expect(200)).body,
    );
    // calc: goods 2 × 2333 + 999 = 5665; fees 2072; total 7737
    expect(closed.totalMinor).toBe(7737);
    expect(sumOfShares(closed)).toBe(7737);
  });
});

describe('shared orders: alerts about claimed chemicals', () => {
  it('when a member claimed a chemical that runs low, then the member gets the low-stock e-mail too', async () => {
    const { order, solidLine, solid } = await openOrder();
    await claim(order.id, solidLine.id, 50, otherMember).expect(201);
    await send('patch', `/api/chemicals/${solid.id}`, { reorderPoint: 100 }, manager).expect(200);
    const shelf = await stock.location();
    const lot = await stock.lot(solid.id);
    await stock.container(lot.id, shelf.id, { quantity: 20, unit: 'g' });
    await send('post', '/api/alerts/evaluate', {}, admin).expect(200);
    const outbox = await get('/api/outbox?kind=low-stock&pageSize=200', admin).expect(200);
    const mine = outbox.body.items.filter(
      (m: { dedupKey: string | null; recipient: { userId: number } }) =>
        m.dedupKey?.startsWith(`low-stock:chemical:${solid.id}:`) &&
        m.recipient.userId === otherMemberId,
    );
    expect(mine).toHaveLength(1);
  });
});
