import { molarMass } from '@lotwise/chem';
import { describe, expect, it } from 'vitest';
import {
  planCreateSchema,
  procedureCreateSchema,
  procedureLinesFor,
  procedureStoichiometry,
  runDrawSchema,
  scaledQuerySchema,
  tryProcedureStoichiometry,
  type LineChemicalFacts,
} from './index';

const sig = (x: number, n = 4) => Number(x.toPrecision(n));

// Chemicals of the aspirin worked example (reference worked-examples.md); molar masses
// calc from CIAAW2021, density 1.082 g/mL as given there.
const facts = new Map<number, LineChemicalFacts>([
  [
    1,
    {
      id: 1,
      name: 'salicylic acid',
      molarMass: molarMass('C7H6O3'),
      density: null,
      defaultPurityPercent: 100,
    },
  ],
  [
    2,
    {
      id: 2,
      name: 'acetic anhydride',
      molarMass: molarMass('C4H6O3'),
      density: 1.082,
      defaultPurityPercent: 100,
    },
  ],
  [
    3,
    {
      id: 3,
      name: 'acetylsalicylic acid',
      molarMass: molarMass('C9H8O4'),
      density: null,
      defaultPurityPercent: 100,
    },
  ],
  [
    4,
    {
      id: 4,
      name: 'phosphoric acid 85 %',
      molarMass: molarMass('H3PO4'),
      density: 1.685,
      defaultPurityPercent: 85,
    },
  ],
  [
    5,
    {
      id: 5,
      name: 'NaOH 1 M',
      molarMass: molarMass('NaOH'),
      density: 1.04,
      defaultPurityPercent: 100,
    },
  ],
]);
const aspirin = [
  { chemicalId: 1, role: 'limiting-reagent' as const, quantity: 2.0, unit: 'g', coefficient: 1 },
  { chemicalId: 2, role: 'reagent' as const, quantity: 5.0, unit: 'mL', coefficient: 1 },
  { chemicalId: 3, role: 'product' as const, coefficient: 1 },
];

describe('procedure lines for packages/chem (shared by the server and the form)', () => {
  it('when the aspirin draft is mapped, then the stoichiometry gives 2.609 g, and 6.522 g at ×2.5', () => {
    // worked example (reference worked-examples.md), calc from CIAAW2021: theoretical 2.609 g
    expect(sig(procedureStoichiometry(aspirin, facts).lines[2]!.theoretical!.massG!)).toBe(2.609);
    // worked example (reference worked-examples.md), calc from CIAAW2021: ×2.5 -> 6.522 g
    expect(sig(procedureStoichiometry(aspirin, facts, 2.5).lines[2]!.theoretical!.massG!)).toBe(
      6.522,
    );
  });

  it('when a line is neat below 100 % or a solution, then purity or concentration and density are carried', () => {
    const lines = procedureLinesFor(
      [
        { chemicalId: 4, role: 'catalyst', quantity: 0.25, unit: 'mL' },
        {
          chemicalId: 5,
          role: 'reagent',
          quantity: 20,
          unit: 'mL',
          concentration: { molarity: 1 },
        },
        { chemicalId: null, role: 'reagent', quantity: 1, unit: 'g' },
      ],
      (id) => facts.get(id),
    );
    expect(lines[0]).toMatchObject({ purityPercent: 85, density: 1.685 });
    expect(lines[1]).toMatchObject({ concentration: { molarity: 1 }, density: 1.04 });
    expect(lines[1]!.purityPercent).toBeUndefined();
    expect(lines[2]).toEqual({ role: 'reagent', quantity: { value: 1, unit: 'g' } });
    const half = tryProcedureStoichiometry(
      [{ role: 'reagent', quantity: 1, unit: 'spoons' }],
      facts,
    );
    expect(half.ok).toBe(false);
  });

  it('when forms are parsed, then factors as fractions, draws and lines are checked', () => {
    expect(
      planCreateSchema.parse({ procedureId: 1, scaleFactor: '1/4', plannedOn: '2026-05-01' }),
    ).toMatchObject({
      scaleFactor: 0.25,
      benches: 1,
      overagePercent: 10,
    });
    expect(
      planCreateSchema.safeParse({ procedureId: 1, scaleFactor: '0', plannedOn: '2026-05-01' })
        .success,
    ).toBe(false);
    expect(scaledQuerySchema.parse({ factor: '1/6' }).factor).toBeCloseTo(1 / 6, 12);
    expect(scaledQuerySchema.safeParse({}).success).toBe(false);
    expect(runDrawSchema.safeParse({ containerId: 1, unit: 'g' }).success).toBe(false);
    expect(
      runDrawSchema.safeParse({
        containerId: 1,
        grossMassBefore: 10,
        grossMassAfter: 12,
        unit: 'g',
      }).success,
    ).toBe(false);
    expect(
      runDrawSchema.safeParse({ containerId: 1, grossMassAfter: 12, unit: 'mL' }).success,
    ).toBe(false);
    const procedure = procedureCreateSchema.safeParse({
      title: 'x',
      lines: [{ chemicalId: 1, role: 'reagent', quantity: 2, unit: null }],
    });
    expect(procedure.success).toBe(false);
  });
});
