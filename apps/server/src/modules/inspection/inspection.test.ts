import {
  inspectionSummarySchema,
  labAreaDetailSchema,
  roomRulesReminder,
  safetyDeferral,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
let viewer = '';
let admin = '';
let seeded = 0;
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
  admin = (await signedIn('admin')).cookie;
});

const post = (path: string, body: object) =>
  request(app()).post(path).set('Cookie', manager).send(body);
const get = (path: string, cookie = viewer) => request(app()).get(path).set('Cookie', cookie);

/** A room with a cabinet and a shelf, flammable liquids in both, a watched chemical, waste and a conflict. */
async function seededArea() {
  seeded += 1;
  const room = await make.location({ name: `Inspection room ${seeded}`, kind: 'room' });
  const cabinet = await post('/api/locations', {
    name: 'Solvent cabinet',
    kind: 'cabinet',
    parentId: room.id,
    flammableStorage: 'cabinet',
  }).expect(201);
  const shelf = await make.location({ name: 'Bench shelf', parentId: room.id });

  // Ethanol-like figures: NFPA 30 (2024) §4.3.1 Class IB
  const solvent = await make.chemical({
    name: 'Inspection solvent',
    formula: 'C2H6O',
    physicalState: 'liquid',
    stockUnit: 'mL',
    density: 0.79,
    flashPointC: 12.8,
    boilingPointC: 78.3,
    storageGroup: 'flammable',
    hazardStatements: ['H225'],
  });
  const solventLot = await make.lot(solvent.id);
  await make.container(solventLot.id, shelf.id, { quantity: 1000, unit: 'mL' });
  await make.container(solventLot.id, cabinet.body.id, { quantity: 2500, unit: 'mL' });

  // An oxidizer on the same shelf: the segregation table keeps it apart from flammables.
  const oxidizer = await make.chemical({
    name: 'Inspection oxidizer',
    formula: 'KMnO4',
    storageGroup: 'oxidizer',
  });
  const oxidizerLot = await make.lot(oxidizer.id);
  await make.container(oxidizerLot.id, shelf.id, { quantity: 100, unit: 'g', confirm: true });

  // The lab watches the solvent (a list of its own, invented for the test).
  const solventRow = await get(`/api/chemicals/${solvent.id}`).expect(200);
  await request(app())
    .post('/api/watch-lists')
    .set('Cookie', admin)
    .send({
      jurisdiction: 'Test land',
      name: `Inspection test list ${seeded}`,
      source: 'Test regulation 1/2026, Annex I',
      chosen: true,
      entries: [
        {
          substance: 'Inspection solvent',
          casNumber: solventRow.body.casNumber,
          action: 'Record who and why.',
          source: 'Annex I',
        },
      ],
    })
    .expect(201);

  await post('/api/waste-containers', {
    title: 'Halogen-free solvent waste',
    locationId: shelf.id,
    capacity: 5,
    capacityUnit: 'L',
    characteristics: ['ignitable'],
  }).expect(201);

  const area = await post('/api/lab-areas', {
    locationId: room.id,
    unitClass: 'B',
    floorArea: 500,
    floorAreaUnit: 'ft2',
    storey: 2,
  }).expect(201);
  return { areaId: area.body.id as number, shelf };
}

describe('inspection summary of a lab area', () => {
  it('when a seeded area is summarised, then each section holds what its own page shows, with its sources and the reminder', async () => {
    const { areaId, shelf } = await seededArea();
    const summary = inspectionSummarySchema.parse(
      (await get(`/api/lab-areas/${areaId}/inspection`).expect(200)).body,
    );
    const detail = labAreaDetailSchema.parse((await get(`/api/lab-areas/${areaId}`)).body);

    expect(summary.area).toMatchObject({ id: areaId, name: 'Inspection room 1', unitClass: 'B' });
    expect(summary.date).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(summary.reminder).toBe(roomRulesReminder);

    // Flammable liquids: the lab-area detail's own figures, never recomputed.
    expect(summary.flammable.limits).toEqual(detail.limits);
    expect(summary.flammable.byClass).toEqual(detail.byClass);
    expect(summary.flammable.status).toBe(detail.status);
    expect(summary.flammable.ruleSets.map((r) => r.citation)).toContain(
      'NFPA 45 (2024), Table 9.1.1',
    );
    const ib = summary.flammable.byClass.find((c) => c.liquidClass === 'IB');
    expect(ib).toMatchObject({ inStorageLitres: 2.5, outsideStorageLitres: 1 });

    // Watched chemicals held inside the area, with the chosen list and its source.
    expect(summary.watched.holdings.map((h) => h.chemicalName)).toEqual([
      'Inspection solvent',
      'Inspection solvent',
    ]);
    expect(summary.watched.lists).toContainEqual(
      expect.objectContaining({
        name: `Inspection test list ${seeded}`,
        source: 'Test regulation 1/2026, Annex I',
      }),
    );

    // Waste on hand inside the area.
    expect(summary.waste.containers.map((c) => c.title)).toEqual(['Halogen-free solvent waste']);

    // Storage conflicts at the places inside the area, with the segregation table's source.
    expect(summary.storageConflicts.items.map((i) => i.location.id)).toEqual([shelf.id]);
    expect(summary.storageConflicts.sources.length).toBeGreaterThan(0);
    expect(summary.storageConflicts.notice).toBe(safetyDeferral);
  });

  it('when a place outside the area holds a watched chemical, waste or a conflict, then the summary leaves it out', async () => {
    const { areaId } = await seededArea();
    const summary = inspectionSummarySchema.parse(
      (await get(`/api/lab-areas/${areaId}/inspection`).expect(200)).body,
    );
    // The first seeded area's shelf, waste and watched containers belong to another room.
    for (const holding of summary.watched.holdings)
      expect(holding.locationPath.startsWith(summary.area.path)).toBe(true);
    for (const container of summary.waste.containers)
      expect(container.locationPath.startsWith(summary.area.path)).toBe(true);
    for (const item of summary.storageConflicts.items)
      expect(item.location.path.startsWith(summary.area.path)).toBe(true);
  });

  it('when the area is unknown, then it answers 404; signed out, 401', async () => {
    await get('/api/lab-areas/999999/inspection').expect(404);
    await request(app()).get('/api/lab-areas/1/inspection').expect(401);
  });
});
