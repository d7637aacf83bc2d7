import {
  labAreaDetailSchema,
  labAreaSchema,
  roomRulesReminder,
  type LabAreaDetail,
} from '@lotwise/shared';
import request from 'supertest';
import { z } from 'zod';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { alertRulesSettled, testContext } from '../../test/harness';
import { makeOrder } from '../../test/orders-in-database';
import { readsOf, recordStatements } from '../../test/statements';

const app = () => testContext().app;
let manager = '';
let viewer = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
});

const GAL = 3.785411784; // NIST SP 811: litres per US gallon

const post = (path: string, body: object) =>
  request(app()).post(path).set('Cookie', manager).send(body);

async function markArea(locationId: number, body: object = {}) {
  const response = await post('/api/lab-areas', {
    locationId,
    unitClass: 'B',
    floorArea: 500,
    floorAreaUnit: 'ft2',
    storey: 2,
    ...body,
  }).expect(201);
  return labAreaDetailSchema.parse(response.body);
}

async function detail(id: number): Promise<LabAreaDetail> {
  const response = await request(app()).get(`/api/lab-areas/${id}`).set('Cookie', viewer);
  expect(response.status).toBe(200);
  return labAreaDetailSchema.parse(response.body);
}

/** A liquid kept in mL with its fire data (figures invented to fall in a class). */
async function liquid(
  name: string,
  flashPointC: number | null,
  boilingPointC: number | null,
  extra = {},
) {
  const chemical = await make.chemical({
    name,
    formula: 'C2H6O',
    physicalState: 'liquid',
    stockUnit: 'mL',
    density: 0.8,
    flashPointC,
    boilingPointC,
    ...extra,
  } as never);
  const lot = await make.lot(chemical.id);
  return { chemical, lot };
}

const held = (area: LabAreaDetail, key: string) => area.limits.find((l) => l.key === key)!;

describe('marking a place as a lab area', () => {
  it('when a room is marked Class B, 500 ft², storey 2, then its limits follow NFPA 45 with their working', async () => {
    const room = await make.location({ name: 'Area room B', kind: 'room' });
    const area = await markArea(room.id);
    expect(area).toMatchObject({
      name: 'Area room B',
      status: 'within',
      reminder: roomRulesReminder,
      flammableRuleSet: { citation: 'NFPA 45 (2024), Table 9.1.1', builtIn: true },
      containerSizeRuleSet: { citation: 'NFPA 30 (2024), Table 9.4.3' },
    });
    expect(held(area, 'class-i').limitLitres).toBeCloseTo(50 * GAL, 6); // NFPA 45 (2024) Table 9.1.1 (public summary): B 10 gal/100 ft²
    expect(held(area, 'classes-i-to-iiia-outside-storage').limitLitres).toBeCloseTo(50 * GAL, 6); // NFPA 45 (2024) Table 9.1.1 (public summary): half of 20 gal/100 ft²
    expect(held(area, 'class-i').working[0]!.text).toContain('10 gal per 100 ft² × 500 ft²');
    const list = z
      .object({ items: z.array(labAreaSchema) })
      .parse((await request(app()).get('/api/lab-areas').set('Cookie', viewer).expect(200)).body);
    expect(list.items.map((a) => a.id)).toContain(area.id);
  });

  it('when a place is inside an area, holds one, or is marked twice, then 409 names the area', async () => {
    const room = await make.location({ name: 'Nested room', kind: 'room' });
    const cabinet = await make.location({ name: 'Nested cabinet', parentId: room.id });
    await markArea(room.id);
    const inside = await post('/api/lab-areas', {
      locationId: cabinet.id,
      unitClass: 'B',
      floorArea: 10,
      floorAreaUnit: 'm2',
    }).expect(409);
    expect(inside.body.error.message).toContain('inside Nested room');
    await post('/api/lab-areas', {
      locationId: room.id,
      unitClass: 'B',
      floorArea: 10,
      floorAreaUnit: 'm2',
    }).expect(409);
    const outer = await make.location({ name: 'Outer room', kind: 'room' });
    const inner = await make.location({ name: 'Inner bay', parentId: outer.id });
    await markArea(inner.id);
    const holding = await post('/api/lab-areas', {
      locationId: outer.id,
      unitClass: 'B',
      floorArea: 10,
      floorAreaUnit: 'm2',
    }).expect(409);
    expect(holding.body.error.message).toContain('Outer room › Inner bay');
  });

  it('when an instructional lab is Class A, then 400 says it must be C or D; a viewer may not mark', async () => {
    const room = await make.location({ name: 'Teaching room', kind: 'room' });
    const refused = await post('/api/lab-areas', {
      locationId: room.id,
      unitClass: 'A',
      floorArea: 80,
      floorAreaUnit: 'm2',
      instructional: true,
    }).expect(400);
    expect(refused.body.error.fields.unitClass).toMatch(/Class C or D/); // NFPA 45 (2024) (public summary): instructional labs C or D
    await request(app())
      .post('/api/lab-areas')
      .set('Cookie', viewer)
      .send({ locationId: room.id, unitClass: 'C', floorArea: 80, floorAreaUnit: 'm2' })
      .expect(403);
    const sets = (
      await request(app()).get('/api/rule-sets?kind=container-sizes').set('Cookie', viewer)
    ).body.items;
    await post('/api/lab-areas', {
      locationId: room.id,
      unitClass: 'C',
      floorArea: 80,
      floorAreaUnit: 'm2',
      flammableRuleSetId: sets[0].id,
    }).expect(400);
  });

  it('when an area is changed and unmarked, then its limits follow and the place stays', async () => {
    const room = await make.location({ name: 'Changing room', kind: 'room' });
    const area = await markArea(room.id);
    const changed = await request(app())
      .patch(`/api/lab-areas/${area.id}`)
      .set('Cookie', manager)
      .send({ storey: 5 })
      .expect(200);
    expect(changed.body.limits[0].limitLitres).toBeCloseTo(25 * GAL, 6); // NFPA 45 (2024) Table 9.1.1 (public summary): B above storey 3 × 50 %
    await request(app()).delete(`/api/lab-areas/${area.id}`).set('Cookie', manager).expect(204);
    await request(app()).get(`/api/lab-areas/${area.id}`).set('Cookie', viewer).expect(404);
    await request(app()).get(`/api/locations/${room.id}`).set('Cookie', viewer).expect(200);
  });
});

describe('what a lab area holds', () => {
  it('when liquids sit in a cabinet, on the bench and in g, then the totals equal a hand count', async () => {
    const room = await make.location({ name: 'Counted room', kind: 'room' });
    const cabinet = (
      await post('/api/locations', {
        name: 'Solvent cabinet',
        parentId: room.id,
        kind: 'cabinet',
        flammableStorage: 'cabinet',
      }).expect(201)
    ).body;
    expect(cabinet.flammableStorage).toBe('cabinet');
    const shelf = await make.location({ name: 'Lower shelf', parentId: cabinet.id });
    const area = await markArea(room.id);

    const solvent = await liquid('Counted solvent IB', 13, 78); // invented figures: Class IB
    await make.container(solvent.lot.id, shelf.id, { quantity: 4000, unit: 'mL' });
    await make.container(solvent.lot.id, room.id, { quantity: 2500, unit: 'mL' });
    const acid = await liquid('Counted acid II', 40, 118, { stockUnit: 'g', density: 1.05 }); // invented: Class II
    await make.container(acid.lot.id, room.id, { quantity: 1575, unit: 'g' });
    const oil = await liquid('Counted oil IIIB', 200, 350); // invented: Class IIIB, not counted in limits
    await make.container(oil.lot.id, room.id, { quantity: 1000, unit: 'mL' });
    const unknown = await liquid('Counted unknown', null, null, { hazardStatements: ['H225'] });
    await make.container(unknown.lot.id, room.id, { quantity: 100, unit: 'mL' });
    const gone = await make.container(solvent.lot.id, room.id, { quantity: 900, unit: 'mL' });
    await post(`/api/containers/${gone.id}/disposal`, {}).expect(201);

    const counted = await detail(area.id);
    // Hand count: IB 4.0 L in the cabinet + 2.5 L out; II 1575 g ÷ 1.05 g/mL = 1.5 L out.
    expect(held(counted, 'class-i').heldLitres).toBeCloseTo(6.5, 9);
    expect(held(counted, 'class-i-outside-storage').heldLitres).toBeCloseTo(2.5, 9);
    expect(held(counted, 'classes-i-to-iiia').heldLitres).toBeCloseTo(8.0, 9);
    expect(held(counted, 'classes-i-to-iiia-outside-storage').heldLitres).toBeCloseTo(4.0, 9);
    expect(held(counted, 'class-i').marginLitres).toBeCloseTo(50 * GAL - 6.5, 6);
    expect(counted.byClass).toEqual([
      { liquidClass: 'IB', inStorageLitres: 4, outsideStorageLitres: 2.5, totalLitres: 6.5 },
      { liquidClass: 'II', inStorageLitres: 0, outsideStorageLitres: 1.5, totalLitres: 1.5 },
      { liquidClass: 'IIIB', inStorageLitres: 0, outsideStorageLitres: 1, totalLitres: 1 },
    ]);
    expect(counted.containers).toHaveLength(4);
    expect(counted.notCounted.map((n) => n.reason)).toEqual([
      'not counted: add the flash point and boiling point of Counted unknown',
    ]);
    expect(counted.storagePlaces).toEqual([
      expect.objectContaining({
        path: 'Counted room › Solvent cabinet',
        storageKind: 'cabinet',
        heldLitres: 4,
      }),
    ]);

    // The cabinet loses its approval: everything in it now counts as outside storage.
    await request(app())
      .patch(`/api/locations/${cabinet.id}`)
      .set('Cookie', manager)
      .send({ flammableStorage: null })
      .expect(200);
    const unflagged = await detail(area.id);
    expect(held(unflagged, 'class-i-outside-storage').heldLitres).toBeCloseTo(6.5, 9);
    expect(unflagged.storagePlaces).toEqual([]);
  });

  it('when the lab grows, then the list and the page send no more statements', async () => {
    const room = await make.location({ name: 'Growing room', kind: 'room' });
    const area = await markArea(room.id, { unitClass: 'A', floorArea: 2000 });
    const solvent = await liquid('Growing solvent', 13, 78);
    const count = async (path: string) => {
      // Alert rules run after each write: let them finish so only the page's own reads count.
      await alertRulesSettled();
      const recording = await recordStatements(testContext().dataSource);
      await request(app()).get(path).set('Cookie', viewer).expect(200);
      return recording.stop().filter((s) => readsOf([s], 'users').length === 0).length;
    };
    await make.container(solvent.lot.id, room.id, { quantity: 100, unit: 'mL' });
    const before = [await count('/api/lab-areas'), await count(`/api/lab-areas/${area.id}`)];
    for (let i = 0; i < 12; i++) {
      const shelf = await make.location({ name: `Growing shelf ${i}`, parentId: room.id });
      await make.container(solvent.lot.id, shelf.id, { quantity: 100, unit: 'mL', confirm: true });
    }
    const after = [await count('/api/lab-areas'), await count(`/api/lab-areas/${area.id}`)];
    expect(after).toEqual(before);
    expect((await detail(area.id)).containers).toHaveLength(13);
  });
});

describe('warnings before saving', () => {
  /** A Class D room of 100 ft²: 2 gal of Class I, 1 gal of it outside cabinets. */
  async function smallRoom(name: string) {
    const room = await make.location({ name, kind: 'room' });
    const area = await markArea(room.id, { unitClass: 'D', floorArea: 100, storey: 1 });
    return { room, area };
  }

  it('when a receive would take a room over its limit, then 409 warns and nothing is saved until confirmed', async () => {
    const { room, area } = await smallRoom('Receiving room');
    const solvent = await liquid('Receiving solvent', 13, 78);
    await make.container(solvent.lot.id, room.id, { quantity: 3000, unit: 'mL' }); // 3.0 of 3.785 L
    const body = { lotId: solvent.lot.id, locationId: room.id, quantity: 1000, unit: 'mL' };
    const refused = await post('/api/containers', body).expect(409);
    expect(refused.body.error.code).toBe('confirmation_required');
    const warning = refused.body.error.warnings.find(
      (w: { kind: string }) => w.kind === 'flammable_limit',
    );
    expect(warning).toMatchObject({
      labAreaId: area.id,
      limit: 'Class I liquids outside cabinets and safety cans',
      heldLitres: 3,
      afterLitres: 4,
      source: 'NFPA 45 (2024), Table 9.1.1',
    });
    expect(warning.limitLitres).toBeCloseTo(GAL, 6); // NFPA 45 (2024) Table 9.1.1 (public summary): D 2 gal/100 ft², half outside
    expect(warning.message).toContain('Receiving room would hold 4.00 L');
    expect((await detail(area.id)).containers).toHaveLength(1);
    await post('/api/containers', { ...body, confirm: true }).expect(201);
    const after = await detail(area.id);
    expect(after.status).toBe('over');
    const today = (await request(app()).get('/api/today').set('Cookie', viewer).expect(200)).body;
    const item = today.sections.labAreaLimits.items.find(
      (i: { key: string }) => i.key === `lab-area:${area.id}`,
    );
    expect(item).toMatchObject({ severity: 'critical', status: 'Over a limit' });
    expect(item.notes).toContain(roomRulesReminder);
    expect(held(after, 'class-i-outside-storage').marginLitres).toBeLessThan(0);
  });

  it('when receiving a delivery would take a room over its limit, then 409 warns and confirming receives it', async () => {
    const { room, area } = await smallRoom('Delivery room');
    const solvent = await liquid('Delivered solvent', 13, 78);
    const member = (await signedIn('member')).user;
    const record = await makeOrder({
      lines: [
        {
          chemicalId: solvent.chemical.id,
          packs: 1,
          packSize: 4,
          packUnit: 'L',
          unitPriceMinor: 3000,
          shares: [{ userId: member.id, quantity: 4 }],
        },
      ],
    });
    const receive = {
      receivedOn: '2026-03-10',
      locationId: room.id,
      lines: record.lines.map((line) => ({
        lineId: line.id,
        packsReceived: line.packs,
        supplierLotNumber: 'D-1',
        expiresOn: '2028-03-31',
      })),
    };
    const refused = await post(`/api/orders/${record.order.id}/receive`, receive).expect(409);
    expect(refused.body.error.warnings).toContainEqual(
      expect.objectContaining({ kind: 'flammable_limit', labAreaId: area.id, afterLitres: 4 }),
    );
    expect((await detail(area.id)).containers).toHaveLength(0);
    await post(`/api/orders/${record.order.id}/receive`, { ...receive, confirm: true }).expect(200);
    expect((await detail(area.id)).status).toBe('over');
  });

  it('when a container is moved or split into a room near its limit, then it warns too', async () => {
    const { room, area } = await smallRoom('Transfer room');
    const elsewhere = await make.location({ name: 'Unmarked store', kind: 'room' });
    const solvent = await liquid('Moving solvent', 13, 78);
    await make.container(solvent.lot.id, room.id, { quantity: 3000, unit: 'mL' });
    const bottle = await make.container(solvent.lot.id, elsewhere.id, {
      quantity: 2000,
      unit: 'mL',
    });
    const moved = await post(`/api/containers/${bottle.id}/transfers`, {
      locationId: room.id,
    }).expect(409);
    expect(moved.body.error.warnings.map((w: { kind: string }) => w.kind)).toContain(
      'flammable_limit',
    );
    const split = await post(`/api/containers/${bottle.id}/splits`, {
      quantity: 1000,
      unit: 'mL',
      locationId: room.id,
    }).expect(409);
    expect(split.body.error.warnings[0].labAreaId).toBe(area.id);
    await post(`/api/containers/${bottle.id}/splits`, {
      quantity: 500,
      unit: 'mL',
      locationId: room.id,
    }).expect(201); // 3.5 of 3.785 L: near, not over
    expect((await detail(area.id)).status).toBe('near');
    const today = (await request(app()).get('/api/today').set('Cookie', viewer).expect(200)).body;
    expect(today.sections.labAreaLimits.items).toContainEqual(
      expect.objectContaining({
        key: `lab-area:${area.id}`,
        severity: 'warning',
        status: 'Near a limit',
        title: 'Transfer room',
        link: `/stock/lab-areas/${area.id}`,
      }),
    );
  });

  it('when a glass bottle is larger than its class allows, then a container-size warning', async () => {
    const room = await make.location({ name: 'Bottle room', kind: 'room' });
    const area = await markArea(room.id);
    const solvent = await liquid('Bottled solvent', 13, 78);
    const refused = await post('/api/containers', {
      lotId: solvent.lot.id,
      locationId: room.id,
      quantity: 2000,
      unit: 'mL',
      capacity: 2.5,
      capacityUnit: 'L',
      material: 'glass',
    }).expect(409);
    expect(refused.body.error.warnings).toEqual([
      expect.objectContaining({
        kind: 'container_size',
        liquidClass: 'IB',
        material: 'glass',
        capacityLitres: 2.5,
        source: 'NFPA 30 (2024), Table 9.4.3',
      }),
    ]);
    expect(refused.body.error.warnings[0].limitLitres).toBeCloseTo(GAL / 4, 6); // from memory (NFPA 30 Table 9.4.3): IB glass 1 qt
    const saved = await post('/api/containers', {
      lotId: solvent.lot.id,
      locationId: room.id,
      quantity: 2000,
      unit: 'mL',
      capacity: 2.5,
      capacityUnit: 'L',
      material: 'glass',
      confirm: true,
    }).expect(201);
    expect(saved.body.container.material).toBe('glass');
    expect((await detail(area.id)).containerSizeBreaches).toHaveLength(1);
  });
});
