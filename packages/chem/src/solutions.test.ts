import Qty from 'js-quantities';
import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import { molarMass } from './molar-mass';
import {
  dilute,
  massForPercentWv,
  molarity,
  molarityFromPercentWw,
  percentWv,
  solidMassForSolution,
  stockSolutionNeeded,
} from './solutions';
import { sig } from './testing/numbers';

function errorOf(fn: () => unknown): ChemError {
  try {
    fn();
  } catch (error) {
    if (error instanceof ChemError) return error;
    throw error;
  }
  throw new Error('expected a ChemError');
}

const HCL = molarMass('HCl'); // 36.458, calc from CIAAW2021

describe('molarity of a % w/w solution', () => {
  it.each([
    // calc (reference worked-examples.md, Solutions): c = 10 × w% × ρ / M
    ['HCl', 37, 1.184, 12.02],
    ['HCl', 37, 1.19, 12.08], // label density
    ['H2SO4', 98, 1.836, 18.35], // density CRC (memory) in chemicals.tsv
    ['H3PO4', 85, 1.685, 14.62],
  ])('when %s is %d % w/w at %d g/mL, then it is %d M', (formula, percentWw, density, expected) => {
    const value = molarityFromPercentWw({
      percentWw,
      densityGPerMl: density,
      molarMass: molarMass(formula),
    });
    expect(sig(value)).toBe(expected);
  });

  it('when the concentrated HCl molarity is checked with js-quantities, then it agrees', () => {
    // second opinion: js-quantities 1.8.0, (ρ × w) / M in mol/l
    const theirs = Qty('1.184 g/ml')
      .mul(0.37)
      .div(Qty(`${HCL} g/mol`))
      .to('mol/l').scalar;
    const ours = molarityFromPercentWw({ percentWw: 37, densityGPerMl: 1.184, molarMass: HCL });
    expect(ours).toBeCloseTo(theirs, 10);
  });

  it('when the percentage is above 100 or the density is zero, then it is refused', () => {
    const input = { percentWw: 137, densityGPerMl: 1.184, molarMass: HCL };
    expect(errorOf(() => molarityFromPercentWw(input)).code).toBe('out_of_range');
    expect(
      errorOf(() => molarityFromPercentWw({ ...input, percentWw: 37, densityGPerMl: 0 })).message,
    ).toContain('density must be greater than 0');
  });
});

describe('stock solution for a target', () => {
  it('when 250 mL of 1.00 M HCl is made from 37 % at 1.184, then it takes 24.63 g = 20.81 mL', () => {
    // calc (reference worked-examples.md): 0.250 × 36.458 / 0.37 = 24.63 g; / 1.184 = 20.81 mL
    const stock = stockSolutionNeeded({
      targetVolumeMl: 250,
      targetMolarity: 1.0,
      molarMass: HCL,
      stock: { percentWw: 37, densityGPerMl: 1.184 },
    });
    expect(sig(stock.massG ?? 0)).toBe(24.63);
    expect(sig(stock.volumeMl)).toBe(20.81);
    expect(stock.amountMol).toBe(0.25);
    expect(stock.soluteMassG).toBeCloseTo(9.1145, 10);
  });

  it('when the stock is given as a molarity, then the volume follows from C1V1 = C2V2', () => {
    // calc: 250 mL × 1.00 M / 12.02 M
    const stock = stockSolutionNeeded({
      targetVolumeMl: 250,
      targetMolarity: 1.0,
      molarMass: HCL,
      stock: { molarity: 12.0 },
    });
    expect(stock.volumeMl).toBeCloseTo(20.8333333, 6);
    expect(stock.massG).toBeUndefined();
    const weighed = stockSolutionNeeded({
      targetVolumeMl: 250,
      targetMolarity: 1.0,
      molarMass: HCL,
      stock: { molarity: 12.0, densityGPerMl: 1.184 },
    });
    expect(weighed.massG).toBeCloseTo(20.8333333 * 1.184, 6);
  });

  it('when the stock is weaker than the target, then the dilution is impossible', () => {
    const error = errorOf(() =>
      stockSolutionNeeded({
        targetVolumeMl: 100,
        targetMolarity: 2,
        molarMass: HCL,
        stock: { molarity: 1 },
      }),
    );
    expect(error.code).toBe('impossible_dilution');
    expect(error.message).toContain('cannot concentrate');
  });
});

describe('solid for a solution', () => {
  it('when 250 mL of 1.00 M NaOH is made, then 9.999 g are weighed', () => {
    // calc (reference worked-examples.md): 0.250 mol × 39.997 g/mol
    const solid = solidMassForSolution({
      targetVolumeMl: 250,
      targetMolarity: 1.0,
      formula: 'NaOH',
    });
    expect(sig(solid.massG)).toBe(9.999);
    expect(solid.amountMol).toBe(0.25);
  });

  it('when 100 mL of 0.100 M CuSO4 is made from the pentahydrate, then 2.497 g (not 1.596 g) are weighed', () => {
    // calc (reference worked-examples.md): 0.0100 mol × 249.677; the anhydrous mass is the trap
    const pentahydrate = solidMassForSolution({
      targetVolumeMl: 100,
      targetMolarity: 0.1,
      formula: 'CuSO4·5H2O',
    });
    expect(sig(pentahydrate.massG)).toBe(2.497);
    expect(pentahydrate.molarMass).toBeCloseTo(249.677, 9);
    const anhydrous = solidMassForSolution({
      targetVolumeMl: 100,
      targetMolarity: 0.1,
      formula: 'CuSO4',
    });
    expect(sig(anhydrous.massG)).toBe(1.596);
    expect(sig(pentahydrate.massG)).not.toBe(sig(anhydrous.massG));
  });

  it('when a molar mass and a purity are given instead, then the mass is scaled up for purity', () => {
    // calc: 0.5 L × 0.150 M × 58.44 g/mol = 4.383 g (textbook-style exercise, from memory);
    // at 99 % purity, 4.383 / 0.99
    const pure = solidMassForSolution({
      targetVolumeMl: 500,
      targetMolarity: 0.15,
      molarMass: 58.44,
    });
    expect(sig(pure.massG)).toBe(4.383);
    const impure = solidMassForSolution({
      targetVolumeMl: 500,
      targetMolarity: 0.15,
      molarMass: 58.44,
      purityPercent: 99,
    });
    expect(impure.massG).toBeCloseTo(4.383 / 0.99, 10);
  });

  it('when both or neither of formula and molar mass are given, then it asks for one', () => {
    const both = errorOf(() =>
      solidMassForSolution({
        targetVolumeMl: 100,
        targetMolarity: 1,
        formula: 'NaCl',
        molarMass: 58.44,
      }),
    );
    expect(both.code).toBe('conflicting_inputs');
    expect(
      errorOf(() => solidMassForSolution({ targetVolumeMl: 100, targetMolarity: 1 })).code,
    ).toBe('conflicting_inputs');
    expect(
      errorOf(() =>
        solidMassForSolution({ targetVolumeMl: -100, targetMolarity: 1, formula: 'NaCl' }),
      ).code,
    ).toBe('negative_quantity');
    expect(
      errorOf(() =>
        solidMassForSolution({ targetVolumeMl: 100, targetMolarity: 1, formula: 'NaXx' }),
      ).code,
    ).toBe('unknown_element');
  });
});

describe('% w/v and molarity', () => {
  it('when saline is 0.9 % w/v, then 250 mL needs 2.25 g and 2.25 g in 250 mL is 0.9 %', () => {
    // from memory: physiological saline is 0.9 % w/v (9 g/L)
    expect(massForPercentWv({ percentWv: 0.9, volumeMl: 250 })).toBeCloseTo(2.25, 12);
    expect(percentWv({ soluteMassG: 2.25, volumeMl: 250 })).toBeCloseTo(0.9, 12);
  });

  it('when 0.25 mol is dissolved to 500 mL, then it is 0.5 M', () => {
    expect(molarity({ amountMol: 0.25, volumeMl: 500 })).toBe(0.5);
    expect(errorOf(() => molarity({ amountMol: 0.25, volumeMl: 0 })).code).toBe('not_positive');
  });
});

describe('dilution C1V1 = C2V2', () => {
  it('when 250 mL of 1 M is made from 12 M, then 20.83 mL of stock and about 229 mL of water', () => {
    // calc: 1 × 250 / 12
    const result = dilute({ c1: 12, c2: 1, v2: 250 });
    expect(sig(result.v1)).toBe(20.83);
    expect(result.solventVolume).toBeCloseTo(250 - 250 / 12, 10);
  });

  it('when any one term is left out, then it is solved for', () => {
    // from memory: textbook exercise, 10 mL of 12 M diluted to 120 mL gives 1 M
    expect(dilute({ c1: 12, v1: 10, v2: 120 }).c2).toBe(1);
    expect(dilute({ c1: 12, v1: 10, c2: 1 }).v2).toBe(120);
    expect(dilute({ v1: 10, c2: 1, v2: 120 }).c1).toBe(12);
  });

  it('when the terms would concentrate or are incomplete, then it is refused', () => {
    const up = errorOf(() => dilute({ c1: 1, v1: 100, c2: 2 }));
    expect(up.code).toBe('impossible_dilution');
    expect(up.message).toContain('cannot concentrate');
    expect(errorOf(() => dilute({ c1: 1, v1: 10 })).message).toContain('missing: c2, v2');
    expect(errorOf(() => dilute({ c1: 1, v1: 10, c2: 1, v2: 10 })).code).toBe('conflicting_inputs');
    expect(errorOf(() => dilute({ c1: 12, v1: 0, c2: 1 })).code).toBe('not_positive');
    expect(errorOf(() => dilute({ c1: Number.NaN, v1: 10, c2: 1 })).code).toBe('not_a_number');
  });
});
