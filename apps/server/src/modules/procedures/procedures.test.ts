import { BALANCE_RULE } from '@lotwise/chem';
import { procedureSchema, scaledProcedureSchema } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn } from '../../test/factories';
import { testContext } from '../../test/harness';
import { preparationFactory } from '../../test/preparations';

const app = () => testContext().app;
let manager = '';
let viewer = '';
const make = preparationFactory(() => manager);
const sig = (x: number, n = 4) => Number(x.toPrecision(n));

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
});

const get = (path: string, cookie = viewer) => request(app()).get(path).set('Cookie', cookie);

describe('procedures', () => {
  it('when the aspirin procedure is saved, then every response carries the stoichiometry of packages/chem', async () => {
    const { procedure, ac2o } = await make.aspirin();
    const body = procedureSchema.parse(
      (await get(`/api/procedures/${procedure.id}`).expect(200)).body,
    );
    const stoichiometry = body.stoichiometry!;
    expect(stoichiometry.limitingIndex).toBe(0);
    expect(stoichiometry.detectedLimitingIndex).toBe(0);
    // worked example (reference worked-examples.md), calc from CIAAW2021: n(SA) = 0.01448 mol
    expect(sig(stoichiometry.lines[0]!.amountMol!)).toBe(0.01448);
    // worked example (reference worked-examples.md), calc from CIAAW2021: 5.410 g Ac2O, 3.660 equivalents
    expect(sig(stoichiometry.lines[1]!.massG!)).toBe(5.41);
    expect(sig(stoichiometry.lines[1]!.equivalents!)).toBe(3.66);
    // worked example (reference worked-examples.md), calc from CIAAW2021: theoretical 2.609 g
    expect(sig(stoichiometry.lines[3]!.theoretical!.massG!)).toBe(2.609);
    expect(body.lines[1]).toMatchObject({ chemicalId: ac2o.id, role: 'reagent', unit: 'mL' });
    expect(body.literatureMeltingC).toEqual({ low: 135, high: 136 });
    expect(body.cautionFlags).toMatchObject({ fumeHood: true, keepBelowC: 90 });
    expect(body.runCount).toBe(0);
    const listed = (await get(`/api/procedures?q=${encodeURIComponent(body.title)}`).expect(200))
      .body;
    expect(listed.total).toBe(1);
  });

  it('when scaled by 2.5, 5/2 or to 5.0 g of the limiting reagent, then the theoretical yield is 6.522 g with rounded amounts', async () => {
    const { procedure } = await make.aspirin();
    for (const query of ['factor=2.5', 'factor=5/2', 'targetLimitingMass=5&unit=g']) {
      const scaled = scaledProcedureSchema.parse(
        (await get(`/api/procedures/${procedure.id}/scaled?${query}`).expect(200)).body,
      );
      expect(scaled.factor, query).toBeCloseTo(2.5, 12);
      // worked example (reference worked-examples.md), calc from CIAAW2021: ×2.5 -> 6.522 g
      expect(sig(scaled.theoreticalYield!.massG!), query).toBe(6.522);
      expect(scaled.theoreticalYield!.display!.text).toBe('6.52 g');
      expect(scaled.lines[1]!.quantity).toEqual({ value: 12.5, unit: 'mL' });
      // common practice, no source: 12.5 mL read on a 50 mL cylinder (0.5 mL steps)
      expect(scaled.lines[1]!.display!.text).toBe('12.5 mL');
      expect(scaled.lines[0]!.display).toMatchObject({ text: '5.00 g', rule: BALANCE_RULE });
      expect(scaled.rules.balance).toBe(BALANCE_RULE);
    }
    const sixth = scaledProcedureSchema.parse(
      (await get(`/api/procedures/${procedure.id}/scaled?factor=1/6`).expect(200)).body,
    );
    // calc: 2.0 g / 6 = 0.33333 g, shown as 0.333 g (3 significant figures below 1 g)
    expect(sixth.lines[0]!.quantity!.value).toBeCloseTo(1 / 3, 12);
    expect(sixth.lines[0]!.display!.text).toBe('0.333 g');
    const product = scaledProcedureSchema.parse(
      (
        await get(`/api/procedures/${procedure.id}/scaled?targetProductMass=2.609&unit=g`).expect(
          200,
        )
      ).body,
    );
    expect(product.basis).toBe('product');
    expect(product.factor).toBeCloseTo(1, 3);
    const bad = await get(`/api/procedures/${procedure.id}/scaled?factor=0`).expect(400);
    expect(bad.body.error.fields.factor).toMatch(/scale factor/);
    await get(`/api/procedures/${procedure.id}/scaled`).expect(400);
  });

  it('when the Fischer esterification is saved, then the alcohol limits and 5.981 g = 6.828 mL is expected', async () => {
    const alcohol = await make.chemical('Isoamyl alcohol', 'C5H12O', { density: 0.81 });
    const acid = await make.chemical('Acetic acid', 'C2H4O2', { density: 1.049 });
    const ester = await make.chemical('Isoamyl acetate', 'C7H14O2', { density: 0.876 });
    const procedure = await make.procedure({
      title: 'Isoamyl acetate',
      lines: [
        { chemicalId: alcohol.id, role: 'reagent', quantity: 5.0, unit: 'mL', coefficient: 1 },
        { chemicalId: acid.id, role: 'reagent', quantity: 7.0, unit: 'mL', coefficient: 1 },
        { chemicalId: ester.id, role: 'product', coefficient: 1 },
      ],
    });
    const s = procedure.stoichiometry!;
    expect(s.detectedLimitingIndex).toBe(0);
    // worked example (reference worked-examples.md), calc from CIAAW2021: 2.661 equivalents of acid
    expect(sig(s.lines[1]!.equivalents!)).toBe(2.661);
    // worked example (reference worked-examples.md), calc from CIAAW2021: 5.981 g = 6.828 mL
    expect(sig(s.lines[2]!.theoretical!.massG!)).toBe(5.981);
    expect(sig(s.lines[2]!.theoretical!.volumeMl!)).toBe(6.828);
  });

  it('when dibenzalacetone has 2 benzaldehyde : 1 acetone, then acetone limits and 2.231 g is expected', async () => {
    const benzaldehyde = await make.chemical('Benzaldehyde', 'C7H6O', { density: 1.044 });
    const acetone = await make.chemical('Acetone', 'C3H6O', { density: 0.79 });
    const dba = await make.chemical('Dibenzalacetone', 'C17H14O');
    const procedure = await make.procedure({
      title: 'Dibenzalacetone',
      lines: [
        { chemicalId: benzaldehyde.id, role: 'reagent', quantity: 2.0, unit: 'mL', coefficient: 2 },
        { chemicalId: acetone.id, role: 'reagent', quantity: 0.7, unit: 'mL', coefficient: 1 },
        { chemicalId: dba.id, role: 'product', coefficient: 1 },
      ],
    });
    const s = procedure.stoichiometry!;
    // worked example (reference worked-examples.md), calc from CIAAW2021: acetone limits
    expect(s.detectedLimitingIndex).toBe(1);
    // worked example (reference worked-examples.md), calc from CIAAW2021: 9.521 mmol x 234.298 = 2.231 g
    expect(sig(s.lines[1]!.amountMol! * 1000)).toBe(9.521);
    expect(sig(s.lines[2]!.theoretical!.massG!)).toBe(2.231);
  });

  it('when a solute is dissolved in water, then its moles come from its mass and the water is scaled with it', async () => {
    const bicarbonate = await make.chemical('Sodium bicarbonate', 'NaHCO3');
    const water = await make.chemical('Water', 'H2O', { density: 0.99821 });
    const procedure = await make.procedure({
      title: 'Bicarbonate wash',
      lines: [
        {
          chemicalId: bicarbonate.id,
          role: 'work-up',
          quantity: 2.5,
          unit: 'g',
          dissolvedIn: { chemicalId: water.id, quantity: 50, unit: 'mL' },
        },
      ],
    });
    // calc from CIAAW2021: 2.5 g / 84.006 g/mol = 29.76 mmol
    expect(sig(procedure.stoichiometry!.lines[0]!.amountMol! * 1000)).toBe(29.76);
    expect(procedure.lines[0]!.dissolvedIn).toMatchObject({ chemicalId: water.id, quantity: 50 });
    const scaled = (await get(`/api/procedures/${procedure.id}/scaled?factor=0.5`).expect(200))
      .body;
    expect(scaled.lines[0].dissolvedIn).toMatchObject({ quantity: 25, unit: 'mL' });
    expect(scaled.lines[0].dissolvedIn.display.text).toBe('25.0 mL');
  });

  it('when lines are wrong, then 400 names the field; a viewer may read but not write', async () => {
    const sa = await make.chemical('Salicylic acid', 'C7H6O3');
    const post = (body: object, cookie = manager) =>
      request(app()).post('/api/procedures').set('Cookie', cookie).send(body);
    const noQuantity = await post({ title: 'x', lines: [{ chemicalId: sa.id, role: 'reagent' }] });
    expect(noQuantity.status).toBe(400);
    expect(noQuantity.body.error.fields['lines.0.quantity']).toMatch(/required/);
    const unknown = await post({
      title: 'x',
      lines: [{ chemicalId: 987654, role: 'reagent', quantity: 1, unit: 'g' }],
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields['lines.0.chemicalId']).toMatch(/no chemical/);
    const badUnit = await post({
      title: 'x',
      lines: [{ chemicalId: sa.id, role: 'reagent', quantity: 1, unit: 'spoons' }],
    });
    expect(badUnit.status).toBe(400);
    const twoLimiting = await post({
      title: 'x',
      lines: [
        { chemicalId: sa.id, role: 'limiting-reagent', quantity: 1, unit: 'g' },
        { chemicalId: sa.id, role: 'limiting-reagent', quantity: 1, unit: 'g' },
      ],
    });
    expect(twoLimiting.body.error.fields.lines).toMatch(/at most one/);
    await post(
      { title: 'x', lines: [{ chemicalId: sa.id, role: 'reagent', quantity: 1, unit: 'g' }] },
      viewer,
    ).expect(403);
  });

  it('when a procedure is edited, then its lines are replaced; once planned it cannot be deleted', async () => {
    const { procedure, sa, asa } = await make.aspirin();
    const patched = await request(app())
      .patch(`/api/procedures/${procedure.id}`)
      .set('Cookie', manager)
      .send({
        expectedYieldPercent: 75,
        lines: [
          { chemicalId: sa.id, role: 'limiting-reagent', quantity: 1.0, unit: 'g' },
          { chemicalId: asa.id, role: 'product' },
        ],
      })
      .expect(200);
    expect(patched.body.lines).toHaveLength(2);
    // calc from CIAAW2021: 1.0 g / 138.122 x 180.159 = 1.304 g
    expect(sig(patched.body.stoichiometry.lines[1].theoretical.massG)).toBe(1.304);
    await request(app())
      .post('/api/plans')
      .set('Cookie', manager)
      .send({ procedureId: procedure.id, scaleFactor: 1, plannedOn: '2099-01-01' })
      .expect(201);
    const refused = await request(app())
      .delete(`/api/procedures/${procedure.id}`)
      .set('Cookie', manager)
      .expect(409);
    expect(refused.body.error.message).toMatch(/plan/);
    const chemicalInUse = await request(app())
      .delete(`/api/chemicals/${sa.id}`)
      .set('Cookie', manager)
      .expect(409);
    expect(chemicalInUse.body.error.message).toMatch(/procedure/);
    const other = await make.aspirin();
    await request(app())
      .delete(`/api/procedures/${other.procedure.id}`)
      .set('Cookie', manager)
      .expect(204);
  });
});

describe('scale factors', () => {
  it('when every line would round to zero, then the factor is refused with the lowest factor the balance and glassware allow', async () => {
    const { procedure } = await make.aspirin();
    // 2.0 g, 5.0 mL and 0.25 mL at x0.00001: 0.02 mg, 0.00005 mL, 0.0000025 mL all read 0
    const refused = await get(`/api/procedures/${procedure.id}/scaled?factor=0.00001`).expect(400);
    // calc: 0.1 mg / 2.0 g = 0.00005 (finest balance step, common practice, no source);
    // 0.01 mL / 0.25 mL = 0.04 (finest glassware step)
    expect(refused.body.error.fields.factor).toContain('every amount rounds to zero');
    expect(refused.body.error.fields.factor).toContain('the lowest factor they allow is ×0.00005');
    expect(refused.body.error.fields.factor).toContain('from ×0.04 every line can be measured');
    // at x0.00005 the salicylic acid reads 0.0001 g: allowed
    const lowest = scaledProcedureSchema.parse(
      (await get(`/api/procedures/${procedure.id}/scaled?factor=0.00005`).expect(200)).body,
    );
    expect(lowest.lines[0]!.display!.text).toBe('0.0001 g');
    const plan = await request(app())
      .post('/api/plans')
      .set('Cookie', manager)
      .send({
        procedureId: procedure.id,
        scaleFactor: 0.00001,
        benches: 1,
        plannedOn: '2099-01-01',
      })
      .expect(400);
    expect(plan.body.error.fields.scaleFactor).toContain(
      'the lowest factor they allow is ×0.00005',
    );
  });

  it('when basis=expected is asked of a procedure without an expected yield, then the answer says it fell back to theory', async () => {
    const { procedure } = await make.aspirin({ expectedYieldPercent: null });
    const query = 'targetProductMass=2.609&unit=g&basis=expected';
    const fallback = scaledProcedureSchema.parse(
      (await get(`/api/procedures/${procedure.id}/scaled?${query}`).expect(200)).body,
    );
    // worked-examples.md: the theoretical yield at base scale is 2.609 g, so the factor is 1
    expect(fallback.factor).toBeCloseTo(1, 3);
    expect(fallback.yieldBasis).toBe('theoretical');
    expect(fallback.notice).toContain('no expected yield');
    expect(fallback.notice).toContain('theoretical yield');
    const { procedure: withYield } = await make.aspirin({ expectedYieldPercent: 80 });
    const expected = scaledProcedureSchema.parse(
      (await get(`/api/procedures/${withYield.id}/scaled?${query}`).expect(200)).body,
    );
    // calc: 2.609 g / (2.609 g x 0.80) = 1.25
    expect(expected.factor).toBeCloseTo(1.25, 3);
    expect(expected).toMatchObject({ yieldBasis: 'expected', notice: null });
  });
});

describe('procedure steps', () => {
  const patch = (id: number, body: object) =>
    request(app()).patch(`/api/procedures/${id}`).set('Cookie', manager).send(body);

  it('when steps are saved, then they come back in order with their windows and cautions', async () => {
    const { procedure } = await make.aspirin({
      steps: [
        {
          text: 'Warm the salicylic acid with the anhydride.',
          temperatureLowC: 80,
          temperatureHighC: 90,
          durationMinutes: 15,
          lineIndex: 1,
          addition: 'in one portion',
          caution: 'fumeHood',
        },
        { text: 'Cool in ice.', holdPoint: 'crystals have formed' },
      ],
    });
    const body = procedureSchema.parse(
      (await get(`/api/procedures/${procedure.id}`).expect(200)).body,
    );
    expect(body.steps).toEqual([
      {
        index: 0,
        text: 'Warm the salicylic acid with the anhydride.',
        durationMinutes: 15,
        temperatureLowC: 80,
        temperatureHighC: 90,
        outsideWindow: '',
        lineIndex: 1,
        addition: 'in one portion',
        caution: 'fumeHood',
        holdPoint: '',
      },
      {
        index: 1,
        text: 'Cool in ice.',
        durationMinutes: null,
        temperatureLowC: null,
        temperatureHighC: null,
        outsideWindow: '',
        lineIndex: null,
        addition: '',
        caution: null,
        holdPoint: 'crystals have formed',
      },
    ]);
    const replaced = await patch(procedure.id, { steps: [{ text: 'Only step.' }] }).expect(200);
    expect(replaced.body.steps).toHaveLength(1);
  });

  it('when a step points past the last line or its window is upside down, then nothing is saved and the field is named', async () => {
    const { procedure } = await make.aspirin();
    const past = await patch(procedure.id, { steps: [{ text: 'Add it.', lineIndex: 9 }] }).expect(
      400,
    );
    expect(past.body.error.fields['steps.0.lineIndex']).toMatch(/points at line 10/);
    const upside = await patch(procedure.id, {
      steps: [{ text: 'Keep cold.', temperatureLowC: 10, temperatureHighC: 5 }],
    }).expect(400);
    expect(Object.keys(upside.body.error.fields)).toContain('steps.0.temperatureHighC');
    // Fewer lines than a step needs: refused, the old lines kept.
    await patch(procedure.id, { steps: [{ text: 'Add the anhydride.', lineIndex: 1 }] }).expect(
      200,
    );
    const shrink = await patch(procedure.id, {
      lines: [(await get(`/api/procedures/${procedure.id}`)).body.lines[0]].map(
        ({
          chemicalId,
          role,
          quantity,
          unit,
        }: {
          chemicalId: number;
          role: string;
          quantity: number;
          unit: string;
        }) => ({ chemicalId, role, quantity, unit }),
      ),
    });
    expect(shrink.status).toBe(400);
    expect(shrink.body.error.fields['steps.0.lineIndex']).toMatch(/has 1 line\b/);
    expect((await get(`/api/procedures/${procedure.id}`)).body.lines.length).toBeGreaterThan(1);
  });
});
