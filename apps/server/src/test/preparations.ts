import type { ChemicalCreate, Procedure, ProcedureCreate } from '@lotwise/shared';
import request from 'supertest';
import { stockFactory } from './factories';
import { testContext } from './harness';

/**
 * The reagents of the reference worked examples (densities as given there, g/mL), made over
 * HTTP as a manager, with procedures for them.
 */
export function preparationFactory(cookie: () => string) {
  const stock = stockFactory(cookie);
  const post = (path: string, body: object) =>
    request(testContext().app).post(path).set('Cookie', cookie()).send(body);
  const chemical = (name: string, formula: string, overrides: Partial<ChemicalCreate> = {}) =>
    stock.chemical({
      name: `${name} ${Math.random().toString(36).slice(2, 7)}`,
      formula,
      physicalState: overrides.density ? 'liquid' : 'solid',
      stockUnit: overrides.density ? 'mL' : 'g',
      ...overrides,
    });
  async function procedure(body: ProcedureCreate) {
    const response = await post('/api/procedures', body);
    if (response.status !== 201) throw new Error(JSON.stringify(response.body));
    return response.body as Procedure;
  }
  return {
    ...stock,
    chemical,
    procedure,
    /** Aspirin: 2.0 g salicylic acid + 5.0 mL acetic anhydride (1.082 g/mL) -> acetylsalicylic acid. */
    async aspirin(extra: Partial<ProcedureCreate> = {}) {
      const sa = await chemical('Salicylic acid', 'C7H6O3', {
        ghsPictograms: ['GHS05', 'GHS07'],
        hazardStatements: ['H302', 'H318'],
      });
      const ac2o = await chemical('Acetic anhydride', 'C4H6O3', {
        density: 1.082,
        ghsPictograms: ['GHS02', 'GHS05'],
        hazardStatements: ['H226', 'H314'],
      });
      const h3po4 = await chemical('Phosphoric acid 85 %', 'H3PO4', {
        density: 1.685,
        physicalState: 'solution',
        defaultPurityPercent: 85,
      });
      const asa = await chemical('Acetylsalicylic acid', 'C9H8O4');
      const created = await procedure({
        title: `Aspirin ${Math.random().toString(36).slice(2, 7)}`,
        reference: 'Teaching handout, invented for tests',
        baseScale: 'one bench: 2.0 g salicylic acid',
        expectedYieldPercent: 80,
        literatureMeltingC: { low: 135, high: 136 },
        cautions: 'Acetic anhydride is corrosive and lachrymatory.',
        cautionFlags: { fumeHood: true, exothermicAddition: true, keepBelowC: 90 },
        lines: [
          { chemicalId: sa.id, role: 'limiting-reagent', quantity: 2.0, unit: 'g', coefficient: 1 },
          { chemicalId: ac2o.id, role: 'reagent', quantity: 5.0, unit: 'mL', coefficient: 1 },
          { chemicalId: h3po4.id, role: 'catalyst', quantity: 0.25, unit: 'mL', optional: true },
          { chemicalId: asa.id, role: 'product', coefficient: 1 },
        ],
        ...extra,
      });
      return { sa, ac2o, h3po4, asa, procedure: created };
    },
  };
}
