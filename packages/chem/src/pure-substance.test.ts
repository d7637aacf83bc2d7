import Qty from 'js-quantities';
import { describe, expect, it } from 'vitest';
import { molarMass } from './molar-mass';
import { lineAmounts } from './stoichiometry';

const NAOH = molarMass('NaOH'); // 39.997 g/mol from CIAAW2021 (worked-examples.md: 250 mL of 1.00 M = 9.999 g)

describe('lineAmounts: the pure substance of a line', () => {
  it('when a line is 88 mL of 1 M NaOH solution, then its pure substance is the 3.52 g of NaOH it holds, not the 91.52 g of solution', () => {
    const amounts = lineAmounts({
      role: 'reagent',
      quantity: { value: 88, unit: 'mL' },
      molarMass: NAOH,
      density: 1.04, // from memory: 1 M NaOH is about 1.04 g/mL
      concentration: { molarity: 1 },
    });
    // calc: 0.088 L x 1 mol/L x 39.997 g/mol = 3.5197 g
    expect(amounts.pureMassG).toBeCloseTo(3.5197, 4);
    expect(amounts.massG).toBeCloseTo(91.52, 9); // the solution itself, as measured
    // second opinion: js-quantities 1.8.0 (independent-libraries.md)
    const solute = Qty('88 ml')
      .mul(Qty('1 mol/l'))
      .mul(Qty(`${NAOH} g/mol`))
      .to('g').scalar;
    expect(amounts.pureMassG).toBeCloseTo(solute, 9);
  });

  it('when a line is 20.81 mL of 37 % HCl, then its pure substance is the 9.115 g of HCl in it', () => {
    // worked-examples.md: 250 mL of 1.00 M HCl from 37 % at 1.184 takes 24.63 g = 20.81 mL
    const amounts = lineAmounts({
      role: 'reagent',
      quantity: { value: 20.81, unit: 'mL' },
      molarMass: molarMass('HCl'),
      density: 1.184,
      concentration: { percentWw: 37 },
    });
    // calc: 20.81 x 1.184 x 0.37 = 9.1164 g = 0.2500 mol x 36.458 g/mol
    expect(amounts.pureMassG).toBeCloseTo(9.1164, 3);
    expect(amounts.amountMol).toBeCloseTo(0.25, 3);
  });

  it('when a neat reagent is 95 % pure, then its pure substance is 95 % of what is weighed', () => {
    const amounts = lineAmounts({
      role: 'reagent',
      quantity: { value: 2, unit: 'g' },
      molarMass: molarMass('C7H6O3'),
      purityPercent: 95,
    });
    expect(amounts.pureMassG).toBeCloseTo(1.9, 12); // calc: 2.0 g x 0.95
  });

  it('when a solution line has no molar mass, then its pure substance is unknown rather than the solution mass', () => {
    const amounts = lineAmounts({
      role: 'reagent',
      quantity: { value: 88, unit: 'mL' },
      density: 1.04,
      concentration: { molarity: 1 },
    });
    expect(amounts.amountMol).toBeCloseTo(0.088, 12);
    expect(amounts.pureMassG).toBeUndefined();
  });
});
