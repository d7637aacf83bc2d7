import { addDays, addMonths } from '@lotwise/chem';
import {
  containerSchema,
  lotSchema,
  pageSchema,
  searchResultSchema,
  segregationConflictsResponseSchema,
  stockHistorySchema,
  stockItemSchema,
  stocktakeSchema,
  todayIso,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
let viewer = '';
let member = '';
const make = stockFactory(() => manager);
const today = todayIso();

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
  member = (await signedIn('member')).cookie;
});

const get = (path: string, cookie = viewer) => request(app()).get(path).set('Cookie', cookie);
const post = (path: string, body: object, cookie = manager) =>
  request(app()).post(path).set('Cookie', cookie).send(body);

async function stockOf(chemicalId: number, query = '') {
  const response = await get(`/api/stock?pageSize=200${query}`).expect(200);
  const page = pageSchema(stockItemSchema).parse(response.body);
  return page.items.find((item) => item.chemical.id === chemicalId);
}

async function containers(query: string) {
  const response = await get(`/api/containers?pageSize=200&${query}`).expect(200);
  return pageSchema(containerSchema).parse(response.body);
}

describe('lots', () => {
  it('when a lot is recorded, then it takes the chemical default purity unless given; expiry before receipt is refused', async () => {
    const chemical = await make.chemical({ defaultPurityPercent: 99 });
    const lot = lotSchema.parse(
      (
        await post('/api/lots', {
          chemicalId: chemical.id,
          receivedOn: '2026-01-05',
          grade: 'ACS reagent',
        }).expect(201)
      ).body,
    );
    expect(lot).toMatchObject({
      purityPercent: 99,
      source: 'purchased',
      madeByRunId: null,
      certificateFileName: null,
    });
    const bad = await post('/api/lots', {
      chemicalId: chemical.id,
      receivedOn: '2026-01-05',
      expiresOn: '2025-01-01',
    }).expect(400);
    expect(bad.body.error.fields.expiresOn).toMatch(/before/);
    await post('/api/lots', { chemicalId: 987654, receivedOn: '2026-01-05' }).expect(400);
    await post('/api/lots', { chemicalId: chemical.id, receivedOn: '2026-02-30' }).expect(400);
    const prepared = await post('/api/lots', {
      chemicalId: chemical.id,
      receivedOn: '2026-01-06',
      source: 'prepared',
    }).expect(201);
    expect(prepared.body.source).toBe('prepared');
    const listed = await get(`/api/lots?chemicalId=${chemical.id}&source=prepared`).expect(200);
    expect(listed.body.total).toBe(1);
  });

  it("when a lot's expiry changes, then its containers follow; a lot with containers cannot be deleted", async () => {
    const chemical = await make.chemical();
    const lot = await make.lot(chemical.id, { expiresOn: addDays(today, 400) });
    const shelf = await make.location();
    const container = await make.container(lot.id, shelf.id);
    await request(app())
      .patch(`/api/lots/${lot.id}`)
      .set('Cookie', manager)
      .send({ expiresOn: addDays(today, -1) })
      .expect(200);
    const after = (await get(`/api/containers/${container.id}`).expect(200)).body;
    expect(after).toMatchObject({ expiresOn: addDays(today, -1), expired: true });
    await request(app()).delete(`/api/lots/${lot.id}`).set('Cookie', manager).expect(409);
    await get('/api/lots/987654').expect(404);
  });
});

describe('stock overview', () => {
  it('when containers are expired, empty or disposed, then the usable total leaves them out; the display stays in the stock unit and the reorder status follows', async () => {
    const chemical = await make.chemical({
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 0.79,
      formula: 'C3H6O',
      reorderPoint: 2000,
    });
    const good = await make.lot(chemical.id, { expiresOn: addDays(today, 300) });
    const old = await make.lot(chemical.id, { receivedOn: '2020-01-01', expiresOn: '2021-01-01' });
    const shelf = await make.location();
    await make.container(good.id, shelf.id, { quantity: 1000, unit: 'mL' });
    await make.container(good.id, shelf.id, { quantity: 1.5, unit: 'L' });
    await make.container(old.id, shelf.id, { quantity: 1000, unit: 'mL' });
    const emptied = await make.container(good.id, shelf.id, { quantity: 100, unit: 'mL' });
    await post(`/api/containers/${emptied.id}/draws`, { amount: 100, unit: 'mL' }).expect(201);
    const gone = await make.container(good.id, shelf.id, { quantity: 500, unit: 'mL' });
    await post(`/api/containers/${gone.id}/disposal`, {}).expect(201);

    const item = (await stockOf(chemical.id))!;
    expect(item).toMatchObject({
      total: 2500,
      unit: 'mL',
      display: { value: 2500, unit: 'mL', text: '2,500.00 mL' },
      usableContainerCount: 2,
      containerCount: 4,
      expiredContainerCount: 1,
      reorderStatus: 'ok',
      nextExpiresOn: addDays(today, 300),
    });
    await request(app())
      .patch(`/api/chemicals/${chemical.id}`)
      .set('Cookie', manager)
      .send({ reorderPoint: 3000 })
      .expect(200);
    expect((await stockOf(chemical.id))!.reorderStatus).toBe('below');
    expect(await stockOf(chemical.id, '&belowReorderPoint=true')).toBeDefined();
    expect(await stockOf(chemical.id, '&belowReorderPoint=false')).toBeUndefined();
  });

  it('when filtered by location, then only that subtree counts; by expiring within N days, only soon-expiring chemicals', async () => {
    const chemical = await make.chemical();
    const room = await make.location();
    const shelf = await make.location({ parentId: room.id });
    const elsewhere = await make.location();
    const soon = await make.lot(chemical.id, { expiresOn: addDays(today, 10) });
    const later = await make.lot(chemical.id, { expiresOn: addDays(today, 200) });
    await make.container(soon.id, shelf.id, { quantity: 100 });
    await make.container(later.id, elsewhere.id, { quantity: 300 });
    expect((await stockOf(chemical.id))!.total).toBe(400);
    expect((await stockOf(chemical.id, `&locationId=${room.id}`))!.total).toBe(100);
    expect(await stockOf(chemical.id, `&expiringWithinDays=30`)).toBeDefined();
    const other = await make.chemical();
    await make.container(
      (await make.lot(other.id, { expiresOn: addDays(today, 90) })).id,
      elsewhere.id,
    );
    expect(await stockOf(other.id, `&expiringWithinDays=30`)).toBeUndefined();
    expect(await stockOf(other.id, `&expiringWithinDays=100`)).toBeDefined();
    await get('/api/stock?expiringWithinDays=-1').expect(400);
    await get('/api/stock?belowReorderPoint=maybe').expect(400);
  });
});

describe('container lists', () => {
  it('when filtered by expiry, reorder point, group and status, then each filter narrows the list', async () => {
    const chemical = await make.chemical({
      storageGroup: 'base',
      reorderPoint: 1000,
      synonyms: ['filter test lye'],
    });
    const shelf = await make.location();
    const expiredLot = await make.lot(chemical.id, {
      receivedOn: '2020-01-01',
      expiresOn: addDays(today, -5),
    });
    const soonLot = await make.lot(chemical.id, { expiresOn: addDays(today, 20) });
    const expired = await make.container(expiredLot.id, shelf.id);
    const soon = await make.container(soonLot.id, shelf.id);
    const open = await make.container(soonLot.id, shelf.id);
    await post(`/api/containers/${open.id}/draws`, { amount: 1, unit: 'g' }).expect(201);
    const base = `chemicalId=${chemical.id}`;
    expect((await containers(`${base}&expired=true`)).items.map((c) => c.id)).toEqual([expired.id]);
    expect((await containers(`${base}&expiringWithinDays=30`)).total).toBe(2);
    expect((await containers(`${base}&expiringWithinDays=10`)).total).toBe(0);
    expect((await containers(`${base}&status=open`)).items.map((c) => c.id)).toEqual([open.id]);
    expect((await containers(`${base}&belowReorderPoint=true`)).total).toBe(3); // 999 g usable < 1000 g
    expect((await containers(`${base}&storageGroup=oxidizer`)).total).toBe(0);
    expect((await containers('q=filter test lye')).total).toBe(3);
    const sorted = await containers(`${base}&sort=quantity.asc`);
    expect(sorted.items[0]!.id).toBe(open.id);
    expect((await containers(`q=${soon.labelCode.toLowerCase()}`)).items[0]!.id).toBe(soon.id);
    await get('/api/containers?sort=colour.asc').expect(400);
    await get('/api/containers?status=lost').expect(400);
  });
});

describe('search and history', () => {
  it('when searching, then an exact label code comes first, and chemicals match by synonym, CAS RN or formula', async () => {
    const chemical = await make.chemical({
      name: 'Searchable nitrate',
      synonyms: ['zz-synonym'],
      formula: 'KNO3',
      casNumber: '7757-79-1',
    });
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const container = await make.container(lot.id, shelf.id);
    const byLabel = searchResultSchema.parse(
      (await get(`/api/search?q=${container.labelCode}`).expect(200)).body,
    );
    expect(byLabel.containers[0]).toMatchObject({ id: container.id, exact: true });
    for (const q of ['zz-synonym', '7757-79-1', 'kno3']) {
      const result = searchResultSchema.parse((await get(`/api/search?q=${q}`).expect(200)).body);
      expect(
        result.chemicals.map((c) => c.id),
        q,
      ).toContain(chemical.id);
    }
    const synonym = searchResultSchema.parse((await get('/api/search?q=zz-syn').expect(200)).body);
    expect(synonym.chemicals[0]!.matchedSynonym).toBe('zz-synonym');
    await get('/api/search?q=').expect(400);
  });

  it('when stock moves over days, then the history has the running total per day', async () => {
    const chemical = await make.chemical();
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const container = await make.container(lot.id, shelf.id, { quantity: 200 });
    await post(`/api/containers/${container.id}/draws`, { amount: 50, unit: 'g' }).expect(201);
    const { dataSource } = testContext();
    await dataSource.query(
      "UPDATE ledger_entries SET created_at = ? WHERE container_id = ? AND reason = 'received'",
      [`${addDays(today, -20)}T10:00:00.000Z`, container.id],
    );
    const history = stockHistorySchema.parse(
      (await get(`/api/chemicals/${chemical.id}/stock-history?days=30`).expect(200)).body,
    );
    expect(history.unit).toBe('g');
    expect(history.points).toEqual([
      { date: addDays(today, -30), total: 0 },
      { date: addDays(today, -20), total: 200 },
      { date: today, total: 150 },
    ]);
    await get('/api/chemicals/987654/stock-history').expect(404);
  });
});

describe('stocktake', () => {
  it('when a manager confirms, corrects and marks missing, then adjusted and disposed entries are written and a record kept', async () => {
    const chemical = await make.chemical();
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const [a, b, c, d] = [
      await make.container(lot.id, shelf.id, { quantity: 100 }),
      await make.container(lot.id, shelf.id, { quantity: 100 }),
      await make.container(lot.id, shelf.id, { quantity: 100 }),
      await make.container(lot.id, shelf.id, { quantity: 100 }),
    ];
    const expected = (await get(`/api/locations/${shelf.id}/stocktake`, manager).expect(200)).body;
    expect(expected.containers.map((x: { id: number }) => x.id)).toEqual([
      a!.id,
      b!.id,
      c!.id,
      d!.id,
    ]);
    const response = await post('/api/stocktakes', {
      locationId: shelf.id,
      note: 'Term-end count',
      counts: [
        { containerId: a!.id, outcome: 'confirmed' },
        { containerId: b!.id, outcome: 'counted', countedQuantity: 92.5, unit: 'g' },
        { containerId: c!.id, outcome: 'missing' },
      ],
    }).expect(201);
    const stocktake = stocktakeSchema.parse(response.body);
    expect(stocktake.summary).toEqual({
      expected: 4,
      confirmed: 1,
      corrected: 1,
      missing: 1,
      notCounted: 1,
    });
    expect(stocktake.user).not.toBeNull();
    const ledgerB = (await get(`/api/containers/${b!.id}/ledger`).expect(200)).body.items[0];
    expect(ledgerB).toMatchObject({
      reason: 'adjusted',
      quantity: -7.5,
      stocktakeId: stocktake.id,
    });
    expect((await get(`/api/containers/${c!.id}`)).body.status).toBe('disposed');
    expect((await get(`/api/stocktakes/${stocktake.id}`).expect(200)).body.id).toBe(stocktake.id);
    expect((await get(`/api/stocktakes?locationId=${shelf.id}`).expect(200)).body.total).toBe(1);
  });

  it('when a count names a container not at the place, then nothing is written (400 naming the line)', async () => {
    const chemical = await make.chemical();
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const elsewhere = await make.location();
    const here = await make.container(lot.id, shelf.id, { quantity: 100 });
    const there = await make.container(lot.id, elsewhere.id, { quantity: 100 });
    const response = await post('/api/stocktakes', {
      locationId: shelf.id,
      counts: [
        { containerId: here.id, outcome: 'counted', countedQuantity: 1, unit: 'g' },
        { containerId: there.id, outcome: 'missing' },
      ],
    }).expect(400);
    expect(response.body.error.fields['counts.1.containerId']).toMatch(/not expected/);
    expect((await get(`/api/containers/${here.id}`)).body.quantity).toBe(100);
    await post('/api/stocktakes', {
      locationId: shelf.id,
      counts: [{ containerId: here.id, outcome: 'counted' }],
    }).expect(400);
    await post(
      '/api/stocktakes',
      { locationId: shelf.id, counts: [{ containerId: here.id, outcome: 'confirmed' }] },
      member,
    ).expect(403);
    await get('/api/stocktakes/987654').expect(404);
  });
});

describe('segregation', () => {
  it('when an acid is put on the bases shelf, then the saved container comes with warnings, and the conflicts list shows the place', async () => {
    const lye = await make.chemical({ name: 'Test lye', storageGroup: 'base' });
    const acid = await make.chemical({
      name: 'Test mineral acid',
      storageGroup: 'inorganic-acid',
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 1.18,
    });
    const shelf = await make.location({ name: 'Bases shelf', storageGroups: ['base'] });
    const lyeBottle = await make.container((await make.lot(lye.id)).id, shelf.id);
    const response = await post('/api/containers', {
      lotId: (await make.lot(acid.id)).id,
      locationId: shelf.id,
      quantity: 500,
      unit: 'mL',
      confirm: true,
    }).expect(201);
    const codes = response.body.warnings.map((w: { code: string }) => w.code).sort();
    expect(codes).toEqual(['incompatible_groups', 'location_group_mismatch']);
    const incompatible = response.body.warnings.find(
      (w: { code: string }) => w.code === 'incompatible_groups',
    );
    expect(incompatible).toMatchObject({
      source: 'Prudent Practices',
      labelCodes: [lyeBottle.labelCode],
    });
    expect(incompatible.reason).toMatch(/Acids and bases/);

    const conflicts = segregationConflictsResponseSchema.parse(
      (await get('/api/segregation/conflicts').expect(200)).body,
    );
    const here = conflicts.items.find((item) => item.location.id === shelf.id)!;
    expect(here.pairs).toHaveLength(1);
    expect(here.pairs[0]!.groups).toEqual(['inorganic-acid', 'base']);
    expect(here.mismatches.map((m) => m.chemicalName)).toEqual(['Test mineral acid']);
    expect(conflicts.notice).toMatch(/not a safety approval/);

    // Moving the acid away clears the place.
    const acidBottle = response.body.container.id;
    const acids = await make.location({ name: 'Acids cabinet', storageGroups: ['inorganic-acid'] });
    const moved = await post(`/api/containers/${acidBottle}/transfers`, {
      locationId: acids.id,
    }).expect(201);
    expect(moved.body.warnings).toEqual([]);
    const after = (await get('/api/segregation/conflicts').expect(200)).body;
    expect(
      after.items.find((item: { location: { id: number } }) => item.location.id === shelf.id),
    ).toBeUndefined();
  });

  it('when sodium nitrite (oxidizer, also gas-with-acid) shares a shelf with acetic acid, then both reasons are warned', async () => {
    const nitrite = await make.chemical({
      name: 'Test nitrite',
      storageGroup: 'oxidizer',
      extraHazardGroups: ['gas-with-acid'],
    });
    expect(nitrite).toMatchObject({ extraHazardGroups: ['gas-with-acid'] });
    const acetic = await make.chemical({ name: 'Test acetic', storageGroup: 'organic-acid' });
    const shelf = await make.location();
    await make.container((await make.lot(acetic.id)).id, shelf.id);
    const response = await post('/api/containers', {
      lotId: (await make.lot(nitrite.id)).id,
      locationId: shelf.id,
      quantity: 100,
      unit: 'g',
      confirm: true,
    }).expect(201);
    const groups = response.body.warnings
      .map((w: { groups: string[] }) => w.groups.join('+'))
      .sort();
    expect(groups).toEqual(['organic-acid+gas-with-acid', 'organic-acid+oxidizer']);
    const detail = (await get(`/api/containers/${response.body.container.id}`).expect(200)).body;
    expect(detail.warnings).toHaveLength(2);
  });
});

describe('peroxide formers', () => {
  it('when a class B container is opened by its first draw, then its test-or-discard date is 12 months on; peroxideDue finds overdue ones', async () => {
    const ether = await make.chemical({
      name: 'Test ether',
      peroxideClass: 'B',
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 0.71,
    });
    const shelf = await make.location();
    const fresh = await make.container(
      (await make.lot(ether.id, { receivedOn: today })).id,
      shelf.id,
      { quantity: 500, unit: 'mL' },
    );
    const sealed = (await get(`/api/containers/${fresh.id}`)).body;
    expect(sealed.peroxide).toMatchObject({ basis: 'unopened', dueOn: addMonths(today, 18) }); // EHS guidance: unopened 18 months
    const drawn = await post(`/api/containers/${fresh.id}/draws`, {
      amount: 10,
      unit: 'mL',
    }).expect(201);
    expect(drawn.body.container.peroxide).toMatchObject({ basis: 'opened', overdue: false }); // EHS guidance: class B 12 months
    expect(drawn.body.container.peroxide.dueOn.slice(0, 4)).toBe(
      String(Number(today.slice(0, 4)) + 1),
    );

    const old = await make.container(
      (await make.lot(ether.id, { receivedOn: '2023-01-01' })).id,
      shelf.id,
      {
        quantity: 500,
        unit: 'mL',
        status: 'open',
        openedOn: '2023-02-01',
      },
    );
    const due = await containers(`chemicalId=${ether.id}&peroxideDue=true`);
    expect(due.items.map((c) => c.id)).toEqual([old.id]);
    expect(due.items[0]!.peroxide).toMatchObject({ dueOn: '2024-02-01', overdue: true });
  });
});
