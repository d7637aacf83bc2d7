import { errorBodySchema } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
});

const get = (path: string) => request(app()).get(path).set('Cookie', manager);
const post = (path: string, body: object) =>
  request(app()).post(path).set('Cookie', manager).send(body);

async function containerCount(): Promise<number> {
  const [row] = await testContext().dataSource.query(
    'SELECT (SELECT COUNT(*) FROM containers) + (SELECT COUNT(*) FROM ledger_entries) AS n',
  );
  return Number(row.n);
}

/** A shelf holding ethanol (flammable), and permanganate (oxidizer) elsewhere. */
async function setUp() {
  const tag = Math.random().toString(36).slice(2, 6);
  const ethanol = await make.chemical({
    name: `Ethanol ${tag}`,
    storageGroup: 'flammable',
    physicalState: 'liquid',
    stockUnit: 'mL',
    density: 0.789,
  });
  const permanganate = await make.chemical({
    name: `Potassium permanganate ${tag}`,
    storageGroup: 'oxidizer',
  });
  const solvents = await make.location({ name: `Solvent shelf ${tag}` });
  const oxidizers = await make.location({ name: `Oxidizer shelf ${tag}` });
  const ethanolBottle = await make.container((await make.lot(ethanol.id)).id, solvents.id, {
    quantity: 1000,
    unit: 'mL',
  });
  const permanganateLot = await make.lot(permanganate.id);
  const permanganateJar = await make.container(permanganateLot.id, oxidizers.id, {
    quantity: 500,
    unit: 'g',
  });
  return {
    ethanol,
    permanganate,
    solvents,
    oxidizers,
    ethanolBottle,
    permanganateLot,
    permanganateJar,
  };
}

function confirmation(body: unknown) {
  const parsed = errorBodySchema.parse(body).error;
  expect(parsed.code).toBe('confirmation_required');
  return parsed;
}

describe('storage conflicts are confirmed before saving', () => {
  it('when stock is received onto a shelf with an incompatible group, then 409 says they must be kept apart and nothing is saved; with confirm it is saved', async () => {
    const s = await setUp();
    const before = await containerCount();
    const body = {
      lotId: s.permanganateLot.id,
      locationId: s.solvents.id,
      quantity: 250,
      unit: 'g',
    };
    const refused = await post('/api/containers', body).expect(409);
    const error = confirmation(refused.body);
    expect(error.message).toContain(
      `${s.permanganate.name} (oxidizer) and ${s.ethanol.name.toLowerCase()} (flammable`,
    );
    expect(error.message).toContain('must be kept apart: Oxidizers feed and intensify fires');
    expect(error.warnings).toEqual([
      expect.objectContaining({
        kind: 'storage_conflict',
        code: 'incompatible_groups',
        groups: ['oxidizer', 'flammable'],
        locationId: s.solvents.id,
        labelCodes: [s.ethanolBottle.labelCode],
        source: 'Prudent Practices',
      }),
    ]);
    expect(await containerCount()).toBe(before);

    const saved = await post('/api/containers', { ...body, confirm: true }).expect(201);
    expect(saved.body.container.location.id).toBe(s.solvents.id);
    expect(saved.body.warnings).toHaveLength(1);
  });

  it('when a container is moved next to an incompatible one, then 409 with the reason and it stays put; with confirm it moves', async () => {
    const s = await setUp();
    const refused = await post(`/api/containers/${s.permanganateJar.id}/transfers`, {
      locationId: s.solvents.id,
    }).expect(409);
    expect(confirmation(refused.body).message).toMatch(/must be kept apart/);
    const still = (await get(`/api/containers/${s.permanganateJar.id}`).expect(200)).body;
    expect(still.location.id).toBe(s.oxidizers.id);

    const moved = await post(`/api/containers/${s.permanganateJar.id}/transfers`, {
      locationId: s.solvents.id,
      confirm: true,
    }).expect(201);
    expect(moved.body.container.location.id).toBe(s.solvents.id);
  });

  it('when part is split off into a conflicting place, then 409 and nothing is poured; into its own shelf or with confirm it is split', async () => {
    const s = await setUp();
    const before = await containerCount();
    const body = { quantity: 50, unit: 'g', locationId: s.solvents.id };
    const refused = await post(`/api/containers/${s.permanganateJar.id}/splits`, body).expect(409);
    expect(confirmation(refused.body).warnings![0]).toMatchObject({
      kind: 'storage_conflict',
      locationPath: s.solvents.path,
    });
    expect(await containerCount()).toBe(before);
    expect((await get(`/api/containers/${s.permanganateJar.id}`).expect(200)).body.quantity).toBe(
      500,
    );

    await post(`/api/containers/${s.permanganateJar.id}/splits`, {
      ...body,
      locationId: s.oxidizers.id,
    }).expect(201);
    const split = await post(`/api/containers/${s.permanganateJar.id}/splits`, {
      ...body,
      confirm: true,
    }).expect(201);
    expect(split.body.newContainer.location.id).toBe(s.solvents.id);
  });

  it('when a place is meant for other groups, then receiving there asks too, naming what the place is for', async () => {
    const s = await setUp();
    const acidsOnly = await make.location({ storageGroups: ['inorganic-acid'] });
    const refused = await post('/api/containers', {
      lotId: s.permanganateLot.id,
      locationId: acidsOnly.id,
      quantity: 10,
      unit: 'g',
    }).expect(409);
    const error = confirmation(refused.body);
    expect(error.warnings).toEqual([
      expect.objectContaining({ code: 'location_group_mismatch', groups: ['oxidizer'] }),
    ]);
    expect(error.message).toMatch(/is meant for mineral acids/);
  });
});
