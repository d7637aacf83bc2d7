import {
  containerChangeSchema,
  containerDetailSchema,
  ledgerCheckResultSchema,
  ledgerEntrySchema,
  pageSchema,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';
import { tinyPdf } from '../../test/sample-files';

const app = () => testContext().app;
let manager = '';
let member = '';
let viewer = '';
let admin = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
  viewer = (await signedIn('viewer')).cookie;
  admin = (await signedIn('admin')).cookie;
});

const post = (path: string, body: object, cookie = manager) =>
  request(app()).post(path).set('Cookie', cookie).send(body);
const get = (path: string, cookie = viewer) => request(app()).get(path).set('Cookie', cookie);

async function solidContainer(body: object = {}) {
  const chemical = await make.chemical({ physicalState: 'solid', stockUnit: 'g', density: 2.16 });
  const lot = await make.lot(chemical.id);
  const shelf = await make.location();
  const container = await make.container(lot.id, shelf.id, {
    quantity: 500,
    unit: 'g',
    tareMass: 120,
    ...body,
  });
  return { chemical, lot, shelf, container };
}

async function ledgerOf(id: number) {
  const response = await get(`/api/containers/${id}/ledger?pageSize=200`).expect(200);
  return pageSchema(ledgerEntrySchema).parse(response.body);
}

async function ledgerCheck() {
  const response = await get('/api/maintenance/ledger-check', admin).expect(200);
  return ledgerCheckResultSchema.parse(response.body);
}

describe('receiving containers', () => {
  it('when a container is received, then it gets the next LW- label code, a received entry and the balance', async () => {
    const { container, shelf } = await solidContainer();
    const other = await solidContainer();
    expect(container.labelCode).toMatch(/^LW-\d{5}$/);
    expect(Number(other.container.labelCode.slice(3))).toBe(
      Number(container.labelCode.slice(3)) + 1,
    );
    const detail = containerDetailSchema.parse(
      (await get(`/api/containers/${container.id}`).expect(200)).body,
    );
    expect(detail).toMatchObject({ quantity: 500, unit: 'g', status: 'sealed', tareMass: 120 });
    expect(detail.location.path).toBe(shelf.path);
    expect(detail.lot.supplierName).toMatch(/fictional/);
    const ledger = await ledgerOf(container.id);
    expect(ledger.items).toMatchObject([{ reason: 'received', quantity: 500, balanceAfter: 500 }]);
  });

  it('when a liquid counted in mL is received by mass, then the density converts it', async () => {
    const chemical = await make.chemical({
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 0.8,
      formula: 'C2H6O',
    });
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const container = await make.container(lot.id, shelf.id, { quantity: 400, unit: 'g' });
    expect(container).toMatchObject({ quantity: 500, unit: 'mL' }); // 400 g / 0.8 g/mL
  });

  it('when the lot or location does not exist, then 400 names the field', async () => {
    const { shelf, lot } = await solidContainer();
    const noLot = await post('/api/containers', {
      lotId: 987654,
      locationId: shelf.id,
      quantity: 1,
      unit: 'g',
    }).expect(400);
    expect(noLot.body.error.fields.lotId).toMatch(/no lot/);
    const noPlace = await post('/api/containers', {
      lotId: lot.id,
      locationId: 987654,
      quantity: 1,
      unit: 'g',
    }).expect(400);
    expect(noPlace.body.error.fields.locationId).toMatch(/no location/);
  });

  it('when a label code is looked up, then it finds the container, however it was typed; an unknown one is 404', async () => {
    const { container } = await solidContainer();
    const typed = `lw-${Number(container.labelCode.slice(3))}`;
    expect((await get(`/api/containers/by-label/${typed}`).expect(200)).body.id).toBe(container.id);
    const unknown = await get('/api/containers/by-label/LW-99998').expect(404);
    expect(unknown.body.error.message).toMatch(/LW-99998/);
    await get('/api/containers/by-label/not%20a%20code!').expect(400);
    await get('/api/containers/987654').expect(404);
  });

  it('when the chemical has an uploaded SDS, then the container answers it for a direct link', async () => {
    const { chemical, container } = await solidContainer();
    const before = containerDetailSchema.parse(
      (await get(`/api/containers/${container.id}`).expect(200)).body,
    );
    expect(before.sds).toBeNull();
    await request(app())
      .post(`/api/chemicals/${chemical.id}/sds`)
      .set('Cookie', manager)
      .attach('file', tinyPdf(), 'Demo salt SDS.pdf')
      .expect(201);
    const after = containerDetailSchema.parse(
      (await get(`/api/containers/${container.id}`).expect(200)).body,
    );
    expect(after.sds).toMatchObject({
      fileName: 'Demo salt SDS.pdf',
      contentType: 'application/pdf',
    });
  });

  it('when a container keeps a code that is not an LW- code, then that code finds it in any case; an unknown one is 404', async () => {
    const { container } = await solidContainer();
    // What an import writes for a supplier's or an earlier label code kept as written.
    await testContext().dataSource.query(
      'UPDATE containers SET label_code = ?, label_number = NULL WHERE id = ?',
      [`FW/B-${container.id}`, container.id],
    );
    const code = encodeURIComponent(`FW/B-${container.id}`);
    expect((await get(`/api/containers/by-label/${code}`).expect(200)).body.labelCode).toBe(
      `FW/B-${container.id}`,
    );
    const lower = encodeURIComponent(`fw/b-${container.id}`);
    expect((await get(`/api/containers/by-label/${lower}`).expect(200)).body.id).toBe(container.id);
    const unknown = await get('/api/containers/by-label/FW-NOT-HERE').expect(404);
    expect(unknown.body.error.message).toMatch(/FW-NOT-HERE/);
  });
});

describe('draws', () => {
  it('when an amount is drawn from a sealed container, then the balance drops, it opens and opened-on is today', async () => {
    const { container } = await solidContainer();
    const response = await post(
      `/api/containers/${container.id}/draws`,
      { amount: 12.5, unit: 'g' },
      member,
    ).expect(201);
    const change = containerChangeSchema.parse(response.body);
    expect(change.container).toMatchObject({ quantity: 487.5, status: 'open' });
    expect(change.container.openedOn).toBe(new Date().toISOString().slice(0, 10));
    expect(change.entries).toMatchObject([
      { reason: 'drawn', quantity: -12.5, balanceAfter: 487.5 },
    ]);
    expect(change.entries[0]!.user).not.toBeNull();
  });

  it('when a gross mass is entered, then drawn = balance − (gross − tare)', async () => {
    const { container } = await solidContainer();
    // 500 g in a 120 g bottle weighs 620 g; now it weighs 590.25 g, so 29.75 g were taken.
    const response = await post(`/api/containers/${container.id}/draws`, {
      grossMass: 590.25,
      unit: 'g',
    }).expect(201);
    expect(response.body.container.quantity).toBeCloseTo(470.25, 6);
    expect(response.body.entries[0].quantity).toBeCloseTo(-29.75, 6);
    const inKg = await post(`/api/containers/${container.id}/draws`, {
      grossMass: 0.59,
      unit: 'kg',
    }).expect(201);
    expect(inKg.body.container.quantity).toBeCloseTo(470, 6);
  });

  it('when a volume container is weighed, then the net mass goes through the density', async () => {
    const chemical = await make.chemical({
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 0.79,
      formula: 'C3H6O',
    });
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const container = await make.container(lot.id, shelf.id, {
      quantity: 1000,
      unit: 'mL',
      tareMass: 400,
    });
    // Net 790 g now = 1000 mL: 400 + 790 − 79 (100 mL drawn) = 1111 g gross.
    const response = await post(`/api/containers/${container.id}/draws`, {
      grossMass: 1111,
      unit: 'g',
    }).expect(201);
    expect(response.body.container.quantity).toBeCloseTo(900, 6);
    const byMass = await post(`/api/containers/${container.id}/draws`, {
      amount: 7.9,
      unit: 'g',
    }).expect(201);
    expect(byMass.body.container.quantity).toBeCloseTo(890, 6);
  });

  it('when a volume is drawn from a chemical without density, then 400 names density and says what to do', async () => {
    const chemical = await make.chemical({
      physicalState: 'liquid',
      stockUnit: 'g',
      density: null,
    });
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const container = await make.container(lot.id, shelf.id);
    const response = await post(`/api/containers/${container.id}/draws`, {
      amount: 5,
      unit: 'mL',
    }).expect(400);
    expect(response.body.error.fields.density).toMatch(/add it/);
    expect(response.body.error.message).toMatch(/Add its density/);
    expect((await ledgerOf(container.id)).total).toBe(1);
  });

  it('when a draw is larger than the balance, then 409 names the container, what is available and the unit, and nothing is written', async () => {
    const { container } = await solidContainer();
    const response = await post(`/api/containers/${container.id}/draws`, {
      amount: 600,
      unit: 'g',
    }).expect(409);
    expect(response.body.error.code).toBe('conflict');
    expect(response.body.error.message).toContain(container.labelCode);
    expect(response.body.error.message).toContain('500.00 g');
    expect((await ledgerOf(container.id)).total).toBe(1);
    expect((await get(`/api/containers/${container.id}`)).body).toMatchObject({
      quantity: 500,
      status: 'sealed',
    });
  });

  const badDraws: [string, object, string][] = [
    ['a negative amount', { amount: -5, unit: 'g' }, 'amount'],
    ['a zero amount', { amount: 0, unit: 'g' }, 'amount'],
    ['a non-numeric amount', { amount: 'five', unit: 'g' }, 'amount'],
    ['an unknown unit', { amount: 5, unit: 'spoons' }, 'unit'],
    ['an amount in mol', { amount: 5, unit: 'mol' }, 'unit'],
    ['both amount and gross mass', { amount: 5, grossMass: 600, unit: 'g' }, 'amount'],
    ['neither', { unit: 'g' }, 'amount'],
    ['a gross mass in mL', { grossMass: 600, unit: 'mL' }, 'unit'],
    ['a negative gross mass', { grossMass: -1, unit: 'g' }, 'grossMass'],
  ];
  for (const [what, body, field] of badDraws) {
    it(`when a draw has ${what}, then 400 names ${field}`, async () => {
      const { container } = await solidContainer();
      const response = await post(`/api/containers/${container.id}/draws`, body).expect(400);
      expect(response.body.error.fields[field], JSON.stringify(response.body)).toBeTruthy();
    });
  }

  it('when the gross mass is below the tare, then 400 says so and nothing is written', async () => {
    const { container } = await solidContainer();
    const response = await post(`/api/containers/${container.id}/draws`, {
      grossMass: 100,
      unit: 'g',
    }).expect(400);
    expect(response.body.error.fields.grossMass).toMatch(/below the tare/);
    expect((await ledgerOf(container.id)).total).toBe(1);
  });

  it('when a container without tare is weighed, then 400 asks for the tare', async () => {
    const { container } = await solidContainer({ tareMass: null });
    const response = await post(`/api/containers/${container.id}/draws`, {
      grossMass: 300,
      unit: 'g',
    }).expect(400);
    expect(response.body.error.fields.grossMass).toMatch(/no tare/);
  });

  it('when a draw takes exactly what is left, then the container is empty; a viewer may not draw', async () => {
    const { container } = await solidContainer();
    const response = await post(`/api/containers/${container.id}/draws`, {
      amount: 0.5,
      unit: 'kg',
    }).expect(201);
    expect(response.body.container).toMatchObject({ quantity: 0, status: 'empty' });
    await post(`/api/containers/${container.id}/draws`, { amount: 1, unit: 'g' }, viewer).expect(
      403,
    );
    await post('/api/containers/987654/draws', { amount: 1, unit: 'g' }).expect(404);
  });

  it('when 40 draws arrive at once that together would overdraw, then the balance never goes below zero and the ledger holds', async () => {
    const { container } = await solidContainer({ quantity: 100 });
    const amount = 3; // 40 × 3 g = 120 g > 100 g
    const responses = await Promise.all(
      Array.from({ length: 40 }, () =>
        request(app())
          .post(`/api/containers/${container.id}/draws`)
          .set('Cookie', member)
          .send({ amount, unit: 'g' }),
      ),
    );
    const succeeded = responses.filter((r) => r.status === 201).length;
    const refused = responses.filter((r) => r.status === 409).length;
    expect(succeeded + refused).toBe(40);
    expect(succeeded).toBe(33); // floor(100 / 3)
    const detail = (await get(`/api/containers/${container.id}`).expect(200)).body;
    expect(detail.quantity).toBeGreaterThanOrEqual(0);
    expect(detail.quantity).toBeCloseTo(100 - succeeded * amount, 6);
    const ledger = await ledgerOf(container.id);
    expect(ledger.items.filter((e) => e.reason === 'drawn')).toHaveLength(succeeded);
    expect(ledger.items.every((e) => e.balanceAfter >= 0)).toBe(true);
    expect((await ledgerCheck()).ok).toBe(true);
  });
});

describe('adjustments, splits, transfers and disposal', () => {
  it('when a counted amount is set, then an adjusted entry records the difference with the note', async () => {
    const { container } = await solidContainer();
    const response = await post(`/api/containers/${container.id}/adjustments`, {
      countedQuantity: 480,
      unit: 'g',
      note: 'Weighed at the bench',
    }).expect(201);
    expect(response.body.entries).toMatchObject([
      { reason: 'adjusted', quantity: -20, balanceAfter: 480, note: 'Weighed at the bench' },
    ]);
    const signed = await post(`/api/containers/${container.id}/adjustments`, {
      correction: 5,
      unit: 'g',
      note: 'Spill recovered',
    }).expect(201);
    expect(signed.body.container.quantity).toBe(485);
  });

  it('when an adjustment has no note, or would go below zero, then it is refused', async () => {
    const { container } = await solidContainer();
    const noNote = await post(`/api/containers/${container.id}/adjustments`, {
      countedQuantity: 1,
      unit: 'g',
      note: '',
    }).expect(400);
    expect(noNote.body.error.fields.note).toBeTruthy();
    await post(`/api/containers/${container.id}/adjustments`, {
      countedQuantity: -1,
      unit: 'g',
      note: 'x',
    }).expect(400);
    await post(`/api/containers/${container.id}/adjustments`, {
      correction: -501,
      unit: 'g',
      note: 'x',
    }).expect(409);
    await post(
      `/api/containers/${container.id}/adjustments`,
      { correction: 1, unit: 'g', note: 'x' },
      member,
    ).expect(403);
  });

  it('when part is split off, then a new labelled container exists and both sides have split entries', async () => {
    const { container, lot } = await solidContainer();
    const bench = await make.location({ name: 'Bench shelf' });
    const response = await post(`/api/containers/${container.id}/splits`, {
      quantity: 50,
      unit: 'g',
      locationId: bench.id,
      tareMass: 30,
    }).expect(201);
    const change = containerChangeSchema.parse(response.body);
    expect(change.container.quantity).toBe(450);
    expect(change.newContainer).toMatchObject({ quantity: 50, status: 'open', tareMass: 30 });
    expect(change.newContainer!.labelCode).not.toBe(container.labelCode);
    expect(change.newContainer!.lot.id).toBe(lot.id);
    expect(change.newContainer!.location.id).toBe(bench.id);
    expect(change.entries).toMatchObject([
      {
        reason: 'split',
        quantity: -50,
        containerId: container.id,
        relatedContainerId: change.newContainer!.id,
      },
      {
        reason: 'split',
        quantity: 50,
        containerId: change.newContainer!.id,
        relatedContainerId: container.id,
      },
    ]);
    await post(`/api/containers/${container.id}/splits`, {
      quantity: 451,
      unit: 'g',
      locationId: bench.id,
    }).expect(409);
  });

  it('when a container is moved, then a transferred entry of 0 records from and to', async () => {
    const { container, shelf } = await solidContainer();
    const other = await make.location();
    const response = await post(`/api/containers/${container.id}/transfers`, {
      locationId: other.id,
    }).expect(201);
    expect(response.body.container.location.id).toBe(other.id);
    expect(response.body.entries).toMatchObject([
      {
        reason: 'transferred',
        quantity: 0,
        balanceAfter: 500,
        fromLocationId: shelf.id,
        toLocationId: other.id,
      },
    ]);
    await post(`/api/containers/${container.id}/transfers`, { locationId: other.id }).expect(400);
    await post(`/api/containers/${container.id}/transfers`, { locationId: 987654 }).expect(400);
  });

  it('when a container is disposed, then what is left goes out and nothing more can be drawn', async () => {
    const { container } = await solidContainer();
    const response = await post(`/api/containers/${container.id}/disposal`, {
      note: 'Caked, discarded',
    }).expect(201);
    expect(response.body.container).toMatchObject({ quantity: 0, status: 'disposed' });
    expect(response.body.entries).toMatchObject([
      { reason: 'disposed', quantity: -500, balanceAfter: 0 },
    ]);
    await post(`/api/containers/${container.id}/draws`, { amount: 1, unit: 'g' }).expect(409);
    await post(`/api/containers/${container.id}/disposal`, {}).expect(409);
  });

  it('when details are edited, then quantity cannot be among them', async () => {
    const { container } = await solidContainer();
    const response = await request(app())
      .patch(`/api/containers/${container.id}`)
      .set('Cookie', manager)
      .send({ quantity: 9 })
      .expect(400);
    expect(response.body.error.fields.quantity).toMatch(/not a known field/);
    const edited = await request(app())
      .patch(`/api/containers/${container.id}`)
      .set('Cookie', manager)
      .send({ tareMass: 125.5 })
      .expect(200);
    expect(edited.body.tareMass).toBe(125.5);
  });
});

describe('ledger', () => {
  it('when the ledger is paged, then it is newest first with totals', async () => {
    const { container } = await solidContainer();
    for (const amount of [1, 2, 3])
      await post(`/api/containers/${container.id}/draws`, { amount, unit: 'g' }).expect(201);
    const first = pageSchema(ledgerEntrySchema).parse(
      (await get(`/api/containers/${container.id}/ledger?pageSize=2`).expect(200)).body,
    );
    expect(first.total).toBe(4);
    expect(first.items.map((e) => e.quantity)).toEqual([-3, -2]);
    const second = (
      await get(`/api/containers/${container.id}/ledger?pageSize=2&page=2`).expect(200)
    ).body;
    expect(second.items.map((e: { reason: string }) => e.reason)).toEqual(['drawn', 'received']);
    await get('/api/containers/987654/ledger').expect(404);
    await get(`/api/containers/${container.id}/ledger?pageSize=0`).expect(400);
  });

  it('when the invariant check runs after many movements, then balances equal their entries; only admins may run it', async () => {
    const result = await ledgerCheck();
    expect(result.ok).toBe(true);
    expect(result.containersChecked).toBeGreaterThan(10);
    expect(result.entriesChecked).toBeGreaterThan(result.containersChecked);
    await get('/api/maintenance/ledger-check', manager).expect(403);
  });

  it('when a balance is tampered with behind the ledger, then the check reports it', async () => {
    const { container } = await solidContainer();
    await testContext().dataSource.query('UPDATE containers SET quantity_micro = 1 WHERE id = ?', [
      container.id,
    ]);
    const result = await ledgerCheck();
    expect(result.ok).toBe(false);
    expect(result.problems).toContainEqual(
      expect.objectContaining({
        containerId: container.id,
        labelCode: container.labelCode,
        kind: 'balance_mismatch',
      }),
    );
    await testContext().dataSource.query(
      'UPDATE containers SET quantity_micro = 500000000 WHERE id = ?',
      [container.id],
    );
  });
});
