import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chemicalSchema } from '@lotwise/shared';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../app';
import { createDataSource } from '../data-source';
import { openStore } from '../repositories';
import { testConfig } from '../../test/harness';
import { demoAccounts, demoPassword, seedDemo } from './demo-seed';
import { demoChemicals } from './demo-chemicals';
import { watchedChemicals, watchedHoldingsIn } from '../../modules/watch-lists/watch-matching';
import { allAreaTotals } from '../../modules/lab-areas/lab-areas.service';

describe('demo seed', () => {
  let dataSource: DataSource;
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-seed-'));
  const config = testConfig(dir);

  beforeAll(async () => {
    dataSource = createDataSource(config.databasePath);
    await dataSource.initialize();
    await dataSource.runMigrations({ transaction: 'all' });
  });
  afterAll(async () => {
    await dataSource.destroy();
    rmSync(dir, { recursive: true, force: true });
  });

  it('when the database is empty, then it seeds the demo lab once; a second run does nothing', async () => {
    expect(await seedDemo(dataSource, 4)).toBe(true);
    expect(await seedDemo(dataSource, 4)).toBe(false);
    const store = openStore(dataSource);
    expect(await store.repos.users.count()).toBe(demoAccounts.length);
    const all = await store.repos.chemicals.list({
      q: '',
      sort: 'name.asc',
      page: 1,
      pageSize: 200,
    });
    expect(all.total).toBe(27);
    expect(demoChemicals).toHaveLength(27);
  });

  it('when seeded, then every chemical is valid with a molar mass, a unit that fits its state; people have example.test addresses', async () => {
    const store = openStore(dataSource);
    const { items } = await store.repos.chemicals.list({
      q: '',
      sort: 'name.asc',
      page: 1,
      pageSize: 200,
    });
    for (const chemical of items) {
      chemicalSchema.parse(chemical);
      expect(chemical.molarMass, chemical.name).toBeGreaterThan(1);
      expect(chemical.stockUnit, chemical.name).toBe(
        chemical.physicalState === 'solid' ? 'g' : 'mL',
      );
    }
    const hcl = items.find((c) => c.casNumber === '7647-01-0');
    expect(hcl).toMatchObject({
      formula: 'HCl',
      physicalState: 'solution',
      defaultPurityPercent: 37,
    });
    expect(hcl?.notes).toMatch(/37 %/);
    expect(
      items
        .filter((c) => c.peroxideClass === 'B')
        .map((c) => c.name)
        .sort(),
    ).toEqual(['Diethyl ether', 'Isoamyl alcohol', 'Tetrahydrofuran']);
    for (const account of demoAccounts) expect(account.email).toMatch(/@example\.test$/);
  });

  it('when seeded, then every demo liquid with a flash point has a class and category that agree with its H224–H226 and name their source', async () => {
    const store = openStore(dataSource);
    const { items } = await store.repos.chemicals.list({
      q: '',
      sort: 'name.asc',
      page: 1,
      pageSize: 200,
    });
    const liquids = items.filter((c) => c.physicalState !== 'solid');
    const fireRated = liquids.filter((c) => c.flashPointC !== null);
    // Every organic liquid of the demo lab has a flash point; water and the acids do not burn.
    expect(fireRated.map((c) => c.name).sort()).toEqual([
      'Acetic acid, glacial',
      'Acetic anhydride',
      'Acetone',
      'Benzaldehyde',
      'Diethyl ether',
      'Ethanol',
      'Ethyl acetate',
      'Isoamyl acetate',
      'Isoamyl alcohol',
      'Tetrahydrofuran',
      'n-Hexane',
    ]);
    // GHS Rev. 10 Table 2.6.1: category 1 H224, 2 H225, 3 H226. EU CLP has no category 4
    // (H227), so a category-4 liquid such as benzaldehyde lists none (common practice, no source).
    const statementOf: Record<number, string> = { 1: 'H224', 2: 'H225', 3: 'H226' };
    for (const chemical of fireRated) {
      expect(chemical.flashPointSource, chemical.name).not.toBe('');
      expect(chemical.boilingPointSource, chemical.name).not.toBe('');
      expect(chemical.liquidClass, chemical.name).not.toBeNull();
      const listed = chemical.hazardStatements.filter((h) => /^H22[4-7]$/.test(h));
      const category = chemical.ghsFlammableCategory;
      expect(listed, chemical.name).toEqual(
        category && statementOf[category] ? [statementOf[category]] : [],
      );
    }
    const byName = (name: string) => items.find((c) => c.name === name);
    // NFPA 30 (2024) §4.3.1–4.3.3; GHS Rev. 10 Table 2.6.1
    expect(byName('Diethyl ether')).toMatchObject({ liquidClass: 'IA', ghsFlammableCategory: 1 });
    expect(byName('Ethanol')).toMatchObject({ liquidClass: 'IB', ghsFlammableCategory: 2 });
    expect(byName('Isoamyl acetate')).toMatchObject({ liquidClass: 'IC', ghsFlammableCategory: 3 });
    expect(byName('Acetic acid, glacial')).toMatchObject({
      liquidClass: 'II',
      ghsFlammableCategory: 3,
    });
    expect(byName('Benzaldehyde')).toMatchObject({ liquidClass: 'IIIA', ghsFlammableCategory: 4 });
    for (const chemical of items.filter((c) => c.physicalState === 'solid')) {
      expect(chemical.liquidClass, chemical.name).toBeNull();
    }
  });

  it('when seeded, then each demo account signs in with the demo password and has its role', async () => {
    const app = createApp({ dataSource, config });
    for (const account of demoAccounts) {
      const response = await request(app)
        .post('/api/auth/login')
        .send({ email: account.email, password: demoPassword })
        .expect(200);
      expect(response.body.user.role).toBe(account.role);
    }
    const roles = new Set(demoAccounts.map((a) => a.role));
    expect([...roles].sort()).toEqual(['admin', 'manager', 'member', 'viewer']);
  });

  it('when seeded, then the stockroom has places, 60+ containers with history, expired and expiring stock, low stock and exactly one conflict', async () => {
    const app = createApp({ dataSource, config });
    const login = await request(app)
      .post('/api/auth/login')
      .send({ email: 'instructor@example.test', password: demoPassword })
      .expect(200);
    const cookie = String([login.headers['set-cookie']].flat()[0]).split(';')[0]!;
    const get = (path: string) => request(app).get(path).set('Cookie', cookie).expect(200);

    const locations = (await get('/api/locations')).body;
    expect(locations.items.filter((l: { depth: number }) => l.depth === 0)).toHaveLength(3);
    expect(locations.total).toBeGreaterThanOrEqual(11);
    const containers = (await get('/api/containers?pageSize=200')).body;
    expect(containers.total).toBeGreaterThanOrEqual(60);
    const chemicalsHeld = new Set(
      containers.items.map((c: { chemical: { id: number } }) => c.chemical.id),
    );
    expect(chemicalsHeld.size).toBe(27);
    expect((await get('/api/containers?expired=true')).body.total).toBeGreaterThan(0);
    const today = new Date().toISOString().slice(0, 10);
    const monthEnd =
      new Date(Date.UTC(+today.slice(0, 4), +today.slice(5, 7), 0)).getUTCDate() -
      +today.slice(8, 10);
    expect(
      (await get(`/api/containers?expiringWithinDays=${monthEnd}`)).body.total,
    ).toBeGreaterThan(0);
    const low = (await get('/api/stock?belowReorderPoint=true&pageSize=200')).body;
    expect(low.total).toBeGreaterThanOrEqual(3);
    const conflicts = (await get('/api/segregation/conflicts')).body;
    expect(conflicts.items, JSON.stringify(conflicts.items, null, 1)).toHaveLength(1);
    expect(conflicts.items[0].location.path).toMatch(/Bases shelf/);
    expect(conflicts.items[0].pairs[0].groups).toEqual(['inorganic-acid', 'base']);
    const check = (await get('/api/maintenance/ledger-check')).body;
    expect(check.ok).toBe(true);
    expect(check.entriesChecked).toBeGreaterThan(containers.total * 3);
    const nitrite = (await get('/api/chemicals?q=sodium nitrite')).body.items[0];
    expect(nitrite.extraHazardGroups).toEqual(['gas-with-acid']);
  });

  it('when seeded, then the waste station is an accumulation area with a run-fed solvent container, a nearly full acid container and one past pickup', async () => {
    const app = createApp({ dataSource, config });
    const login = await request(app)
      .post('/api/auth/login')
      .send({ email: 'instructor@example.test', password: demoPassword })
      .expect(200);
    const cookie = String([login.headers['set-cookie']].flat()[0]).split(';')[0]!;
    const get = (path: string) => request(app).get(path).set('Cookie', cookie).expect(200);

    const [area] = (await get('/api/waste-areas')).body;
    expect(area.locationPath).toMatch(/Waste station$/);
    expect(area.citation).toMatch(/40 CFR/);
    expect(area.containers.map((c: { title: string }) => c.title)).toEqual([
      'Halogen-free organic solvents',
      'Aqueous acid waste',
    ]);
    const acids = area.containers[1];
    expect(acids.fillFraction).toBeGreaterThanOrEqual(0.9);
    const organic = (await get(`/api/waste-containers/${area.containers[0].id}`)).body;
    expect(organic.additions.length).toBe(4);
    expect(organic.additions.every((a: { runId: number | null }) => a.runId !== null)).toBe(true);
    const pickups = (await get('/api/waste-pickups')).body;
    expect(pickups).toHaveLength(1);
    expect(pickups[0].containers).toHaveLength(1);
  });

  it('when seeded, then four procedures (two chained), 11 recorded runs with realistic yields and a make-versus-buy shortfall exist', async () => {
    const app = createApp({ dataSource, config });
    const login = await request(app)
      .post('/api/auth/login')
      .send({ email: 'technician@example.test', password: demoPassword })
      .expect(200);
    const cookie = String([login.headers['set-cookie']].flat()[0]).split(';')[0]!;
    const get = (path: string) => request(app).get(path).set('Cookie', cookie).expect(200);
    const procedures = (await get('/api/procedures')).body.items;
    expect(procedures).toHaveLength(4);
    const byTitle = (start: string) =>
      procedures.find((p: { title: string }) => p.title.startsWith(start));
    const solution = byTitle('Sodium hydroxide solution');
    const dba = byTitle('Dibenzalacetone');
    // The chain: the 1 M solution is the product of one procedure and a line of another.
    expect(dba.lines.map((l: { chemicalId: number }) => l.chemicalId)).toContain(
      solution.productChemicalIds[0],
    );
    // dibenzalacetone: 2 benzaldehyde : 1 acetone, acetone limiting
    expect(dba.stoichiometry.detectedLimitingIndex).toBe(1);
    const runs = (await get('/api/runs?status=recorded&pageSize=50')).body;
    expect(runs.total).toBe(11);
    const yields = (start: string) =>
      runs.items
        .filter((r: { procedure: { title: string } }) => r.procedure.title.startsWith(start))
        .map((r: { percentYield: number }) => r.percentYield);
    const aspirin = yields('Aspirin');
    expect(aspirin.filter((y: number) => y > 100)).toHaveLength(1);
    // Realistic teaching-lab yields: aspirin 70–90 %, the ester 50–70 %.
    for (const y of aspirin.filter((y: number) => y <= 100)) {
      expect(y).toBeGreaterThan(70);
      expect(y).toBeLessThan(90);
    }
    for (const y of yields('Isoamyl')) {
      expect(y).toBeGreaterThan(50);
      expect(y).toBeLessThan(70);
    }
    const flagged = runs.items.filter((r: { yieldFlag: string | null }) => r.yieldFlag);
    expect(flagged).toHaveLength(1);
    expect(flagged[0].yieldFlag).toMatch(/wet or impure/);
    const history = (await get(`/api/procedures/${byTitle('Aspirin').id}/runs`)).body;
    expect(history.stats.count).toBe(4);
    // Eight benches of dibenzalacetone at 1/4 scale: the 1 M solution is short, make it first.
    const plan = await request(app)
      .post('/api/plans')
      .set('Cookie', cookie)
      .send({ procedureId: dba.id, scaleFactor: '1/4', benches: 8, plannedOn: '2099-06-01' })
      .expect(201);
    const naoh = plan.body.stockCheck.lines.find(
      (l: { chemical: { id: number } }) => l.chemical.id === solution.productChemicalIds[0],
    );
    expect(naoh.status).toBe('short');
    expect(naoh.suggestions.map((s: { kind: string }) => s.kind)).toEqual(['reorder', 'prepare']);
    expect(naoh.suggestions[1].procedureId).toBe(solution.id);
  });

  it('when seeded, then every procedure has timed steps with a hold point, and two recorded runs have full timelines, one with a reading above its window', async () => {
    const app = createApp({ dataSource, config });
    const login = await request(app)
      .post('/api/auth/login')
      .send({ email: 'member.one@example.test', password: demoPassword })
      .expect(200);
    const cookie = String([login.headers['set-cookie']].flat()[0]).split(';')[0]!;
    const get = (path: string) => request(app).get(path).set('Cookie', cookie).expect(200);
    type Step = { durationMinutes: number | null; temperatureHighC: number | null };
    type StepWith = Step & { holdPoint: string; lineIndex: number | null; addition: string };
    for (const procedure of (await get('/api/procedures')).body.items) {
      const steps: StepWith[] = (await get(`/api/procedures/${procedure.id}`)).body.steps;
      expect(steps.length, procedure.title).toBeGreaterThanOrEqual(5);
      expect(
        steps.some((step) => step.holdPoint),
        procedure.title,
      ).toBe(true);
      expect(
        steps.some((step) => step.durationMinutes !== null),
        procedure.title,
      ).toBe(true);
      expect(
        steps.some((step) => step.lineIndex !== null && step.addition),
        procedure.title,
      ).toBe(true);
    }
    const dba = (await get('/api/procedures')).body.items.find((p: { title: string }) =>
      p.title.startsWith('Dibenzalacetone'),
    );
    const addition: Step = (await get(`/api/procedures/${dba.id}`)).body.steps[2];
    expect(addition).toMatchObject({ durationMinutes: 20, temperatureHighC: 30 });

    const runs = (await get('/api/runs?status=recorded&pageSize=50')).body.items;
    const timelines = [];
    for (const run of runs) {
      const timeline = (await get(`/api/runs/${run.id}/timeline`)).body;
      if (timeline.entries.length > 0) timelines.push({ run, timeline });
    }
    expect(timelines).toHaveLength(2);
    for (const { run, timeline } of timelines) {
      const readings = timeline.entries.filter((e: { kind: string }) => e.kind === 'reading');
      expect(readings.length).toBeGreaterThanOrEqual(6);
      expect(readings.length).toBeLessThanOrEqual(12);
      expect(timeline.runningTimers).toEqual([]);
      expect(timeline.currentStepIndex).toBeNull();
      // Every step started and ended, on the day the run was performed.
      for (const step of timeline.steps) {
        expect(step.startedAt?.slice(0, 10)).toBe(run.performedOn);
        expect(step.endedAt).not.toBeNull();
      }
    }
    const deviations = timelines.flatMap(({ timeline }) => timeline.deviations);
    expect(deviations).toHaveLength(1);
    expect(deviations[0].deviation).toMatchObject({
      reason: 'reading-outside-window',
      stepIndex: 2,
    });
    expect(deviations[0].deviation.message).toContain('31.5 °C');
    expect(deviations[0].deviation.instruction).toMatch(/Stop the addition/);
  });

  it('when searching the demo stock, then synonyms such as aspirin and THF find their chemical', async () => {
    const store = openStore(dataSource);
    for (const [q, name] of [
      ['aspirin', 'Acetylsalicylic acid'],
      ['THF', 'Tetrahydrofuran'],
      ['isopentyl alcohol', 'Isoamyl alcohol'],
      ['cuso4', 'Copper(II) sulfate pentahydrate'],
    ]) {
      const { items } = await store.repos.chemicals.list({
        q: q!,
        sort: 'name.asc',
        page: 1,
        pageSize: 5,
      });
      expect(
        items.map((c) => c.name),
        q,
      ).toContain(name);
    }
  });

  it('when seeded, then the lab follows the EU lists and acetone and sulfuric acid 98 % are watched, with drawn history', async () => {
    const store = openStore(dataSource);
    const watched = await watchedChemicals(store.repos);
    expect(watched.map((c) => c.name)).toEqual(
      expect.arrayContaining(['Acetone', 'Sulfuric acid 98 %']),
    );
    const held = await watchedHoldingsIn(store.repos);
    expect(held.some((h) => h.chemicalName === 'Acetone')).toBe(true);
    const moves = await store.repos.watchLists.movements(
      watched.map((c) => c.id),
      '2000-01-01T00:00:00.000Z',
      '2100-01-01T00:00:00.000Z',
    );
    expect(moves.some((m) => m.reason === 'drawn' && m.note !== '')).toBe(true);
  });

  it('when seeded, then the teaching lab is a lab area near its Class I limit and over none, its flammables cabinet approved', async () => {
    const store = openStore(dataSource);
    const [teaching, ...others] = await allAreaTotals(store.repos);
    expect(others).toEqual([]);
    expect(teaching!.area).toMatchObject({
      path: 'Room 101 Teaching lab',
      unitClass: 'C',
      instructional: true,
      status: 'near',
    });
    const classI = teaching!.area.limits.find((l) => l.key === 'class-i')!;
    expect(classI.limitLitres).toBeCloseTo(32.6, 1); // NFPA 45 (2024) Table 9.1.1 (public summary): 50 % of C's 4 gal/100 ft² × 430.56 ft²
    expect(classI.fractionUsed).toBeGreaterThanOrEqual(0.9);
    expect(classI.fractionUsed).toBeLessThanOrEqual(0.98);
    expect(teaching!.area.limits.filter((l) => l.status === 'over')).toEqual([]);
    expect(teaching!.detail.storagePlaces.map((p) => p.path)).toEqual([
      'Room 101 Teaching lab › Flammables cabinet',
    ]);
    expect(teaching!.detail.containerSizeBreaches).toEqual([]);
  });
});
