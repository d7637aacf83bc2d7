import {
  runSchema,
  wasteAreaSchema,
  wasteContainerDetailSchema,
  wasteContainerSchema,
  wastePickupSchema,
  type Run,
  type WasteContainerCreate,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { withPlaceholders } from '../../db/sql';
import { testContext } from '../../test/harness';
import { preparationFactory } from '../../test/preparations';
import { wasteOnHandIn } from './waste.service';

const app = () => testContext().app;
let manager = '';
let member = '';
const make = preparationFactory(() => manager);
const stock = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
});

const get = (path: string, cookie = member) => request(app()).get(path).set('Cookie', cookie);
const post = (path: string, body: object, cookie = member) =>
  request(app()).post(path).set('Cookie', cookie).send(body);

async function wasteContainer(locationId: number, body: Partial<WasteContainerCreate> = {}) {
  const response = await post(
    '/api/waste-containers',
    {
      title: 'Halogen-free organic solvents',
      locationId,
      capacity: 5,
      capacityUnit: 'L',
      characteristics: ['ignitable'],
      ...body,
    },
    manager,
  );
  if (response.status !== 201) throw new Error(JSON.stringify(response.body));
  return wasteContainerDetailSchema.parse(response.body);
}

async function counts() {
  const { dataSource } = testContext();
  const [row] = await dataSource.query(
    'SELECT (SELECT COUNT(*) FROM waste_additions) AS additions, (SELECT COUNT(*) FROM ledger_entries) AS entries, (SELECT COUNT(*) FROM run_inputs) AS inputs',
  );
  return {
    additions: Number(row.additions),
    entries: Number(row.entries),
    inputs: Number(row.inputs),
  };
}

/** Aspirin with its bottles, and an open run of it. */
async function aspirinRun() {
  const made = await make.aspirin();
  const shelf = await make.location();
  const saLot = await make.lot(made.sa.id, { purityPercent: 100 });
  const sa = await make.container(saLot.id, shelf.id, { quantity: 100, unit: 'g' });
  const ac2oLot = await make.lot(made.ac2o.id);
  const ac2o = await make.container(ac2oLot.id, shelf.id, { quantity: 10, unit: 'mL' });
  const response = await post('/api/runs', { procedureId: made.procedure.id });
  const run: Run = runSchema.parse(response.body);
  const record = (waste: object[], extra: object = {}) =>
    post(`/api/runs/${run.id}/record`, {
      performedOn: '2026-03-02',
      lines: [
        { lineIndex: 0, draws: [{ containerId: sa.id, amount: 2, unit: 'g' }] },
        { lineIndex: 1, draws: [{ containerId: ac2o.id, amount: 5, unit: 'mL' }] },
      ],
      products: [
        {
          crudeMassG: 2.4,
          portions: [{ label: 'crop', quantity: 2.1, unit: 'g', locationId: shelf.id }],
        },
      ],
      waste,
      ...extra,
    });
  return { ...made, shelf, sa, ac2o, run, record };
}

describe('waste from a run', () => {
  it('when a run sends its filtrate to a waste container, then the addition is written with the run and starts the accumulation date', async () => {
    const s = await aspirinRun();
    const bin = await wasteContainer(s.shelf.id);
    expect(bin.labelCode).toMatch(/^LW-W\d{5}$/);
    expect(bin.accumulationStartOn).toBeNull();
    const recorded = await s.record([
      {
        wasteContainerId: bin.id,
        description: `Filtrate of run #${s.run.id}`,
        quantity: 40,
        unit: 'mL',
        chemicalIds: [s.ac2o.id],
      },
    ]);
    expect(recorded.status).toBe(200);
    const detail = wasteContainerDetailSchema.parse(
      (await get(`/api/waste-containers/${bin.id}`).expect(200)).body,
    );
    expect(detail.additions).toHaveLength(1);
    expect(detail.additions[0]).toMatchObject({
      description: `Filtrate of run #${s.run.id}`,
      quantity: 40,
      unit: 'mL',
      runId: s.run.id,
    });
    expect(detail.accumulationStartOn).toBe('2026-03-02');
    // 40 mL in a 5 L container
    expect(detail.filled).toBeCloseTo(0.04, 9);
    expect(detail.fillFraction).toBeCloseTo(0.008, 9);
  });

  it('when a run names a waste container that is full, then nothing of the run is written', async () => {
    const s = await aspirinRun();
    const bin = await wasteContainer(s.shelf.id);
    await request(app())
      .patch(`/api/waste-containers/${bin.id}`)
      .set('Cookie', manager)
      .send({ status: 'full' })
      .expect(200);
    const before = await counts();
    const response = await s.record([
      { wasteContainerId: bin.id, description: 'Washings', quantity: 10, unit: 'mL' },
    ]);
    expect(response.status).toBe(409);
    expect(response.body.error.fields).toEqual({
      'waste.0.wasteContainerId': `${bin.labelCode} is not open`,
    });
    expect(await counts()).toEqual(before);
    expect((await get(`/api/runs/${s.run.id}`).expect(200)).body.status).toBe('open');
  });

  it('when a run fails after its waste was checked (a product into no place), then no waste is written', async () => {
    const s = await aspirinRun();
    const bin = await wasteContainer(s.shelf.id);
    const before = await counts();
    const response = await s.record(
      [{ wasteContainerId: bin.id, description: 'Washings', quantity: 10, unit: 'mL' }],
      {
        products: [
          {
            crudeMassG: 2.4,
            portions: [{ label: 'crop', quantity: 2.1, unit: 'g', locationId: 987654 }],
          },
        ],
      },
    );
    expect(response.status).toBe(400);
    expect(await counts()).toEqual(before);
  });
});

describe('a draw to waste', () => {
  it('when a draw is recorded to waste, then the drawn chemical and amount go into the waste container with its ledger entry', async () => {
    const chemical = await stock.chemical({
      name: `Ethanol ${Math.random()}`,
      storageGroup: 'flammable',
    });
    const shelf = await make.location();
    const lot = await make.lot(chemical.id);
    const bottle = await make.container(lot.id, shelf.id, { quantity: 100, unit: 'g' });
    const bin = await wasteContainer(shelf.id);
    const drawn = await post(`/api/containers/${bottle.id}/draws`, {
      amount: 12,
      unit: 'g',
      note: 'spoiled',
      toWasteContainerId: bin.id,
    }).expect(201);
    const detail = wasteContainerDetailSchema.parse(
      (await get(`/api/waste-containers/${bin.id}`).expect(200)).body,
    );
    expect(detail.additions[0]).toMatchObject({
      quantity: 12,
      unit: 'g',
      ledgerEntryId: drawn.body.entries[0].id,
      description: `Drawn from ${bottle.labelCode} (${chemical.name}): spoiled`,
    });
    expect(detail.chemicals.map((c) => c.id)).toEqual([chemical.id]);
  });

  it('when a draw to waste names a picked-up container, then the draw is refused and the balance stays', async () => {
    const chemical = await stock.chemical({ storageGroup: 'flammable' });
    const shelf = await make.location();
    const bottle = await make.container((await make.lot(chemical.id)).id, shelf.id, {
      quantity: 100,
      unit: 'g',
    });
    const bin = await wasteContainer(shelf.id);
    await post(
      '/api/waste-pickups',
      {
        pickedUpOn: '2026-03-01',
        contractor: 'Riverside Disposal (fictional)',
        manifestNumber: 'M-1',
        wasteContainerIds: [bin.id],
      },
      manager,
    ).expect(201);
    const response = await post(`/api/containers/${bottle.id}/draws`, {
      amount: 5,
      unit: 'g',
      toWasteContainerId: bin.id,
    });
    expect(response.status).toBe(409);
    expect(response.body.error.fields).toEqual({
      toWasteContainerId: `${bin.labelCode} is not open`,
    });
    expect((await get(`/api/containers/${bottle.id}`).expect(200)).body.quantity).toBe(100);
  });
});

describe('incompatible wastes', () => {
  it('when a base is in a container, then it is not suggested for a flammable waste, and adding anyway needs a confirmation', async () => {
    const base = await stock.chemical({ storageGroup: 'base' });
    const solvent = await stock.chemical({ storageGroup: 'flammable' });
    const shelf = await make.location();
    const basic = await wasteContainer(shelf.id, {
      title: 'Aqueous base',
      characteristics: ['corrosive'],
    });
    const organic = await wasteContainer(shelf.id);
    await post(`/api/waste-containers/${basic.id}/additions`, {
      description: 'Rinse',
      quantity: 100,
      unit: 'mL',
      chemicalIds: [base.id],
    }).expect(201);

    const suggested = (
      await get(`/api/waste-containers?compatibleWith=${solvent.id}`).expect(200)
    ).body.map((c: { id: number }) => c.id);
    expect(suggested).toContain(organic.id);
    expect(suggested).not.toContain(basic.id);

    const refused = await post(`/api/waste-containers/${basic.id}/additions`, {
      description: 'Mother liquor',
      quantity: 20,
      unit: 'mL',
      chemicalIds: [solvent.id],
    });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('confirmation_required');
    expect(refused.body.error.warnings[0]).toMatchObject({
      kind: 'storage_conflict',
      code: 'incompatible_groups',
      groups: ['flammable', 'base'],
      labelCodes: [basic.labelCode],
    });
    expect((await counts()).additions).toBeGreaterThan(0);
    const detailBefore = wasteContainerDetailSchema.parse(
      (await get(`/api/waste-containers/${basic.id}`)).body,
    );
    expect(detailBefore.additions).toHaveLength(1);
    await post(`/api/waste-containers/${basic.id}/additions`, {
      description: 'Mother liquor',
      quantity: 20,
      unit: 'mL',
      chemicalIds: [solvent.id],
      confirm: true,
    }).expect(201);
  });
});

describe('pickups and areas', () => {
  it('when a pickup is recorded, then its containers are picked up and leave the open list', async () => {
    const shelf = await make.location();
    const a = await wasteContainer(shelf.id);
    const b = await wasteContainer(shelf.id, {
      title: 'Aqueous acids',
      characteristics: ['corrosive'],
    });
    const pickup = wastePickupSchema.parse(
      (
        await post(
          '/api/waste-pickups',
          {
            pickedUpOn: '2026-03-05',
            contractor: 'Riverside Disposal (fictional)',
            manifestNumber: 'EX-000123',
            wasteContainerIds: [a.id, b.id],
          },
          manager,
        ).expect(201)
      ).body,
    );
    expect(pickup.containers.map((c) => c.id)).toEqual([a.id, b.id]);
    const detail = wasteContainerDetailSchema.parse(
      (await get(`/api/waste-containers/${a.id}`)).body,
    );
    expect(detail).toMatchObject({ status: 'picked-up', pickupId: pickup.id });
    const open = (await get(`/api/containers?kind=waste&locationId=${shelf.id}`).expect(200)).body;
    expect(open.items).toEqual([]);
    // Again: refused, nothing written.
    await post(
      '/api/waste-pickups',
      {
        pickedUpOn: '2026-03-06',
        contractor: 'X (fictional)',
        manifestNumber: 'EX-2',
        wasteContainerIds: [a.id],
      },
      manager,
    ).expect(409);
    expect(
      (await get('/api/waste-pickups').expect(200)).body.filter(
        (p: { manifestNumber: string }) => p.manifestNumber === 'EX-2',
      ),
    ).toEqual([]);
    // Members may add waste but not record pickups.
    await post('/api/waste-pickups', {
      pickedUpOn: '2026-03-06',
      contractor: 'X',
      manifestNumber: 'EX-3',
      wasteContainerIds: [b.id],
    }).expect(403);
  });

  it('when an area holds more acutely hazardous waste than 1 quart, then it is over its limit with the citation and the reminder', async () => {
    const shelf = await make.location();
    await request(app())
      .put(`/api/waste-areas/${shelf.id}`)
      .set('Cookie', manager)
      .send({})
      .expect(200);
    const acute = await wasteContainer(shelf.id, {
      title: 'Acute',
      acutelyHazardous: true,
      characteristics: ['toxic'],
    });
    await post(`/api/waste-containers/${acute.id}/additions`, {
      description: 'Residue',
      quantity: 0.9,
      unit: 'L',
    }).expect(201);
    const areas = (await get('/api/waste-areas').expect(200)).body.map((a: unknown) =>
      wasteAreaSchema.parse(a),
    );
    const area = areas.find((a: { locationId: number }) => a.locationId === shelf.id)!;
    // US EPA 40 CFR 262.15(a)(1): 1 quart = 0.946 L (1 US gal = 3.785411784 L, NIST SP 811)
    expect(area.acutelyHazardous.limitLitres).toBeCloseTo(0.946353, 5);
    expect(area.state).toBe('near');
    await post(`/api/waste-containers/${acute.id}/additions`, {
      description: 'Residue',
      quantity: 0.1,
      unit: 'L',
    }).expect(201);
    const again = wasteAreaSchema.parse(
      (await get('/api/waste-areas').expect(200)).body.find(
        (a: { locationId: number }) => a.locationId === shelf.id,
      ),
    );
    expect(again.state).toBe('over');
    expect(again.citation).toBe('US EPA, 40 CFR, §262.15');
    expect(again.reminder).toMatch(/authority having jurisdiction/);
    // 55 gal = 208.2 L
    expect(again.hazardous.limitLitres).toBeCloseTo(208.19765, 4);
  });

  it('when the waste on hand in places is asked for, then it lists their open containers with litres and the ignitable litres by class', async () => {
    const shelf = await make.location();
    const other = await make.location();
    const bin = await wasteContainer(shelf.id);
    await wasteContainer(other.id);
    await post(`/api/waste-containers/${bin.id}/additions`, {
      description: 'Washings',
      quantity: 1500,
      unit: 'mL',
    }).expect(201);
    const onHand = await wasteOnHandIn(testContext().store.repos, [shelf.id]);
    expect(onHand.containers.map((c) => c.id)).toEqual([bin.id]);
    expect(onHand.litres).toBeCloseTo(1.5, 9);
    // Ignitable with no flash point known: counted as Class IB (conservative choice).
    expect(onHand.ignitableLitresByClass).toEqual({ IB: 1.5 });
    expect(onHand.containers[0]!.liquidClassNote).toMatch(/Class IB/);
    wasteContainerSchema.parse(onHand.containers[0]);
  });

  it('when a lab area holds ignitable waste, then it counts toward the flammable-liquid totals under its most severe class', async () => {
    const room = await make.location();
    const shelf = await make.location({ parentId: room.id });
    const area = await post(
      '/api/lab-areas',
      { locationId: room.id, unitClass: 'B', floorArea: 50, floorAreaUnit: 'm2' },
      manager,
    );
    expect(area.status).toBe(201);
    // Ethanol: flash point 13 °C, boiling point 78 °C (CRC Handbook, from memory) -> Class IB
    const ethanol = await stock.chemical({
      storageGroup: 'flammable',
      flashPointC: 13,
      boilingPointC: 78,
    } as object);
    const bin = await wasteContainer(shelf.id);
    await post(`/api/waste-containers/${bin.id}/additions`, {
      description: 'Washings',
      quantity: 2,
      unit: 'L',
      chemicalIds: [ethanol.id],
    }).expect(201);
    const detail = (await get(`/api/lab-areas/${area.body.id}`).expect(200)).body;
    expect(detail.countedWaste).toEqual([
      expect.objectContaining({
        wasteContainerId: bin.id,
        liquidClass: 'IB',
        litres: 2,
        liquidClassNote: null,
      }),
    ]);
    expect(
      detail.byClass.find((c: { liquidClass: string }) => c.liquidClass === 'IB').totalLitres,
    ).toBeCloseTo(2, 9);
  });

  it('when a container takes its area over the limit, then exactly one alert per manager is queued, and later evaluations queue no more', async () => {
    const admin = (await signedIn('admin')).cookie;
    const shelf = await make.location();
    await request(app())
      .put(`/api/waste-areas/${shelf.id}`)
      .set('Cookie', manager)
      .send({})
      .expect(200);
    const acute = await wasteContainer(shelf.id, {
      title: 'P-listed residues',
      acutelyHazardous: true,
      characteristics: ['toxic'],
      capacity: 4,
    });
    const key = `waste-near-limit:area:${shelf.id}:over`;
    const sent = async () => {
      const { dataSource } = testContext();
      const rows: { n: number; people: number }[] = await dataSource.query(
        withPlaceholders(
          dataSource,
          'SELECT COUNT(*) AS n, COUNT(DISTINCT recipient_email) AS people FROM outbox WHERE dedup_key = ?',
        ),
        [key],
      );
      return { n: Number(rows[0]!.n), people: Number(rows[0]!.people) };
    };
    await post(`/api/waste-containers/${acute.id}/additions`, {
      description: 'Residue',
      quantity: 0.5,
      unit: 'L',
    }).expect(201);
    expect((await sent()).n).toBe(0);
    // 1.2 L of acutely hazardous waste: over 1 quart (US EPA 40 CFR 262.15(a)(1))
    await post(`/api/waste-containers/${acute.id}/additions`, {
      description: 'Residue',
      quantity: 0.7,
      unit: 'L',
    }).expect(201);
    const first = await sent();
    expect(first.n).toBeGreaterThan(0);
    expect(first.n).toBe(first.people);
    await post(`/api/waste-containers/${acute.id}/additions`, {
      description: 'Residue',
      quantity: 0.1,
      unit: 'L',
    }).expect(201);
    await request(app()).post('/api/alerts/evaluate').set('Cookie', admin).expect(200);
    await request(app()).post('/api/alerts/evaluate').set('Cookie', admin).expect(200);
    expect(await sent()).toEqual(first);
  });
});
