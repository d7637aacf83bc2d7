import { addDays } from '@lotwise/chem';
import {
  dispensingSheetSchema,
  planDetailSchema,
  planPreviewSchema,
  safetyDeferral,
  todayIso,
  type PlanDetail,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn } from '../../test/factories';
import { testContext } from '../../test/harness';
import { preparationFactory } from '../../test/preparations';
import { readsOf, recordStatements } from '../../test/statements';
import { sweepLapsedPlans } from './plans.service';

const app = () => testContext().app;
let manager = '';
let member = '';
let otherMember = '';
let viewer = '';
const make = preparationFactory(() => manager);
const today = todayIso();
const nextWeek = addDays(today, 7);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
  otherMember = (await signedIn('member')).cookie;
  viewer = (await signedIn('viewer')).cookie;
});

const get = (path: string, cookie = viewer) => request(app()).get(path).set('Cookie', cookie);
const post = (path: string, body: object, cookie = member) =>
  request(app()).post(path).set('Cookie', cookie).send(body);

async function plan(body: object, cookie = member): Promise<PlanDetail> {
  const response = await post('/api/plans', body, cookie);
  if (response.status !== 201) throw new Error(JSON.stringify(response.body));
  return planDetailSchema.parse(response.body);
}

/** Aspirin with salicylic acid in four containers (one expired) and 8 mL acetic anhydride. */
async function stockedAspirin() {
  const made = await make.aspirin();
  const shelf = await make.location({ name: `Shelf ${Math.random().toString(36).slice(2, 6)}` });
  const soon = await make.lot(made.sa.id, { expiresOn: '2099-01-01', purityPercent: 95 });
  const soonPure = await make.lot(made.sa.id, { expiresOn: '2099-01-01', purityPercent: 100 });
  const never = await make.lot(made.sa.id, { purityPercent: 100 });
  const expired = await make.lot(made.sa.id, { receivedOn: '2000-01-01', expiresOn: '2001-01-01' });
  const sealed95 = await make.container(soon.id, shelf.id, { quantity: 3, unit: 'g' });
  const open100 = await make.container(soonPure.id, shelf.id, {
    quantity: 2,
    unit: 'g',
    status: 'open',
  });
  const big = await make.container(never.id, shelf.id, { quantity: 50, unit: 'g' });
  await make.container(expired.id, shelf.id, { quantity: 100, unit: 'g' });
  const ac2oLot = await make.lot(made.ac2o.id);
  const ac2o = await make.container(ac2oLot.id, shelf.id, { quantity: 8, unit: 'mL' });
  return { ...made, shelf, sealed95, open100, big, ac2oContainer: ac2o };
}

describe('prep plans: the stock check', () => {
  it('when 4 benches run aspirin at 1/2 scale with 10 % overage, then required amounts, purity, order and shortfall agree with a hand calculation', async () => {
    const s = await stockedAspirin();
    const detail = await plan({
      procedureId: s.procedure.id,
      scaleFactor: '1/2',
      benches: 4,
      plannedOn: nextWeek,
    });
    expect(detail).toMatchObject({
      status: 'draft',
      overagePercent: 10,
      benches: 4,
      scaleFactor: 0.5,
    });
    // calc: 0.5 x 4 x 1.10 = 2.2
    expect(detail.totalFactor).toBeCloseTo(2.2, 12);
    const [sa, ac2o, catalyst] = detail.stockCheck.lines;
    // calc: 2.0 g x 0.5 = 1.0 g per bench; x 4 x 1.10 = 4.4 g
    expect(sa).toMatchObject({ perBench: 1, required: 4.4, status: 'ok', shortfall: 0 });
    expect(sa!.requiredDisplay!.text).toBe('4.40 g');
    // The expired 100 g is not counted: 3 + 2 + 50 = 55 g; pure 2.85 + 2 + 50 = 54.85 g
    expect(sa!.available).toBe(55);
    expect(sa!.availablePure).toBeCloseTo(54.85, 9);
    // Same expiry: the open 2 g first, then the sealed 95 % bottle; the big one is not needed.
    expect(sa!.take.map((t) => t.labelCode)).toEqual([s.open100.labelCode, s.sealed95.labelCode]);
    expect(sa!.take[0]).toMatchObject({ take: 2, takePure: 2, locationPath: s.shelf.path });
    // calc: 4.4 − 2.0 = 2.4 g pure still needed; from a 95 % lot 2.4 / 0.95 = 2.526316 g
    expect(sa!.take[1]!.takePure).toBeCloseTo(2.4, 9);
    expect(sa!.take[1]!.take).toBeCloseTo(2.526316, 6);
    // calc: 5.0 mL x 0.5 x 4 x 1.10 = 11 mL; 8 mL held -> 3 mL short
    expect(ac2o).toMatchObject({ required: 11, available: 8, shortfall: 3, status: 'short' });
    expect(ac2o!.suggestions).toEqual([
      expect.objectContaining({ kind: 'reorder', shortfall: 3, unit: 'mL' }),
    ]);
    // The 85 % catalyst line is optional and not stocked: short, but the plan only counts required lines.
    expect(catalyst).toMatchObject({ optional: true, status: 'short', available: 0 });
    // calc: 0.25 mL x 2.2 = 0.55 mL as supplied; pure 0.55 x 0.85 = 0.4675 mL-equivalent
    expect(catalyst!.requiredPure).toBeCloseTo(0.4675, 9);
    expect(detail.stockCheck).toMatchObject({ ok: false, shortCount: 1 });
    expect(detail.hazards.map((h) => h.name)).toContain(s.ac2o.name);
    const ac2oHazard = detail.hazards.find((h) => h.chemicalId === s.ac2o.id)!;
    expect(ac2oHazard.ghsPictograms).toEqual(['GHS02', 'GHS05']);
    expect(ac2oHazard.hazardStatements[1]).toEqual({
      code: 'H314',
      text: expect.stringMatching(/burns/i),
    });
    expect(detail.cautions.items).toContain('Work in a fume hood.');
    expect(detail.cautions.items).toContain('Keep the mixture below 90 °C.');
    expect(detail.safetyDeferral).toBe(safetyDeferral);
  });

  it('when the stock check is previewed, then it is the check the saved plan gets and nothing is saved', async () => {
    const s = await stockedAspirin();
    const body = {
      procedureId: s.procedure.id,
      scaleFactor: '1/2',
      benches: 4,
      plannedOn: nextWeek,
    };
    const plansBefore = (await get('/api/plans?pageSize=200').expect(200)).body.total;

    const preview = planPreviewSchema.parse(
      (await post('/api/plans/preview', body).expect(200)).body,
    );
    expect((await get('/api/plans?pageSize=200').expect(200)).body.total).toBe(plansBefore);
    // calc: 0.5 x 4 x 1.10 = 2.2
    expect(preview.totalFactor).toBeCloseTo(2.2, 12);
    expect(preview.stockCheck).toMatchObject({ ok: false, shortCount: 1 });
    expect(preview.hazards.map((h) => h.name)).toContain(s.ac2o.name);
    expect(preview.safetyDeferral).toBe(safetyDeferral);

    const saved = await plan(body);
    expect(preview.stockCheck).toEqual(saved.stockCheck);
    // A viewer may look; a preview of no procedure names the field.
    await post('/api/plans/preview', body, viewer).expect(200);
    const missing = await post('/api/plans/preview', { ...body, procedureId: 999999 }).expect(400);
    expect(missing.body.error.fields).toEqual({ procedureId: 'no procedure #999999' });
  });

  it('when a chemical another procedure makes is short, then the plan suggests preparing it first at a factor that covers the shortfall', async () => {
    const naoh = await make.chemical('Sodium hydroxide', 'NaOH');
    const water = await make.chemical('Water', 'H2O', { density: 0.99821 });
    const solution = await make.chemical('Sodium hydroxide solution 1 M', 'NaOH', {
      density: 1.04, // from memory: 1 M NaOH is about 1.04 g/mL
      physicalState: 'solution',
      stockUnit: 'mL',
    });
    const maker = await make.procedure({
      title: 'NaOH 1 M for tests',
      expectedYieldPercent: 95,
      lines: [
        { chemicalId: naoh.id, role: 'limiting-reagent', quantity: 4.0, unit: 'g' },
        { chemicalId: water.id, role: 'solvent', quantity: 100, unit: 'mL' },
        { chemicalId: solution.id, role: 'product', concentration: { molarity: 1 } },
      ],
    });
    const user = await make.procedure({
      title: 'Uses NaOH 1 M',
      lines: [
        {
          chemicalId: solution.id,
          role: 'reagent',
          quantity: 20,
          unit: 'mL',
          concentration: { molarity: 1 },
        },
      ],
    });
    const detail = await plan({
      procedureId: user.id,
      scaleFactor: 1,
      benches: 2,
      plannedOn: nextWeek,
    });
    const line = detail.stockCheck.lines[0]!;
    // calc: 20 mL x 2 x 1.10 = 44 mL, none in stock
    expect(line).toMatchObject({ required: 44, shortfall: 44, status: 'short' });
    const prepare = line.suggestions.find((s) => s.kind === 'prepare');
    // calc from CIAAW2021: 4.0 g / 39.997 g/mol = 0.100008 mol -> 100.008 mL of 1 M;
    // at 95 %: 95.0075 mL per factor 1; 44 / 95.0075 = 0.46312
    expect(prepare).toMatchObject({
      procedureId: maker.id,
      expectedYieldPercent: 95,
      roundedFactor: 0.47,
    });
    expect(prepare?.kind === 'prepare' && Number(prepare.factor.toPrecision(5))).toBe(0.46312);
  });
});

describe('prep plans: pure substance', () => {
  it('when a plan needs 88 mL of 1 M NaOH, then the pure substance is 3.52 g of NaOH and the 13 mL on the shelf is counted as solution', async () => {
    const solution = await make.chemical('Sodium hydroxide solution 1 M', 'NaOH', {
      density: 1.04, // from memory: 1 M NaOH is about 1.04 g/mL
      physicalState: 'solution',
      stockUnit: 'mL',
    });
    const shelf = await make.location({
      name: `Base shelf ${Math.random().toString(36).slice(2, 6)}`,
    });
    const lot = await make.lot(solution.id);
    await make.container(lot.id, shelf.id, { quantity: 13, unit: 'mL' });
    const procedure = await make.procedure({
      title: 'Titration with NaOH 1 M',
      lines: [
        {
          chemicalId: solution.id,
          role: 'reagent',
          quantity: 88,
          unit: 'mL',
          concentration: { molarity: 1 },
        },
      ],
    });
    const detail = await plan({
      procedureId: procedure.id,
      scaleFactor: 1,
      benches: 1,
      overagePercent: 0,
      plannedOn: nextWeek,
    });
    const line = detail.stockCheck.lines[0]!;
    // Availability and shortfall stay in mL of solution: 88 − 13 = 75 mL short.
    expect(line).toMatchObject({ required: 88, available: 13, shortfall: 75, status: 'short' });
    // worked-examples.md (250 mL of 1.00 M NaOH = 9.999 g, so 39.997 g/mol, CIAAW2021):
    // 0.088 L x 1 mol/L x 39.997 g/mol = 3.5197 g of NaOH, not 88 x 1.04 = 91.52 g of solution
    expect(line.requiredPureG).toBeCloseTo(3.5197, 4);
    // calc: 13 mL -> 0.013 mol -> 0.51996 g; 75 mL short -> 2.9998 g
    expect(line.availablePureG).toBeCloseTo(0.51996, 5);
    expect(line.shortfallPureG).toBeCloseTo(2.99978, 5);
  });
});

describe('reservations', () => {
  it('when two plans compete for one container, then the second sees less and cannot over-reserve; cancelling the first frees it', async () => {
    const s = await stockedAspirin();
    const first = await plan({
      procedureId: s.procedure.id,
      scaleFactor: 1,
      benches: 1,
      plannedOn: nextWeek,
    });
    // Reserve 6 of the 8 mL of acetic anhydride for the first plan.
    const reserved = planDetailSchema.parse(
      (
        await post(`/api/plans/${first.id}/reservations`, {
          items: [{ containerId: s.ac2oContainer.id, quantity: 6 }],
        }).expect(201)
      ).body,
    );
    expect(reserved.status).toBe('reserved');
    expect(reserved.reservedUntil).toBe(nextWeek);
    expect(reserved.reservations).toEqual([
      expect.objectContaining({ containerId: s.ac2oContainer.id, quantity: 6, status: 'active' }),
    ]);
    const second = await plan(
      { procedureId: s.procedure.id, scaleFactor: 1, benches: 1, plannedOn: nextWeek },
      otherMember,
    );
    const ac2o = second.stockCheck.lines[1]!;
    // calc: 5.0 mL x 1.10 = 5.5 mL needed; 8 − 6 reserved = 2 mL free
    expect(ac2o).toMatchObject({ available: 2, required: 5.5, shortfall: 3.5 });
    expect(ac2o.take[0]).toMatchObject({ reservedByOthers: 6, free: 2, take: 2 });
    const refused = await post(
      `/api/plans/${second.id}/reservations`,
      { items: [{ containerId: s.ac2oContainer.id, quantity: 5, unit: 'mL' }] },
      otherMember,
    ).expect(409);
    expect(refused.body.error.message).toContain(s.ac2oContainer.labelCode);
    expect(refused.body.error.message).toMatch(/only 2.00 mL free .*reserved by plan #/);
    // Nothing was reserved for the second plan.
    expect((await get(`/api/plans/${second.id}`).expect(200)).body.reservations).toEqual([]);
    // Somebody else's plan cannot be cancelled by a member…
    await post(`/api/plans/${first.id}/cancel`, {}, otherMember).expect(403);
    const cancelled = (await post(`/api/plans/${first.id}/cancel`, {}).expect(200)).body;
    expect(cancelled.status).toBe('cancelled');
    expect(cancelled.reservations[0]).toMatchObject({
      status: 'released',
      releasedReason: 'cancelled',
    });
    const after = (await get(`/api/plans/${second.id}`).expect(200)).body;
    expect(after.stockCheck.lines[1]).toMatchObject({ available: 8, shortfall: 0 });
    await post(`/api/plans/${first.id}/cancel`, {}).expect(409);
    await post(`/api/plans/${first.id}/reservations`, {}).expect(409);
  });

  it('when a plan reserves without naming containers, then the suggested takes are held; past the until-date the plan lapses and frees them', async () => {
    const s = await stockedAspirin();
    const detail = await plan({
      procedureId: s.procedure.id,
      scaleFactor: 0.5,
      benches: 1,
      plannedOn: today,
    });
    const reserved = (await post(`/api/plans/${detail.id}/reservations`, {}).expect(201)).body;
    // calc: SA 1.0 x 1.1 = 1.1 g from the open 2 g bottle; Ac2O 2.5 x 1.1 = 2.75 mL
    expect(
      reserved.reservations.map((r: { labelCode: string; quantity: number }) => [
        r.labelCode,
        r.quantity,
      ]),
    ).toEqual([
      [s.open100.labelCode, 1.1],
      [s.ac2oContainer.labelCode, 2.75],
    ]);
    expect(reserved.reservedUntil).toBe(today);
    const bad = await post(`/api/plans/${detail.id}/reservations`, { until: '2000-01-01' }).expect(
      400,
    );
    expect(bad.body.error.fields.until).toMatch(/past/);
    // The sweep on a later day finds the reservations run out.
    const lapsed = await sweepLapsedPlans(testContext().store.repos, addDays(today, 1));
    expect(lapsed).toContain(detail.id);
    const after = (await get(`/api/plans/${detail.id}`).expect(200)).body;
    expect(after.status).toBe('lapsed');
    expect(
      after.reservations.every((r: { releasedReason: string }) => r.releasedReason === 'lapsed'),
    ).toBe(true);
    // A lapsed plan may reserve again.
    expect((await post(`/api/plans/${detail.id}/reservations`, {}).expect(201)).body.status).toBe(
      'reserved',
    );
  });

  it('when a reservation runs out within two days, then the alerts list it for the plan', async () => {
    const s = await stockedAspirin();
    const detail = await plan({
      procedureId: s.procedure.id,
      scaleFactor: 0.5,
      benches: 1,
      plannedOn: today,
    });
    await post(`/api/plans/${detail.id}/reservations`, { until: today }).expect(201);
    const alerts = (await get('/api/alerts?kind=reservation-lapsing', member).expect(200)).body;
    const mine = alerts.items.filter((a: { link: string }) => a.link.includes(`${detail.id}`));
    expect(mine.length).toBeGreaterThan(0);
    expect(mine[0]).toMatchObject({ kind: 'reservation-lapsing' });
    expect(mine.map((a: { message: string }) => a.message).join(' ')).toContain(
      s.open100.labelCode,
    );
  });

  it('when the dispensing sheet is asked for, then each bench gets rounded amounts with containers, hazards and cautions', async () => {
    const s = await stockedAspirin();
    const detail = await plan({
      procedureId: s.procedure.id,
      scaleFactor: '1/4',
      benches: 8,
      plannedOn: nextWeek,
    });
    const sheet = (await get(`/api/plans/${detail.id}/dispensing`).expect(200)).body;
    // calc: 2.0 g / 4 = 0.500 g per bench; 5.0 mL / 4 = 1.25 mL -> 1.3 mL (0.1 mL steps from 1 to 10 mL)
    expect(sheet.lines[0]).toMatchObject({ name: s.sa.name, perBench: { value: 0.5, unit: 'g' } });
    expect(sheet.lines[0].perBenchDisplay.text).toBe('0.500 g');
    expect(sheet.lines[1].perBenchDisplay.text).toBe('1.3 mL');
    // calc: 1.25 mL x 8 x 1.10 = 11 mL for the session
    expect(sheet.lines[1].total).toBe(11);
    expect(sheet.lines[0].containers[0].labelCode).toBe(s.open100.labelCode);
    expect(sheet.hazards.length).toBe(4);
    expect(sheet.cautions.items.length).toBeGreaterThan(0);
    expect(sheet.rules).toHaveLength(3);
    expect(sheet.safetyDeferral).toBe(safetyDeferral);
  });

  it('when the procedure has steps, then the plan and its dispensing sheet carry them in order', async () => {
    const s = await stockedAspirin();
    await request(app())
      .patch(`/api/procedures/${s.procedure.id}`)
      .set('Cookie', manager)
      .send({
        steps: [
          { text: 'Add the anhydride.', lineIndex: 1, addition: 'dropwise' },
          { text: 'Warm.', durationMinutes: 15, temperatureLowC: 50, temperatureHighC: 60 },
        ],
      })
      .expect(200);
    const detail = await plan({
      procedureId: s.procedure.id,
      scaleFactor: 0.5,
      benches: 2,
      plannedOn: nextWeek,
    });
    expect(detail.steps.map((step) => [step.index, step.text, step.lineIndex])).toEqual([
      [0, 'Add the anhydride.', 1],
      [1, 'Warm.', null],
    ]);
    const sheet = dispensingSheetSchema.parse(
      (await get(`/api/plans/${detail.id}/dispensing`).expect(200)).body,
    );
    expect(sheet.steps[1]).toMatchObject({ durationMinutes: 15, temperatureHighC: 60 });
    expect(sheet.steps[0]!.addition).toBe('dropwise');
  });

  it('when a plan is short on one line, then the sheet data says what is short, by how much, what to do and which benches can be served', async () => {
    const s = await stockedAspirin();
    const detail = await plan({
      procedureId: s.procedure.id,
      scaleFactor: '1/2',
      benches: 4,
      plannedOn: nextWeek,
    });
    const sheet = dispensingSheetSchema.parse(
      (await get(`/api/plans/${detail.id}/dispensing`).expect(200)).body,
    );
    const [sa, ac2o, catalyst] = sheet.lines;
    // The same numbers as the plan's stock check, not worked out again.
    expect(ac2o!.stock).toEqual(
      expect.objectContaining({
        status: detail.stockCheck.lines[1]!.status,
        shortfall: detail.stockCheck.lines[1]!.shortfall,
      }),
    );
    // calc: 5.0 mL x 0.5 x 4 x 1.10 = 11 mL needed, 8 mL on hand -> 3 mL short; each bench
    // needs 11 / 4 = 2.75 mL, so 8 mL serves 2 benches (8 / 2.75 = 2.9)
    expect(ac2o!.stock).toMatchObject({
      status: 'short',
      shortfall: 3,
      unit: 'mL',
      remedy: 'reorder',
      benchesCovered: 2,
    });
    expect(ac2o!.stock.suggestions[0]).toMatchObject({ kind: 'reorder', shortfall: 3 });
    expect(sa!.stock).toMatchObject({
      status: 'ok',
      shortfall: 0,
      remedy: null,
      benchesCovered: 4,
    });
    // The optional catalyst is short too, but does not stop a bench being served.
    expect(catalyst!.stock).toMatchObject({ status: 'short', benchesCovered: 0 });
    expect(sheet).toMatchObject({ shortCount: 1, benchesServed: 2 });
    expect(detail.stockCheck.benchesServed).toBe(2);
  });

  it('when a short chemical is made by another procedure, then the sheet says to prepare it first', async () => {
    const naoh = await make.chemical('Sodium hydroxide', 'NaOH');
    const solution = await make.chemical('Sodium hydroxide solution 1 M', 'NaOH', {
      density: 1.04, // from memory: 1 M NaOH is about 1.04 g/mL
      physicalState: 'solution',
      stockUnit: 'mL',
    });
    await make.procedure({
      title: 'NaOH 1 M for the sheet',
      expectedYieldPercent: 95,
      lines: [
        { chemicalId: naoh.id, role: 'limiting-reagent', quantity: 4.0, unit: 'g' },
        { chemicalId: solution.id, role: 'product', concentration: { molarity: 1 } },
      ],
    });
    const user = await make.procedure({
      title: 'Uses NaOH 1 M on the sheet',
      lines: [
        {
          chemicalId: solution.id,
          role: 'reagent',
          quantity: 20,
          unit: 'mL',
          concentration: { molarity: 1 },
        },
      ],
    });
    const detail = await plan({
      procedureId: user.id,
      scaleFactor: 1,
      benches: 2,
      plannedOn: nextWeek,
    });
    const sheet = dispensingSheetSchema.parse(
      (await get(`/api/plans/${detail.id}/dispensing`).expect(200)).body,
    );
    // calc: 20 mL x 2 x 1.10 = 44 mL, none on hand
    expect(sheet.lines[0]!.stock).toMatchObject({
      status: 'short',
      shortfall: 44,
      remedy: 'prepare',
      benchesCovered: 0,
    });
    expect(sheet.benchesServed).toBe(0);
  });

  it('when a viewer reads plans, then they may; writing needs runs.record', async () => {
    const s = await stockedAspirin();
    const detail = await plan({ procedureId: s.procedure.id, scaleFactor: 1, plannedOn: nextWeek });
    await get(`/api/plans/${detail.id}`, viewer).expect(200);
    await post(
      '/api/plans',
      { procedureId: s.procedure.id, scaleFactor: 1, plannedOn: nextWeek },
      viewer,
    ).expect(403);
    const mine = (await get('/api/plans?mine=true', member).expect(200)).body;
    expect(mine.items.some((p: { id: number }) => p.id === detail.id)).toBe(true);
    const patched = await request(app())
      .patch(`/api/plans/${detail.id}`)
      .set('Cookie', manager)
      .send({ benches: 3 })
      .expect(200);
    expect(patched.body.benches).toBe(3);
    await request(app())
      .patch(`/api/plans/${detail.id}`)
      .set('Cookie', otherMember)
      .send({ benches: 2 })
      .expect(403);
  });
});

describe('prep plans: reads', () => {
  it('when a plan with several chemicals is read, then its chemicals, procedures and stock come in one statement each', async () => {
    const s = await stockedAspirin();
    const created = await plan({
      procedureId: s.procedure.id,
      scaleFactor: 1,
      benches: 10,
      plannedOn: nextWeek,
    });
    const recording = await recordStatements(testContext().dataSource);
    const response = await get(`/api/plans/${created.id}`).expect(200);
    const statements = recording.stop();
    expect(planDetailSchema.parse(response.body).stockCheck.lines).toHaveLength(3);
    // Four chemicals (three lines and the product) read together, not one by one; which
    // procedures make the two short chemicals, asked once for both.
    expect(readsOf(statements, 'chemicals')).toHaveLength(1);
    expect(readsOf(statements, 'procedure_lines')).toHaveLength(2);
    expect(readsOf(statements, 'containers')).toHaveLength(1);
  });

  it('when a page of plans is listed, then their reservations come in one statement', async () => {
    const s = await stockedAspirin();
    for (let i = 0; i < 3; i++) {
      await plan({ procedureId: s.procedure.id, scaleFactor: 1, benches: 1, plannedOn: nextWeek });
    }
    const recording = await recordStatements(testContext().dataSource);
    const response = await get('/api/plans?pageSize=50').expect(200);
    const statements = recording.stop();
    expect(response.body.items.length).toBeGreaterThanOrEqual(3);
    expect(readsOf(statements, 'reservations')).toHaveLength(1);
  });
});
