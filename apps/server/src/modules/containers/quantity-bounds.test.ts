import {
  containerChangeSchema,
  errorBodySchema,
  ledgerCheckResultSchema,
  maxStockAmount,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
let admin = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  admin = (await signedIn('admin')).cookie;
});

const post = (path: string, body: object) =>
  request(app()).post(path).set('Cookie', manager).send(body);
/** A body sent as typed JSON text: `1e999` is read as Infinity by JSON.parse. */
const postText = (path: string, json: string) =>
  request(app())
    .post(path)
    .set('Cookie', manager)
    .set('Content-Type', 'application/json')
    .send(json);

async function ledgerCheck() {
  const response = await request(app())
    .get('/api/maintenance/ledger-check')
    .set('Cookie', admin)
    .expect(200);
  return ledgerCheckResultSchema.parse(response.body);
}

async function container(quantity = 100, overrides: object = {}) {
  const chemical = await make.chemical({ physicalState: 'solid', stockUnit: 'g', density: 2.16 });
  const lot = await make.lot(chemical.id);
  const shelf = await make.location();
  const made = await make.container(lot.id, shelf.id, { quantity, unit: 'g', ...overrides });
  return { ...made, lotId: lot.id, locationId: shelf.id };
}

async function balanceOf(id: number) {
  const response = await request(app()).get(`/api/containers/${id}`).set('Cookie', manager);
  return response.body.quantity as number;
}

/** 400 validation_failed naming `field`. */
function refusedOn(response: request.Response, field: string) {
  expect(response.status, JSON.stringify(response.body)).toBe(400);
  const body = errorBodySchema.parse(response.body);
  expect(body.error.code).toBe('validation_failed');
  expect(Object.keys(body.error.fields ?? {})).toContain(field);
  return body.error.fields![field]!;
}

describe('amounts that cannot break the record', () => {
  it('when a barcode is typed as a quantity (receiving, correction, draw, split), then it is refused and the ledger check stays exact', async () => {
    const c = await container(100);
    const barcode = 4006381333931;
    refusedOn(
      await post('/api/containers', {
        lotId: c.lotId,
        locationId: c.locationId,
        quantity: barcode,
        unit: 'g',
      }),
      'quantity',
    );
    expect(
      refusedOn(
        await post(`/api/containers/${c.id}/adjustments`, {
          correction: barcode,
          unit: 'g',
          note: 'scanner in the wrong field',
        }),
        'correction',
      ),
    ).toMatch(/at most 10,000,000/);
    refusedOn(
      await post(`/api/containers/${c.id}/draws`, { amount: barcode, unit: 'mg' }),
      'amount',
    );
    refusedOn(
      await post(`/api/containers/${c.id}/splits`, {
        quantity: barcode,
        unit: 'g',
        locationId: c.locationId,
      }),
      'quantity',
    );
    expect(await balanceOf(c.id)).toBe(100);
    expect(await ledgerCheck()).toMatchObject({ ok: true, problems: [] });
  });

  it('when a correction of +2^63 and then −2^63 is sent, then both are refused and balance = sum of entries exactly', async () => {
    const c = await container(100);
    for (const correction of [2 ** 63, -(2 ** 63)]) {
      refusedOn(
        await post(`/api/containers/${c.id}/adjustments`, { correction, unit: 'g', note: 'x' }),
        'correction',
      );
    }
    expect(await balanceOf(c.id)).toBe(100);
    expect(await ledgerCheck()).toMatchObject({ ok: true, problems: [] });
  });

  it('when Infinity, 1e308 g or 1e306 kg is sent, then the answer is 400 naming the field, never 500', async () => {
    const c = await container(100);
    refusedOn(
      await postText(`/api/containers/${c.id}/draws`, '{"amount":1e999,"unit":"g"}'),
      'amount',
    );
    refusedOn(
      await postText(
        `/api/containers/${c.id}/adjustments`,
        '{"correction":-1e999,"unit":"g","note":"x"}',
      ),
      'correction',
    );
    refusedOn(await post(`/api/containers/${c.id}/draws`, { amount: 1e308, unit: 'g' }), 'amount');
    refusedOn(await post(`/api/containers/${c.id}/draws`, { amount: 1e306, unit: 'kg' }), 'amount');
    refusedOn(
      await post(`/api/containers/${c.id}/adjustments`, {
        correction: 1e306,
        unit: 'kg',
        note: 'x',
      }),
      'correction',
    );
    refusedOn(
      await post(`/api/containers/${c.id}/draws`, { grossMass: 1e308, unit: 'g' }),
      'grossMass',
    );
    expect(await ledgerCheck()).toMatchObject({ ok: true });
  });

  it('when an amount within 10^7 of its unit is more than 10^7 of the stock unit (10^7 kg), then it is refused after conversion', async () => {
    const c = await container(100);
    const message = refusedOn(
      await post('/api/containers', {
        lotId: c.lotId,
        locationId: c.locationId,
        quantity: 10_000_000,
        unit: 'kg',
      }),
      'quantity',
    );
    expect(message).toMatch(
      /10,000,000\.000 kg is 10,000,000,000\.00 g, which must be at most 10,000,000 g/,
    );
    refusedOn(
      await post(`/api/containers/${c.id}/adjustments`, {
        correction: 20_000,
        unit: 'kg',
        note: 'x',
      }),
      'correction',
    );
  });

  it('when exactly 10^7 g is received it is taken, and a correction that takes one container past 10^7 g is refused', async () => {
    const full = await container(maxStockAmount);
    expect(full.quantity).toBe(10_000_000);
    refusedOn(
      await post('/api/containers', {
        lotId: full.lotId,
        locationId: full.locationId,
        quantity: 10_000_000.000001,
        unit: 'g',
      }),
      'quantity',
    );
    const message = refusedOn(
      await post(`/api/containers/${full.id}/adjustments`, {
        correction: 0.000001,
        unit: 'g',
        note: 'x',
      }),
      'correction',
    );
    expect(message).toMatch(/at most 10,000,000 g/);
    expect(await balanceOf(full.id)).toBe(10_000_000);
  });

  it('when the smallest amount (a millionth of the unit, 1 µg) is drawn it is recorded exactly; less than that is refused', async () => {
    const c = await container(1);
    const drawn = containerChangeSchema.parse(
      (await post(`/api/containers/${c.id}/draws`, { amount: 0.000001, unit: 'g' }).expect(201))
        .body,
    );
    expect(drawn.entries[0]).toMatchObject({ quantity: -0.000001, balanceAfter: 0.999999 });
    await post(`/api/containers/${c.id}/draws`, { amount: 1, unit: 'µg' }).expect(201);
    refusedOn(await post(`/api/containers/${c.id}/draws`, { amount: 5e-324, unit: 'g' }), 'amount');
    refusedOn(
      await post(`/api/containers/${c.id}/draws`, { amount: 0.0000009, unit: 'g' }),
      'amount',
    );
    // 0.5 µg is 0.0000005 g: within bounds as typed, below a millionth of a gram once converted.
    expect(
      refusedOn(await post(`/api/containers/${c.id}/draws`, { amount: 0.5, unit: 'µg' }), 'amount'),
    ).toMatch(/too small/);
    expect(await balanceOf(c.id)).toBe(0.999998);
  });

  it('when many small amounts go in and out, then the balance is the exact sum and the check has no tolerance to hide behind', async () => {
    const c = await container(0.3);
    for (let i = 0; i < 3; i++) {
      await post(`/api/containers/${c.id}/draws`, { amount: 0.1, unit: 'g' }).expect(201);
    }
    const emptied = await request(app()).get(`/api/containers/${c.id}`).set('Cookie', manager);
    expect(emptied.body).toMatchObject({ quantity: 0, status: 'empty' });
    await post(`/api/containers/${c.id}/adjustments`, {
      correction: 0.7,
      unit: 'g',
      note: 'found more',
    }).expect(201);
    expect(await balanceOf(c.id)).toBe(0.7);
    expect(await ledgerCheck()).toMatchObject({ ok: true });

    // One millionth off behind the ledger's back is a mismatch: the check is exact.
    const { dataSource } = testContext();
    await dataSource.query(
      'UPDATE containers SET quantity_micro = quantity_micro + 1 WHERE id = ?',
      [c.id],
    );
    const check = await ledgerCheck();
    expect(check.ok).toBe(false);
    expect(check.problems).toContainEqual({
      containerId: c.id,
      labelCode: c.labelCode,
      kind: 'balance_mismatch',
      message: `${c.labelCode} stores 0.700001 g but its entries add up to 0.7 g.`,
    });
    await dataSource.query(
      'UPDATE containers SET quantity_micro = quantity_micro - 1 WHERE id = ?',
      [c.id],
    );
    expect(await ledgerCheck()).toMatchObject({ ok: true });
  });
});

describe('units with spaces around them', () => {
  it('when " g" or "g " is sent as a unit, then it is read as g (receiving, capacity, draw, correction, split)', async () => {
    const c = await container(100);
    const received = containerChangeSchema.parse(
      (
        await post('/api/containers', {
          lotId: c.lotId,
          locationId: c.locationId,
          quantity: 50,
          unit: ' g',
          capacity: 100,
          capacityUnit: 'g ',
        }).expect(201)
      ).body,
    );
    expect(received.container).toMatchObject({ quantity: 50, unit: 'g', capacityUnit: 'g' });
    await post(`/api/containers/${c.id}/draws`, { amount: 1, unit: 'g ' }).expect(201);
    await post(`/api/containers/${c.id}/adjustments`, {
      correction: 2,
      unit: ' g',
      note: 'x',
    }).expect(201);
    await post(`/api/containers/${c.id}/splits`, {
      quantity: 1,
      unit: ' g ',
      locationId: c.locationId,
    }).expect(201);
    expect(await balanceOf(c.id)).toBe(100);
    refusedOn(await post(`/api/containers/${c.id}/draws`, { amount: 1, unit: ' ' }), 'unit');
  });
});
