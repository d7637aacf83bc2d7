import { addDays } from '@lotwise/chem';
import {
  containerDetailSchema,
  containerSchema,
  errorBodySchema,
  pageSchema,
  planDetailSchema,
  runSchema,
  todayIso,
  type PlanDetail,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn } from '../../test/factories';
import { testContext } from '../../test/harness';
import { preparationFactory } from '../../test/preparations';

const app = () => testContext().app;
let manager = '';
let technician = '';
let member = '';
const make = preparationFactory(() => manager);
const nextWeek = addDays(todayIso(), 7);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  technician = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
});

const get = (path: string) => request(app()).get(path).set('Cookie', member);
const post = (path: string, body: object, cookie = member) =>
  request(app()).post(path).set('Cookie', cookie).send(body);

/** Aspirin stock: 100 mL acetic anhydride in one bottle, 65 mL of it held for a plan. */
async function heldBottle() {
  const made = await make.aspirin();
  const shelf = await make.location();
  const saLot = await make.lot(made.sa.id, { purityPercent: 100 });
  const sa = await make.container(saLot.id, shelf.id, { quantity: 100, unit: 'g' });
  const ac2oLot = await make.lot(made.ac2o.id);
  const bottle = await make.container(ac2oLot.id, shelf.id, { quantity: 100, unit: 'mL' });
  const created = await post(
    '/api/plans',
    { procedureId: made.procedure.id, scaleFactor: 1, benches: 1, plannedOn: nextWeek },
    technician,
  ).expect(201);
  const holder = planDetailSchema.parse(
    (
      await post(
        `/api/plans/${created.body.id}/reservations`,
        { items: [{ containerId: bottle.id, quantity: 65, requirementIndex: 1 }] },
        technician,
      ).expect(201)
    ).body,
  );
  return { ...made, shelf, sa, bottle, holder };
}

async function balanceOf(id: number): Promise<number> {
  return containerDetailSchema.parse((await get(`/api/containers/${id}`).expect(200)).body)
    .quantity;
}

async function planOf(id: number): Promise<PlanDetail> {
  return planDetailSchema.parse((await get(`/api/plans/${id}`).expect(200)).body);
}

describe('holds at the shelf', () => {
  it('when a container is held for a plan, then its detail and the containers list say for which plan, date and how much', async () => {
    const s = await heldBottle();
    const detail = containerDetailSchema.parse(
      (await get(`/api/containers/${s.bottle.id}`).expect(200)).body,
    );
    expect(detail.holds).toEqual([
      expect.objectContaining({
        planId: s.holder.id,
        planTitle: s.procedure.title,
        plannedOn: nextWeek,
        until: nextWeek,
        quantity: 65,
        reservedQuantity: 65,
        unit: 'mL',
      }),
    ]);
    const list = pageSchema(containerSchema).parse(
      (await get(`/api/containers?lotId=${detail.lot.id}`).expect(200)).body,
    );
    expect(list.items[0]!.holds).toEqual(detail.holds);
  });

  it('when a draw leaves less than is held, then 409 confirmation_required names the plan and what it loses and nothing is drawn; with confirm it draws', async () => {
    const s = await heldBottle();
    // 35 mL are free: a draw of 30 mL asks nothing.
    await post(`/api/containers/${s.bottle.id}/draws`, { amount: 30, unit: 'mL' }).expect(201);
    // 70 mL left, 65 held: 55 mL more takes 50 mL of the hold.
    const refused = await post(`/api/containers/${s.bottle.id}/draws`, {
      amount: 55,
      unit: 'mL',
    }).expect(409);
    const error = errorBodySchema.parse(refused.body).error;
    expect(error.code).toBe('confirmation_required');
    expect(error.warnings).toEqual([
      expect.objectContaining({
        kind: 'hold',
        planId: s.holder.id,
        planTitle: s.procedure.title,
        labelCode: s.bottle.labelCode,
        heldBefore: 65,
        heldAfter: 15,
        loses: 50,
        unit: 'mL',
      }),
    ]);
    expect(error.message).toContain(`plan #${s.holder.id}`);
    expect(error.message).toContain('loses 50');
    expect(await balanceOf(s.bottle.id)).toBe(70);

    await post(`/api/containers/${s.bottle.id}/draws`, {
      amount: 55,
      unit: 'mL',
      confirm: true,
    }).expect(201);
    expect(await balanceOf(s.bottle.id)).toBe(15);

    // The plan now holds what is left, and its stock check counts only that.
    const plan = await planOf(s.holder.id);
    expect(plan.reservations[0]).toMatchObject({ quantity: 15, reservedQuantity: 65 });
    const ac2o = plan.stockCheck.lines[1]!;
    expect(ac2o.take[0]).toMatchObject({
      containerId: s.bottle.id,
      reservedByThisPlan: 15,
      quantity: 15,
    });
    const detail = containerDetailSchema.parse(
      (await get(`/api/containers/${s.bottle.id}`).expect(200)).body,
    );
    expect(detail.holds[0]).toMatchObject({ quantity: 15, reservedQuantity: 65 });

    // A reminder that the hold runs out speaks of what it still holds, not what was reserved.
    const lapsing = await testContext().store.repos.plans.lapsingBetween(todayIso(), nextWeek);
    expect(lapsing.find((r) => r.planId === s.holder.id)).toMatchObject({
      labelCode: s.bottle.labelCode,
      quantity: 15,
    });
  });

  it("when a run draws from another plan's held container, then it asks the same; its own plan's hold does not ask", async () => {
    const s = await heldBottle();
    const body = {
      lines: [
        { lineIndex: 0, draws: [{ containerId: s.sa.id, amount: 2, unit: 'g' }] },
        {
          lineIndex: 1,
          draws: [
            { containerId: s.bottle.id, amount: 30, unit: 'mL' },
            { containerId: s.bottle.id, amount: 10, unit: 'mL' },
          ],
        },
      ],
    };
    // A run of no plan: 40 mL of 100 leaves 60 for a 65 mL hold.
    const run = (await post('/api/runs', { procedureId: s.procedure.id }).expect(201)).body;
    const refused = await post(`/api/runs/${run.id}/record`, body).expect(409);
    const error = errorBodySchema.parse(refused.body).error;
    expect(error.code).toBe('confirmation_required');
    expect(error.warnings).toEqual([
      expect.objectContaining({ kind: 'hold', planId: s.holder.id, loses: 5, heldAfter: 60 }),
    ]);
    expect(await balanceOf(s.bottle.id)).toBe(100);
    expect(await balanceOf(s.sa.id)).toBe(100);

    const recorded = runSchema.parse(
      (await post(`/api/runs/${run.id}/record`, { ...body, confirm: true }).expect(200)).body,
    );
    expect(recorded.status).toBe('recorded');
    expect(await balanceOf(s.bottle.id)).toBe(60);
    expect((await planOf(s.holder.id)).reservations[0]).toMatchObject({ quantity: 60 });

    // The plan's own run takes from its own hold without a question.
    const own = (await post('/api/runs', { planId: s.holder.id }, technician).expect(201)).body;
    await post(
      `/api/runs/${own.id}/record`,
      {
        lines: [
          { lineIndex: 0, draws: [{ containerId: s.sa.id, amount: 2, unit: 'g' }] },
          { lineIndex: 1, draws: [{ containerId: s.bottle.id, amount: 55, unit: 'mL' }] },
        ],
      },
      technician,
    ).expect(200);
    expect(await balanceOf(s.bottle.id)).toBe(5);
  });
});
