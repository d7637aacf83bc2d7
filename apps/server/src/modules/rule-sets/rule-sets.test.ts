import { ruleSetSchema, type RuleSet } from '@lotwise/shared';
import request from 'supertest';
import { z } from 'zod';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
let viewer = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
});

const listOf = z.object({ items: z.array(ruleSetSchema) });

const ownLimits = {
  kind: 'flammable-limits',
  name: 'City fire marshal, teaching rooms',
  source: 'City fire marshal (fictional), letter to the lab',
  edition: '2026',
  data: {
    unit: 'L',
    perFloorArea: null,
    byUnitClass: [
      { unitClass: 'C', perArea: { classI: 40, classesIToIIIA: 80 }, maxPerUnit: null },
    ],
    outsideStorageFactor: 0.5,
    instructional: null,
    storeyReductions: [],
    countsIgnitableWaste: true,
    perCabinet: 60,
  },
};

describe('rule sets', () => {
  it('when the sets are listed, then the built-in ones come with their source and citation', async () => {
    const all = listOf.parse(
      (await request(app()).get('/api/rule-sets').set('Cookie', viewer).expect(200)).body,
    ).items;
    const nfpa45 = all.find((s) => s.kind === 'flammable-limits' && s.builtIn)!;
    expect(nfpa45.citation).toBe('NFPA 45 (2024), Table 9.1.1');
    expect(nfpa45.kind === 'flammable-limits' && nfpa45.data.byUnitClass).toContainEqual({
      unitClass: 'B',
      perArea: { classI: 10, classesIToIIIA: 20 }, // NFPA 45 (2024) Table 9.1.1 (public summary)
      maxPerUnit: { classI: 480, classesIToIIIA: 800 }, // NFPA 45 (2024) Table 9.1.1 (public summary)
    });
    const waste = all.find((s) => s.kind === 'waste-accumulation')!;
    expect(waste.citation).toBe('US EPA, 40 CFR, §262.15');
    expect(waste.kind === 'waste-accumulation' && waste.data).toMatchObject({
      maxHazardous: { value: 55, unit: 'gal' }, // 40 CFR 262.15(a)
      maxAcutelyHazardous: { value: 1, unit: 'qt' }, // 40 CFR 262.15(a)
      daysAllowedOnceExceeded: 3, // 40 CFR 262.15(a)(6)
      maxAccumulationDays: null,
      nearFraction: 0.9,
    });
    const sizes = listOf.parse(
      (await request(app()).get('/api/rule-sets?kind=container-sizes').set('Cookie', viewer)).body,
    ).items;
    expect(sizes.map((s) => s.kind)).toEqual(['container-sizes']);
    expect(sizes[0]!.kind === 'container-sizes' && sizes[0]!.data.limits).toContainEqual({
      liquidClass: 'IB',
      material: 'glass',
      maxCapacity: 0.25, // from memory (NFPA 30 Table 9.4.3): 1 qt
    });
  });

  it('when a lab enters its own set, then it reads back; a viewer may not', async () => {
    await request(app()).post('/api/rule-sets').set('Cookie', viewer).send(ownLimits).expect(403);
    const created = ruleSetSchema.parse(
      (
        await request(app())
          .post('/api/rule-sets')
          .set('Cookie', manager)
          .send(ownLimits)
          .expect(201)
      ).body,
    );
    expect(created).toMatchObject({
      builtIn: false,
      reference: '',
      citation: 'City fire marshal (fictional), letter to the lab (2026)',
    });
    const changed = await request(app())
      .patch(`/api/rule-sets/${created.id}`)
      .set('Cookie', manager)
      .send({ ...ownLimits, name: 'Teaching rooms, 2026 letter' })
      .expect(200);
    expect(changed.body.name).toBe('Teaching rooms, 2026 letter');
    await request(app()).delete(`/api/rule-sets/${created.id}`).set('Cookie', manager).expect(204);
    await request(app()).get(`/api/rule-sets/${created.id}`).set('Cookie', viewer).expect(404);
  });

  it('when a built-in set would be changed or deleted, then 409 says to copy it', async () => {
    const builtIn = listOf
      .parse((await request(app()).get('/api/rule-sets').set('Cookie', viewer)).body)
      .items.find((s: RuleSet) => s.builtIn)!;
    const patched = await request(app())
      .patch(`/api/rule-sets/${builtIn.id}`)
      .set('Cookie', manager)
      .send(ownLimits)
      .expect(409);
    expect(patched.body.error.message).toMatch(/copy it to change it/);
    await request(app()).delete(`/api/rule-sets/${builtIn.id}`).set('Cookie', manager).expect(409);
  });

  it('when a set is in use by a lab area, then deleting it is refused naming the area', async () => {
    const set = (
      await request(app()).post('/api/rule-sets').set('Cookie', manager).send(ownLimits).expect(201)
    ).body as RuleSet;
    const room = await make.location({ name: 'Rule-set room', kind: 'room' });
    await request(app())
      .post('/api/lab-areas')
      .set('Cookie', manager)
      .send({
        locationId: room.id,
        unitClass: 'C',
        floorArea: 40,
        floorAreaUnit: 'm2',
        flammableRuleSetId: set.id,
      })
      .expect(201);
    const refused = await request(app())
      .delete(`/api/rule-sets/${set.id}`)
      .set('Cookie', manager)
      .expect(409);
    expect(refused.body.error.message).toContain('Rule-set room');
  });

  it('when the figures do not fit the kind, then 400 names the field', async () => {
    const bad = await request(app())
      .post('/api/rule-sets')
      .set('Cookie', manager)
      .send({ ...ownLimits, data: { ...ownLimits.data, outsideStorageFactor: 2 } })
      .expect(400);
    expect(JSON.stringify(bad.body.error.fields)).toContain('outsideStorageFactor');
  });
});
