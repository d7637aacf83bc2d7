import { catalogItemSchema, pageSchema, supplierPageSchema, supplierSchema } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { nowIso } from '../../db/sql';
import { chemicalInput, signedIn } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
let member = '';
let viewer = '';
let sequence = 0;

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
  viewer = (await signedIn('viewer')).cookie;
});

const post = (path: string, body: object, cookie = manager) =>
  request(app()).post(path).set('Cookie', cookie).send(body);
const patch = (path: string, body: object, cookie = manager) =>
  request(app()).patch(path).set('Cookie', cookie).send(body);
const get = (path: string, cookie = member) => request(app()).get(path).set('Cookie', cookie);

async function makeSupplier(overrides: object = {}) {
  const response = await post('/api/suppliers', {
    name: `Test supplier ${++sequence}`,
    email: 'orders@supplier.example.test',
    shippingFeeMinor: 995,
    hazardousFeeMinor: 1800,
    ...overrides,
  }).expect(201);
  return supplierSchema.parse(response.body);
}

async function makeChemical(overrides: object = {}) {
  const response = await post(
    '/api/chemicals',
    chemicalInput({ ghsPictograms: ['GHS05'], hazardStatements: ['H314'], ...overrides }),
  ).expect(201);
  return response.body as { id: number; name: string; casNumber: string };
}

async function makeItem(supplierId: number, chemicalId: number, overrides: object = {}) {
  const response = await post('/api/catalog-items', {
    supplierId,
    chemicalId,
    sku: `SKU-${++sequence}`,
    packSize: 500,
    packUnit: 'g',
    priceMinor: 2450,
    ...overrides,
  }).expect(201);
  return catalogItemSchema.parse(response.body);
}

/** An order naming the item, written straight through the orders repository. */
async function orderNaming(item: { id: number; supplierId: number; chemicalId: number }) {
  const { store } = testContext();
  const now = nowIso();
  const orderId = await store.repos.orders.insertOrder({
    supplierId: item.supplierId,
    title: 'Test order',
    status: 'draft',
    feeRule: 'value',
    shippingFeeMinor: 0,
    hazardousFeeMinor: 0,
    currency: 'EUR',
    claimDeadline: null,
    claimsClosedAt: null,
    supplierInvoiceMinor: null,
    supplierReference: '',
    notes: '',
    coordinatorId: null,
    openedAt: null,
    orderedAt: null,
    receivedAt: null,
    closedAt: null,
    cancelledAt: null,
    cancelReason: '',
    createdAt: now,
    updatedAt: now,
  });
  await store.repos.orders.insertLine({
    orderId,
    catalogItemId: item.id,
    chemicalId: item.chemicalId,
    position: 1,
    sku: 'X',
    packs: 1,
    packSize: 500,
    packUnit: 'g',
    unitPriceMinor: 2450,
    grade: null,
    purityPercent: null,
    hazardous: false,
    splittable: false,
    createdAt: now,
    updatedAt: now,
  });
  return orderId;
}

describe('suppliers', () => {
  it('when a manager creates a supplier, then members read it with its fees in minor units and the lab currency', async () => {
    const supplier = await makeSupplier({ minimumOrderMinor: 5000, contactName: 'Ada Reed' });
    expect(supplier).toMatchObject({
      shippingFeeMinor: 995,
      hazardousFeeMinor: 1800,
      minimumOrderMinor: 5000,
      currency: 'EUR',
      archived: false,
      catalogItemCount: 0,
      orderCount: 0,
    });
    const read = supplierSchema.parse(
      (await get(`/api/suppliers/${supplier.id}`).expect(200)).body,
    );
    expect(read.contactName).toBe('Ada Reed');
    const list = supplierPageSchema.parse(
      (await get(`/api/suppliers?q=${encodeURIComponent(supplier.name)}`).expect(200)).body,
    );
    expect(list.items.map((s) => s.id)).toEqual([supplier.id]);
    expect(list.currency).toBe('EUR');
  });

  it('when a fee is not whole cents or a name is taken, then 400 or 409 naming the field', async () => {
    const bad = await post('/api/suppliers', { name: 'Fractional fees', shippingFeeMinor: 9.95 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.shippingFeeMinor).toMatch(/whole number of cents/);
    const supplier = await makeSupplier();
    const taken = await post('/api/suppliers', { name: supplier.name.toUpperCase() });
    expect(taken.status).toBe(409);
    expect(taken.body.error.fields.name).toBeTruthy();
  });

  it('when a member or viewer writes, then 403; a viewer may not even read', async () => {
    await post('/api/suppliers', { name: 'Not allowed' }, member).expect(403);
    await get('/api/suppliers', viewer).expect(403);
  });

  it('when a supplier is named by an order, then deleting it is 409 and archiving it works', async () => {
    const supplier = await makeSupplier();
    const chemical = await makeChemical();
    const item = await makeItem(supplier.id, chemical.id);
    await orderNaming(item);
    const refused = await request(app())
      .delete(`/api/suppliers/${supplier.id}`)
      .set('Cookie', manager)
      .expect(409);
    expect(refused.body.error.message).toMatch(/Archive it instead/);
    const archived = await patch(`/api/suppliers/${supplier.id}`, { archived: true }).expect(200);
    expect(archived.body.archived).toBe(true);
    const active = pageSchema(supplierSchema).parse(
      (await get('/api/suppliers?archived=false&pageSize=200').expect(200)).body,
    );
    expect(active.items.map((s) => s.id)).not.toContain(supplier.id);
  });

  it('when a supplier no order names is deleted, then its catalogue goes with it', async () => {
    const supplier = await makeSupplier();
    const item = await makeItem(supplier.id, (await makeChemical()).id);
    await request(app()).delete(`/api/suppliers/${supplier.id}`).set('Cookie', manager).expect(204);
    await get(`/api/catalog-items/${item.id}`).expect(404);
  });
});

describe('catalogue items', () => {
  it('when an item is created, then it answers the chemical name, CAS RN and hazards with the price in cents', async () => {
    const supplier = await makeSupplier();
    const chemical = await makeChemical();
    const item = await makeItem(supplier.id, chemical.id, {
      grade: 'Reagent',
      purityPercent: 99.5,
      hazardous: true,
      splittable: true,
    });
    expect(item).toMatchObject({
      supplierName: supplier.name,
      currency: 'EUR',
      priceMinor: 2450,
      hazardous: true,
      splittable: true,
      discontinued: false,
      chemical: {
        id: chemical.id,
        name: chemical.name,
        casNumber: chemical.casNumber,
        ghsPictograms: ['GHS05'],
        hazardStatements: ['H314'],
      },
    });
    const again = supplierSchema.parse((await get(`/api/suppliers/${supplier.id}`)).body);
    expect(again.catalogItemCount).toBe(1);
  });

  it('when the currency is not the lab’s, or the price has a fraction of a cent, then 400 naming the field', async () => {
    const supplier = await makeSupplier();
    const chemical = await makeChemical();
    const base = { supplierId: supplier.id, chemicalId: chemical.id, packSize: 1, packUnit: 'kg' };
    const usd = await post('/api/catalog-items', {
      ...base,
      sku: 'USD-1',
      priceMinor: 100,
      currency: 'USD',
    }).expect(400);
    expect(usd.body.error.fields.currency).toMatch(/EUR/);
    const cents = await post('/api/catalog-items', { ...base, sku: 'C-1', priceMinor: 12.5 });
    expect(cents.status).toBe(400);
    expect(cents.body.error.fields.priceMinor).toBeTruthy();
    const unit = await post('/api/catalog-items', {
      ...base,
      sku: 'U-1',
      priceMinor: 100,
      packUnit: 'lb',
    }).expect(400);
    expect(unit.body.error.fields.packUnit).toMatch(/g, kg, mg, mL, L/);
    const eur = await post('/api/catalog-items', {
      ...base,
      sku: 'EUR-1',
      priceMinor: 100,
      currency: 'EUR',
    });
    expect(eur.status).toBe(201);
  });

  it('when a SKU is taken for the same supplier, then 409; another supplier may use it', async () => {
    const first = await makeSupplier();
    const second = await makeSupplier();
    const chemical = await makeChemical();
    await makeItem(first.id, chemical.id, { sku: 'NF-100' });
    const taken = await post('/api/catalog-items', {
      supplierId: first.id,
      chemicalId: chemical.id,
      sku: 'nf-100',
      packSize: 1,
      packUnit: 'kg',
      priceMinor: 1,
    }).expect(409);
    expect(taken.body.error.fields.sku).toBeTruthy();
    await makeItem(second.id, chemical.id, { sku: 'NF-100' });
  });

  it('when the list is filtered by supplier, chemical and text, then only matching items come back', async () => {
    const supplier = await makeSupplier();
    const salt = await makeChemical({ name: `Filter salt ${sequence}` });
    const acid = await makeChemical({ name: `Filter acid ${sequence}` });
    const a = await makeItem(supplier.id, salt.id, { packSize: 100 });
    const b = await makeItem(supplier.id, salt.id, { packSize: 1000, priceMinor: 9900 });
    const c = await makeItem(supplier.id, acid.id, { grade: 'Technical' });
    const bySupplier = pageSchema(catalogItemSchema).parse(
      (await get(`/api/catalog-items?supplierId=${supplier.id}&sort=price.desc`)).body,
    );
    expect(bySupplier.total).toBe(3);
    expect(bySupplier.items[0]!.id).toBe(b.id);
    const byChemical = pageSchema(catalogItemSchema).parse(
      (await get(`/api/catalog-items?chemicalId=${salt.id}`)).body,
    );
    expect(byChemical.items.map((i) => i.id)).toEqual([a.id, b.id]);
    const byText = pageSchema(catalogItemSchema).parse(
      (await get(`/api/catalog-items?supplierId=${supplier.id}&q=technical`)).body,
    );
    expect(byText.items.map((i) => i.id)).toEqual([c.id]);
    const page = (await get(`/api/catalog-items?supplierId=${supplier.id}&page=2&pageSize=2`)).body;
    expect(page).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(page.items).toHaveLength(1);
  });

  it('when an item is on an order line, then deleting it is 409 and discontinuing it works', async () => {
    const supplier = await makeSupplier();
    const item = await makeItem(supplier.id, (await makeChemical()).id);
    await orderNaming(item);
    const refused = await request(app())
      .delete(`/api/catalog-items/${item.id}`)
      .set('Cookie', manager)
      .expect(409);
    expect(refused.body.error.message).toMatch(/discontinued instead/);
    const changed = await patch(`/api/catalog-items/${item.id}`, {
      discontinued: true,
      priceMinor: 2600,
    }).expect(200);
    expect(changed.body).toMatchObject({ discontinued: true, priceMinor: 2600, orderLineCount: 1 });
    const current = pageSchema(catalogItemSchema).parse(
      (await get(`/api/catalog-items?supplierId=${supplier.id}&discontinued=false`)).body,
    );
    expect(current.total).toBe(0);
  });

  it('when an item no order names is deleted, then it is gone', async () => {
    const supplier = await makeSupplier();
    const item = await makeItem(supplier.id, (await makeChemical()).id);
    await request(app()).delete(`/api/catalog-items/${item.id}`).set('Cookie', manager).expect(204);
    await get(`/api/catalog-items/${item.id}`).expect(404);
  });
});
