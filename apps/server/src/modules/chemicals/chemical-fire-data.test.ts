import { chemicalSchema, containerSchema } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { chemicalInput, signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let managerCookie = '';
const stock = stockFactory(() => managerCookie);

beforeAll(async () => {
  managerCookie = (await signedIn('manager')).cookie;
});

const create = (body: object) =>
  request(app()).post('/api/chemicals').set('Cookie', managerCookie).send(body);
const patch = (id: number, body: object) =>
  request(app()).patch(`/api/chemicals/${id}`).set('Cookie', managerCookie).send(body);

const liquid = (overrides: object = {}) =>
  chemicalInput({ formula: 'C2H6O', physicalState: 'liquid', stockUnit: 'mL', ...overrides });

describe('fire data of chemicals', () => {
  it('when a liquid is created with flash and boiling point, then the class and category come back with the sources', async () => {
    const response = await create(
      liquid({
        flashPointC: 12.8,
        boilingPointC: 78.3,
        flashPointSource: 'NIOSH Pocket Guide to Chemical Hazards',
        boilingPointSource: 'SDS of lot 2291',
      }),
    ).expect(201);
    const chemical = chemicalSchema.parse(response.body);
    // NFPA 30 (2024) §4.3.1: below 22.8 °C, boiling 37.8 °C or above → IB; GHS Rev. 10 Table 2.6.1: < 23 °C, IBP > 35 °C → 2
    expect(chemical).toMatchObject({
      flashPointC: 12.8,
      boilingPointC: 78.3,
      flashPointSource: 'NIOSH Pocket Guide to Chemical Hazards',
      boilingPointSource: 'SDS of lot 2291',
      liquidClass: 'IB',
      ghsFlammableCategory: 2,
    });
  });

  it('when no figures are given, then they are null with empty sources and no class', async () => {
    const response = await create(liquid()).expect(201);
    expect(response.body).toMatchObject({
      flashPointC: null,
      boilingPointC: null,
      flashPointSource: '',
      boilingPointSource: '',
      liquidClass: null,
      ghsFlammableCategory: null,
    });
  });

  it('when a solid has a flash point, then it is kept but gives no liquid class', async () => {
    const response = await create(
      chemicalInput({ physicalState: 'solid', flashPointC: 30, boilingPointC: 200 }),
    ).expect(201);
    expect(response.body).toMatchObject({
      flashPointC: 30,
      liquidClass: null,
      ghsFlammableCategory: null,
    });
  });

  it('when the flash point is at or above the boiling point, then it answers 400 naming flashPointC', async () => {
    const response = await create(liquid({ flashPointC: 80, boilingPointC: 80 })).expect(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.fields).toEqual({ flashPointC: 'must be below the boiling point' });
  });

  it('when a figure is out of bounds or not a number, then it answers 400 naming the field', async () => {
    const cold = await create(liquid({ boilingPointC: -300 })).expect(400);
    expect(Object.keys(cold.body.error.fields)).toEqual(['boilingPointC']);
    const text = await create(liquid({ flashPointC: '12,8' })).expect(400);
    expect(Object.keys(text.body.error.fields)).toEqual(['flashPointC']);
    const long = await create(liquid({ flashPointSource: 'x'.repeat(121) })).expect(400);
    expect(Object.keys(long.body.error.fields)).toEqual(['flashPointSource']);
  });

  it('when a patch gives one figure, then it is checked against the stored other and the class follows', async () => {
    const created = await create(liquid({ flashPointC: 30, boilingPointC: 120 })).expect(201);
    expect(created.body.liquidClass).toBe('IC'); // NFPA 30 (2024) §4.3.1: 22.8 to below 37.8 °C
    const bad = await patch(created.body.id, { flashPointC: 130 }).expect(400);
    expect(bad.body.error.fields).toEqual({ flashPointC: 'must be below the boiling point' });
    const changed = await patch(created.body.id, { flashPointC: 65 }).expect(200);
    // NFPA 30 (2024) §4.3.3: 60 to below 93 °C → IIIA; GHS Rev. 10 Table 2.6.1: > 60 to 93 °C → 4
    expect(changed.body).toMatchObject({ liquidClass: 'IIIA', ghsFlammableCategory: 4 });
    const cleared = await patch(created.body.id, { flashPointC: null }).expect(200);
    expect(cleared.body).toMatchObject({ flashPointC: null, liquidClass: null });
  });

  it('when a container holds the liquid, then its chemical carries the class and category', async () => {
    const chemical = await stock.chemical(
      liquid({ flashPointC: -45, boilingPointC: 34.6, name: `Ether ${Date.now()}` }),
    );
    const lot = await stock.lot(chemical.id);
    const place = await stock.location();
    const container = await stock.container(lot.id, place.id, { quantity: 500, unit: 'mL' });
    const response = await request(app())
      .get(`/api/containers/${container.id}`)
      .set('Cookie', managerCookie)
      .expect(200);
    const body = containerSchema.parse(response.body);
    // NFPA 30 (2024) §4.3.1: IA; GHS Rev. 10 Table 2.6.1: category 1
    expect(body.chemical).toMatchObject({ liquidClass: 'IA', ghsFlammableCategory: 1 });
  });
});
