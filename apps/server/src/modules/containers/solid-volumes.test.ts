import type { PlanDetail, ScaledProcedure } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn } from '../../test/factories';
import { testContext } from '../../test/harness';
import { preparationFactory } from '../../test/preparations';

const app = () => testContext().app;
let manager = '';
const make = preparationFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
});

const post = (path: string, body: object) =>
  request(app()).post(path).set('Cookie', manager).send(body);
const get = (path: string) => request(app()).get(path).set('Cookie', manager);

// from memory: poured table salt weighs about 1.2 g/mL; the crystal 2.165 g/mL (chemicals.tsv, memory)
const BULK = 1.2;
const CRYSTAL = 2.165;

async function salt(bulkDensity: number | null) {
  const chemical = await make.chemical('Sodium chloride', 'NaCl', {
    physicalState: 'solid',
    stockUnit: 'g',
    density: CRYSTAL,
    bulkDensity,
  });
  const lot = await make.lot(chemical.id);
  const shelf = await make.location();
  const container = await make.container(lot.id, shelf.id, { quantity: 500, unit: 'g' });
  return { chemical, lot, shelf, container };
}

describe('a solid measured by volume', () => {
  it('when 10 mL of table salt is drawn, then about 12 g leaves the container (bulk density), not 21.65 g', async () => {
    const { container } = await salt(BULK);
    const response = await post(`/api/containers/${container.id}/draws`, {
      amount: 10,
      unit: 'mL',
    }).expect(201);
    // calc: 500 − 10 mL x 1.2 g/mL = 488 g
    expect(response.body.container.quantity).toBeCloseTo(488, 9);
  });

  it('when a solid has no bulk density, then a draw or a receipt by volume answers 400 naming bulkDensity and writes nothing', async () => {
    const { container, lot, shelf } = await salt(null);
    const draw = await post(`/api/containers/${container.id}/draws`, {
      amount: 10,
      unit: 'mL',
    }).expect(400);
    expect(draw.body.error.message).toContain('bulk (poured) density');
    expect(draw.body.error.message).toContain('crystal density is not used');
    expect(draw.body.error.fields.bulkDensity).toContain('is not recorded');
    expect(draw.body.error.fields.amount).toContain('is a solid');
    expect((await get(`/api/containers/${container.id}`)).body.quantity).toBe(500);
    const receipt = await post('/api/containers', {
      lotId: lot.id,
      locationId: shelf.id,
      quantity: 100,
      unit: 'mL',
    }).expect(400);
    expect(receipt.body.error.fields.bulkDensity).toBeDefined();
  });

  it('when a procedure measures a solid in mL, then scaling and the stock check use the bulk density, or say it is missing', async () => {
    const withBulk = await salt(BULK);
    const without = await salt(null);
    const procedure = await make.procedure({
      title: 'Salt by the spoon',
      lines: [
        { chemicalId: withBulk.chemical.id, role: 'reagent', quantity: 10, unit: 'mL' },
        { chemicalId: without.chemical.id, role: 'reagent', quantity: 10, unit: 'mL' },
      ],
    });
    const scaled = (await get(`/api/procedures/${procedure.id}/scaled?factor=1`).expect(200))
      .body as ScaledProcedure;
    expect(scaled.lines[0]!.massG).toBeCloseTo(12, 9); // from memory, as above
    expect(scaled.lines[1]!.massG).toBeNull();
    expect(scaled.stoichiometry.warnings.map((w) => w.message).join(' ')).toContain(
      'bulk (poured) density',
    );
    const plan = await post('/api/plans', {
      procedureId: procedure.id,
      scaleFactor: 1,
      benches: 1,
      overagePercent: 0,
      plannedOn: '2099-01-01',
    }).expect(201);
    const [first, second] = (plan.body as PlanDetail).stockCheck.lines;
    expect(first).toMatchObject({ required: 12, status: 'ok' });
    expect(second).toMatchObject({ required: null, status: 'unconvertible' });
    expect(second!.problem).toContain('bulk density');
  });
});
