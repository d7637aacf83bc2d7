import { tryMolarMass } from '@lotwise/chem';
import { chemicalSchema, pageSchema, type Chemical } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { chemicalInput, signedIn, uniqueCasNumber } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let managerCookie = '';
let viewerCookie = '';

beforeAll(async () => {
  managerCookie = (await signedIn('manager')).cookie;
  viewerCookie = (await signedIn('viewer')).cookie;
});

const api = {
  list: (query: string) =>
    request(app()).get(`/api/chemicals?${query}`).set('Cookie', viewerCookie),
  get: (id: number | string) =>
    request(app()).get(`/api/chemicals/${id}`).set('Cookie', viewerCookie),
  create: (body: object) =>
    request(app()).post('/api/chemicals').set('Cookie', managerCookie).send(body),
  patch: (id: number | string, body: object) =>
    request(app()).patch(`/api/chemicals/${id}`).set('Cookie', managerCookie).send(body),
  delete: (id: number | string) =>
    request(app()).delete(`/api/chemicals/${id}`).set('Cookie', managerCookie),
};

async function created(overrides: Parameters<typeof chemicalInput>[0] = {}): Promise<Chemical> {
  const response = await api.create(chemicalInput(overrides)).expect(201);
  return response.body as Chemical;
}

describe('creating chemicals', () => {
  it('when a chemical is created, then the molar mass is computed from the formula and defaults are filled', async () => {
    const response = await api
      .create({
        name: 'Acetylsalicylic acid',
        synonyms: ['aspirin'],
        casNumber: '50-78-2',
        formula: 'C9H8O4',
        physicalState: 'solid',
        ghsPictograms: ['GHS07'],
        hazardStatements: ['H302'],
      })
      .expect(201);
    const chemical = chemicalSchema.parse(response.body);
    expect(chemical.molarMass).toBeCloseTo(180.159, 2);
    expect(chemical).toMatchObject({
      defaultPurityPercent: 100,
      storageGroup: 'low-hazard',
      stockUnit: 'g',
      restricted: false,
      notes: '',
      reorderPoint: null,
      peroxideClass: null,
    });
    expect(Date.parse(chemical.createdAt)).not.toBeNaN();
    expect(response.body).not.toHaveProperty('searchText');
  });

  it('when a hydrate formula is given, then its water counts in the molar mass', async () => {
    const chemical = await created({ formula: 'CuSO4·5H2O' });
    expect(chemical.molarMass).toBeCloseTo(249.68, 1);
  });

  it('when a formula is typed with subscripts or a spaced or starred dot, then it is stored in one form', async () => {
    const subscripts = await created({ formula: 'CuSO₄ . 5H₂O' });
    const starred = await created({ formula: 'CuSO4*5H2O' });
    for (const chemical of [subscripts, starred]) {
      expect(chemical.formula).toBe('CuSO4·5H2O');
      expect(chemical.molarMass).toBeCloseTo(249.677, 3); // formula-masses.tsv (calc, CIAAW2021)
    }
    const patched = await api.patch(starred.id, { formula: 'BaCl₂ · 2 H₂O' }).expect(200);
    expect(patched.body.formula).toBe('BaCl2·2H2O');
    expect(patched.body.molarMass).toBeCloseTo(244.26, 2); // formula-masses.tsv (calc, CIAAW2021)
    const found = await api.list(`q=${encodeURIComponent('bacl2·2h2o')}`).expect(200);
    expect(found.body.items.map((c: Chemical) => c.id)).toContain(starred.id);
  });

  it('when a formula has a leading number or a dot between digits, then it answers 400 with the position', async () => {
    const doubled = await api.create(chemicalInput({ formula: '2H2O' })).expect(400);
    expect(doubled.body.error.fields.formula).toContain('write "H2O"');
    for (const [formula, position] of [
      ['C1.5H3', 3],
      ['C2H4.5O', 5],
    ] as const) {
      const response = await api.create(chemicalInput({ formula })).expect(400);
      expect(response.body.error.fields.formula).toContain(`"." at position ${position}`);
    }
  });

  it('when there is no formula, then the molar mass is null', async () => {
    const chemical = await created({ formula: null });
    expect(chemical.molarMass).toBeNull();
  });

  const badFields: [string, object, string][] = [
    ['a CAS RN with a wrong check digit', { casNumber: '50-78-3' }, 'casNumber'],
    ['an unknown element in the formula', { formula: 'C9Xx8O4' }, 'formula'],
    ['a negative reorder point', { reorderPoint: -5 }, 'reorderPoint'],
    ['an unknown pictogram code', { ghsPictograms: ['GHS07', 'GHS10'] }, 'ghsPictograms.1'],
    ['an unknown field', { colour: 'blue' }, 'colour'],
    ['a missing name', { name: undefined }, 'name'],
    ['a bad physical state', { physicalState: 'plasma' }, 'physicalState'],
    ['a malformed H-statement', { hazardStatements: ['H22'] }, 'hazardStatements.0'],
    ['a purity above 100 %', { defaultPurityPercent: 101 }, 'defaultPurityPercent'],
    ['a zero density', { density: 0 }, 'density'],
    ['a bad storage group', { storageGroup: 'acids' }, 'storageGroup'],
    ['a bad stock unit', { stockUnit: 'kg' }, 'stockUnit'],
    ['a bad peroxide class', { peroxideClass: 'E' }, 'peroxideClass'],
    ['a molar mass sent by the client', { molarMass: 58.44 }, 'molarMass'],
  ];
  for (const [what, override, field] of badFields) {
    it(`when the body has ${what}, then it answers 400 naming ${field}`, async () => {
      const response = await api.create({ ...chemicalInput(), ...override }).expect(400);
      expect(response.body.error.code).toBe('validation_failed');
      expect(Object.keys(response.body.error.fields)).toEqual([field]);
      expect(response.body.error.fields[field]).toEqual(expect.any(String));
    });
  }

  it('when the formula names an unknown element, then the message says which', async () => {
    const response = await api.create(chemicalInput({ formula: 'NaQ' })).expect(400);
    expect(response.body.error.fields.formula).toMatch(/Q/);
  });

  it('when the CAS RN is already used, then it answers 409 naming casNumber', async () => {
    const first = await created();
    const response = await api.create(chemicalInput({ casNumber: first.casNumber })).expect(409);
    expect(response.body.error).toMatchObject({
      code: 'conflict',
      fields: { casNumber: expect.any(String) },
    });
  });

  it('when the body is not JSON, then it answers 400 or 415 in the error shape', async () => {
    const malformed = await request(app())
      .post('/api/chemicals')
      .set('Cookie', managerCookie)
      .set('Content-Type', 'application/json')
      .send('{"name": ')
      .expect(400);
    expect(malformed.body.error.code).toBe('validation_failed');
    const plain = await request(app())
      .post('/api/chemicals')
      .set('Cookie', managerCookie)
      .set('Content-Type', 'text/plain')
      .send('name=x')
      .expect(415);
    expect(plain.body.error.code).toBe('unsupported_media_type');
  });
});

describe('listing chemicals', () => {
  const tag = `Lw${Date.now().toString(36)}`;
  let ids: Record<string, number> = {};

  beforeAll(async () => {
    const made = [
      await created({
        name: `${tag} bravo`,
        synonyms: [`${tag}-nickname`],
        formula: 'KMnO4',
        storageGroup: 'oxidizer',
        ghsPictograms: ['GHS03', 'GHS07'],
      }),
      await created({
        name: `${tag} alpha`,
        formula: 'C4H10O',
        physicalState: 'liquid',
        stockUnit: 'mL',
        storageGroup: 'flammable',
        ghsPictograms: ['GHS02'],
      }),
      await created({ name: `${tag} charlie`, formula: null, casNumber: null }),
      await created({ name: `${tag} 100%_pure`, formula: 'NaCl' }),
    ];
    ids = Object.fromEntries(made.map((c) => [c.name.replace(`${tag} `, ''), c.id]));
  });

  const names = (body: { items: Chemical[] }) =>
    body.items.map((c) => c.name.replace(`${tag} `, ''));

  it('when searching by name, synonym, CAS RN or formula in any case, then it finds the chemical', async () => {
    const bravo = (await api.get(ids.bravo!).expect(200)).body as Chemical;
    for (const q of [`${tag} BRAVO`, `${tag}-NICKNAME`.toLowerCase(), bravo.casNumber!, 'kmno4']) {
      const response = await api.list(`q=${encodeURIComponent(q)}`).expect(200);
      expect(
        response.body.items.map((c: Chemical) => c.id),
        q,
      ).toContain(ids.bravo);
    }
  });

  it('when the search has % or _, then they match literally', async () => {
    const response = await api.list(`q=${encodeURIComponent('100%_')}`).expect(200);
    expect(names(response.body)).toEqual(['100%_pure']);
    const none = await api.list(`q=${encodeURIComponent(`${tag} %a`)}`).expect(200);
    expect(none.body.total).toBe(0);
  });

  it('when sorting, then the order follows the field and direction, empty values last', async () => {
    const asc = await api.list(`q=${tag}&sort=name.asc`).expect(200);
    expect(names(asc.body)).toEqual(['100%_pure', 'alpha', 'bravo', 'charlie']);
    const desc = await api.list(`q=${tag}&sort=name.desc`).expect(200);
    expect(names(desc.body)).toEqual(['charlie', 'bravo', 'alpha', '100%_pure']);
    const byMass = await api.list(`q=${tag}&sort=molarMass.desc`).expect(200);
    expect(names(byMass.body)).toEqual(['bravo', 'alpha', '100%_pure', 'charlie']);
    const byMassAsc = await api.list(`q=${tag}&sort=molarMass.asc`).expect(200);
    expect(names(byMassAsc.body)).toEqual(['100%_pure', 'alpha', 'bravo', 'charlie']);
  });

  it('when paging, then total counts every match and pages hold pageSize items', async () => {
    const page1 = await api.list(`q=${tag}&pageSize=3&page=1`).expect(200);
    pageSchema(chemicalSchema).parse(page1.body);
    expect(page1.body).toMatchObject({ total: 4, page: 1, pageSize: 3 });
    expect(page1.body.items).toHaveLength(3);
    const page2 = await api.list(`q=${tag}&pageSize=3&page=2`).expect(200);
    expect(page2.body.items).toHaveLength(1);
    const beyond = await api.list(`q=${tag}&pageSize=3&page=9`).expect(200);
    expect(beyond.body).toMatchObject({ total: 4, items: [] });
  });

  it('when filtering by storage group, physical state or pictogram together with a search, then only matches come back', async () => {
    expect(names((await api.list(`q=${tag}&storageGroup=oxidizer`).expect(200)).body)).toEqual([
      'bravo',
    ]);
    expect(names((await api.list(`q=${tag}&physicalState=liquid`).expect(200)).body)).toEqual([
      'alpha',
    ]);
    expect(names((await api.list(`q=${tag}&pictogram=GHS07`).expect(200)).body)).toEqual(['bravo']);
    expect((await api.list(`q=${tag}&pictogram=GHS09`).expect(200)).body.total).toBe(0);
  });

  it('when the query is bad, then it answers 400 naming the parameter', async () => {
    const cases: [string, string][] = [
      ['sort=density.asc', 'sort'],
      ['page=0', 'page'],
      ['pageSize=500', 'pageSize'],
      ['pictogram=GHS1', 'pictogram'],
      ['storageGroup=acid', 'storageGroup'],
    ];
    for (const [query, field] of cases) {
      const response = await api.list(query).expect(400);
      expect(Object.keys(response.body.error.fields), query).toEqual([field]);
    }
  });
});

describe('reading, changing and deleting one chemical', () => {
  it('when the formula changes, then the molar mass is recomputed; other changes keep it', async () => {
    const chemical = await created({ formula: 'NaCl' });
    const renamed = await api
      .patch(chemical.id, { name: 'Renamed salt', reorderPoint: 50 })
      .expect(200);
    expect(renamed.body).toMatchObject({
      name: 'Renamed salt',
      reorderPoint: 50,
      molarMass: chemical.molarMass,
    });
    const changed = await api.patch(chemical.id, { formula: 'KCl' }).expect(200);
    const expected = tryMolarMass('KCl');
    expect(expected.ok && changed.body.molarMass).toBeCloseTo(74.55, 1);
    expect(changed.body.updatedAt >= chemical.updatedAt).toBe(true);
    const cleared = await api.patch(chemical.id, { formula: null }).expect(200);
    expect(cleared.body.molarMass).toBeNull();
  });

  it('when a patch changes the name, then searches find the new name', async () => {
    const chemical = await created();
    const fresh = `Fresh name ${Date.now().toString(36)}`;
    await api.patch(chemical.id, { name: fresh }).expect(200);
    const response = await api.list(`q=${encodeURIComponent(fresh)}`).expect(200);
    expect(response.body.items.map((c: Chemical) => c.id)).toEqual([chemical.id]);
  });

  it('when a patch is bad, then it answers 400 naming the field; a duplicate CAS RN 409', async () => {
    const chemical = await created();
    const other = await created();
    const bad = await api.patch(chemical.id, { formula: 'Zz2', colour: 'red' }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['colour', 'formula']);
    const taken = await api.patch(chemical.id, { casNumber: other.casNumber }).expect(409);
    expect(taken.body.error.fields).toHaveProperty('casNumber');
    await api.patch(chemical.id, { casNumber: chemical.casNumber }).expect(200);
  });

  it('when the id is unknown, then read, patch and delete answer 404; a non-integer id 400', async () => {
    for (const response of [
      await api.get(424242),
      await api.patch(424242, { name: 'x' }),
      await api.delete(424242),
    ]) {
      expect(response.status).toBe(404);
      expect(response.body.error.code).toBe('not_found');
    }
    for (const id of ['abc', '1.5', '-3', '0']) {
      const response = await api.get(id).expect(400);
      expect(response.body.error.fields).toHaveProperty('id');
    }
  });

  it('when a chemical is deleted, then it answers 204 and is gone', async () => {
    const chemical = await created({ casNumber: uniqueCasNumber() });
    await api.delete(chemical.id).expect(204);
    await api.get(chemical.id).expect(404);
    // Its CAS RN is free again.
    await api.create(chemicalInput({ casNumber: chemical.casNumber })).expect(201);
  });
});
