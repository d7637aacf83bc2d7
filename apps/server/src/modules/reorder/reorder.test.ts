import {
  draftResultSchema,
  draftedOrderSchema,
  reorderSuggestionListSchema,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';
import { OrderLineEntity } from '../orders/order-line.entity';
import { OrderEntity } from '../orders/order.entity';
import { catalogueFactory } from './test-catalogue';

const app = () => testContext().app;
let manager = '';
let member = '';
const make = stockFactory(() => manager);
const catalogue = catalogueFactory();
const DAY_MS = 86_400_000;

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
});

const post = (path: string, body: object, cookie = manager) =>
  request(app()).post(path).set('Cookie', cookie).send(body);

async function suggestions(query = '', cookie = manager) {
  const response = await request(app())
    .get(`/api/reorder-suggestions${query}`)
    .set('Cookie', cookie)
    .expect(200);
  return reorderSuggestionListSchema.parse(response.body);
}

/** Moves a container's ledger entries (oldest first) to the given days before now. */
async function backdate(containerId: number, daysAgo: number[]) {
  const { dataSource } = testContext();
  const rows: { id: number }[] = await dataSource.query(
    'SELECT id FROM ledger_entries WHERE container_id = ? ORDER BY id',
    [containerId],
  );
  expect(rows).toHaveLength(daysAgo.length);
  for (const [index, row] of rows.entries()) {
    const at = new Date(Date.now() - (daysAgo[index] ?? 0) * DAY_MS).toISOString();
    await dataSource.query('UPDATE ledger_entries SET created_at = ? WHERE id = ?', [at, row.id]);
  }
}

/** A chemical with a reorder point, one 500 g container received 70 days ago. */
async function stocked(overrides: object = {}) {
  const chemical = await make.chemical({
    physicalState: 'solid',
    stockUnit: 'g',
    reorderPoint: 100,
    reorderQuantity: 500,
    ...overrides,
  });
  const lot = await make.lot(chemical.id);
  const shelf = await make.location();
  const container = await make.container(lot.id, shelf.id, { quantity: 500, unit: 'g' });
  return { chemical, container };
}

const draw = (containerId: number, amount: number) =>
  post(`/api/containers/${containerId}/draws`, { amount, unit: 'g' }).expect(201);

describe('GET /api/reorder-suggestions', () => {
  it('when 40 g was drawn each week for the 8-week window, then the rate is 5 g a day and the days follow', async () => {
    const { chemical, container } = await stocked();
    for (let week = 1; week <= 7; week++) await draw(container.id, 40);
    // one more draw before the window (not counted) and a correction (not use)
    await draw(container.id, 10);
    await post(`/api/containers/${container.id}/adjustments`, {
      correction: -5,
      unit: 'g',
      note: 'spilled while counting',
    }).expect(201);
    // received 70 days ago; the draws 49, 42, … 7 days ago; the early draw 60 days ago
    await backdate(container.id, [70, 49, 42, 35, 28, 21, 14, 7, 60, 3]);
    const list = await suggestions(`?q=${encodeURIComponent(chemical.name)}`);
    expect(list.windowWeeks).toBe(8);
    const item = list.items.find((i) => i.chemical.id === chemical.id);
    // 7 × 40 g = 280 g in 56 days -> 5 g a day; 500 − 280 − 10 − 5 = 205 g on hand
    // 205 / 5 = 41 days left; (205 − 100) / 5 = 21 days to the reorder point
    expect(item).toMatchObject({
      onHand: 205,
      consumed: 280,
      rateDays: 56,
      due: false,
      quantityToBuy: 500,
      rule: 'reorder-quantity',
      onOrder: 0,
      offer: null,
    });
    expect(item?.ratePerDay).toBeCloseTo(5, 9);
    expect(item?.daysLeft).toBeCloseTo(41, 6);
    expect(item?.daysToReorderPoint).toBeCloseTo(21, 6);
    expect(item?.reorderPointOn).toBe(
      new Date(Date.now() + 21 * DAY_MS).toISOString().slice(0, 10),
    );
    expect(item?.notes).toEqual(['No supplier lists this chemical in its catalogue.']);
  });

  it('when a chemical is newer than the window, then its rate counts from its first entry', async () => {
    const { chemical, container } = await stocked();
    await draw(container.id, 100);
    await draw(container.id, 100);
    await backdate(container.id, [10, 8, 2]);
    const item = (await suggestions(`?q=${encodeURIComponent(chemical.name)}`)).items[0];
    // 200 g over the 10 days since it arrived -> 20 g a day
    expect(item?.rateDays).toBeCloseTo(10, 4);
    expect(item?.ratePerDay).toBeCloseTo(20, 4);
  });

  it('when nothing was drawn, then no rate and no days are given, and at the reorder point it is due', async () => {
    const { chemical, container } = await stocked({ reorderPoint: 600 });
    await backdate(container.id, [30]);
    const item = (await suggestions(`?q=${encodeURIComponent(chemical.name)}`)).items[0];
    expect(item).toMatchObject({ ratePerDay: null, daysLeft: null, due: true, quantityToBuy: 500 });
    // 500 g on hand, point 600 g, Q 500 g: one 500 g lifts it to 1000 g
    const due = await suggestions('?dueOnly=true');
    expect(due.items.every((i) => i.due)).toBe(true);
    expect(due.items.map((i) => i.chemical.id)).toContain(chemical.id);
  });

  it('when suppliers list the chemical, then the cheapest per gram with fees is offered and the rest follow', async () => {
    const { chemical } = await stocked({ reorderPoint: 600 });
    const north = await catalogue.supplier({ shippingFeeMinor: 1200 });
    const south = await catalogue.supplier({ shippingFeeMinor: 500, hazardousFeeMinor: 2500 });
    const big = await catalogue.item(north.id, chemical.id, { packSize: 500, priceMinor: 4000 });
    await catalogue.item(south.id, chemical.id, {
      packSize: 250,
      priceMinor: 1800,
      hazardous: true,
    });
    await catalogue.item(north.id, chemical.id, { packSize: 1, packUnit: 'L', priceMinor: 10 });
    const item = (await suggestions(`?q=${encodeURIComponent(chemical.name)}`)).items[0];
    // north: 4000 + 1200 = 5200 for 500 g (10.4 per g)
    // south: 2 × 1800 + 500 + 2500 = 6600 for 500 g (13.2 per g)
    expect(item?.offer).toMatchObject({
      supplier: { id: north.id },
      packs: [{ catalogItemId: big.id, count: 1 }],
      totalMinor: 5200,
      pricePerUnitMinor: 10.4,
    });
    expect(item?.alternatives).toEqual([
      expect.objectContaining({
        supplier: expect.objectContaining({ id: south.id }),
        totalMinor: 6600,
        hazardousFeeMinor: 2500,
      }),
    ]);
    // a litre of a solid without a bulk density cannot be counted in g
    expect(item?.notes).toEqual([expect.stringContaining('bulk density missing')]);
  });

  it('when a member asks, then they see the suggestions but may not draft', async () => {
    await suggestions('', member);
    const { chemical } = await stocked();
    await post(
      '/api/reorder-suggestions/draft-orders',
      { items: [{ chemicalId: chemical.id }] },
      member,
    ).expect(403);
  });
});

describe('drafting orders from suggestions', () => {
  it('when several chemicals are chosen, then one draft order per supplier holds their packs', async () => {
    const north = await catalogue.supplier({ shippingFeeMinor: 1000 });
    const south = await catalogue.supplier({ shippingFeeMinor: 900 });
    const a = (await stocked({ reorderPoint: 600 })).chemical;
    const b = (await stocked({ reorderPoint: 600, reorderQuantity: 200 })).chemical;
    const c = (await stocked({ reorderPoint: 600 })).chemical;
    const itemA = await catalogue.item(north.id, a.id, { packSize: 500, priceMinor: 3000 });
    const itemB = await catalogue.item(north.id, b.id, { packSize: 100, priceMinor: 900 });
    const itemC = await catalogue.item(south.id, c.id, {
      packSize: 1,
      packUnit: 'kg',
      priceMinor: 5000,
    });
    const response = await post('/api/reorder-suggestions/draft-orders', {
      items: [{ chemicalId: a.id }, { chemicalId: b.id }, { chemicalId: c.id }],
    }).expect(201);
    const { orders } = draftResultSchema.parse(response.body);
    expect(orders).toHaveLength(2);
    const northOrder = orders.find((o) => o.supplier.id === north.id)!;
    expect(northOrder).toMatchObject({ created: true, lineCount: 2 });
    const { dataSource } = testContext();
    const order = await dataSource
      .getRepository(OrderEntity)
      .findOneByOrFail({ id: northOrder.orderId });
    expect(order).toMatchObject({ status: 'draft', supplierId: north.id, shippingFeeMinor: 1000 });
    const lines = await dataSource
      .getRepository(OrderLineEntity)
      .find({ where: { orderId: northOrder.orderId }, order: { position: 'ASC' } });
    expect(lines.map((l) => [l.catalogItemId, l.packs, l.unitPriceMinor])).toEqual([
      [itemA.id, 1, 3000],
      [itemB.id, 2, 900],
    ]);
    const southLines = await dataSource
      .getRepository(OrderLineEntity)
      .findBy({ orderId: orders.find((o) => o.supplier.id === south.id)!.orderId });
    expect(southLines.map((l) => [l.catalogItemId, l.packs])).toEqual([[itemC.id, 1]]);

    // drafting again adds to the same draft; the suggestion now shows it on order
    const again = draftResultSchema.parse(
      (
        await post('/api/reorder-suggestions/draft-orders', {
          items: [{ chemicalId: a.id }],
        }).expect(201)
      ).body,
    );
    expect(again.orders).toEqual([
      expect.objectContaining({ orderId: northOrder.orderId, created: false }),
    ]);
    const after = (await suggestions(`?q=${encodeURIComponent(a.name)}`)).items[0];
    expect(after?.onOrder).toBe(1000);
  });

  it('when a chosen chemical has no offer, then nothing is drafted and the field says why', async () => {
    const supplier = await catalogue.supplier();
    const sold = (await stocked({ reorderPoint: 600 })).chemical;
    await catalogue.item(supplier.id, sold.id, { packSize: 500, priceMinor: 3000 });
    const unsold = (await stocked({ reorderPoint: 600 })).chemical;
    const before = await testContext().dataSource.getRepository(OrderEntity).count();
    const response = await post('/api/reorder-suggestions/draft-orders', {
      items: [{ chemicalId: sold.id }, { chemicalId: unsold.id }],
    }).expect(400);
    expect(response.body.error.fields['items.1.chemicalId']).toContain('No supplier lists');
    expect(await testContext().dataSource.getRepository(OrderEntity).count()).toBe(before);
  });
});

describe('POST /api/reorder-suggestions/shortfall', () => {
  it('when a plan is short, then the shortfall goes onto the best supplier’s draft order', async () => {
    const supplier = await catalogue.supplier({ shippingFeeMinor: 700 });
    const { chemical } = await stocked();
    const item = await catalogue.item(supplier.id, chemical.id, {
      packSize: 100,
      priceMinor: 1500,
    });
    const response = await post('/api/reorder-suggestions/shortfall', {
      chemicalId: chemical.id,
      quantity: 130,
      unit: 'g',
    }).expect(201);
    const drafted = draftedOrderSchema.parse(response.body);
    expect(drafted).toMatchObject({ supplier: { id: supplier.id }, created: true, lineCount: 1 });
    const lines = await testContext()
      .dataSource.getRepository(OrderLineEntity)
      .findBy({ orderId: drafted.orderId });
    expect(lines.map((l) => [l.catalogItemId, l.packs])).toEqual([[item.id, 2]]);
    await post('/api/reorder-suggestions/shortfall', {
      chemicalId: chemical.id,
      quantity: 5,
      unit: 'mL',
    }).expect(400);
  });
});
