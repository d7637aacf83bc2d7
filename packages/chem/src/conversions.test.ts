import Qty from 'js-quantities';
import { describe, expect, it } from 'vitest';
import {
  amountToMass,
  massToAmount,
  massToVolume,
  measuringDensity,
  toAmount,
  toMass,
  toVolume,
  volumeToMass,
} from './conversions';
import { ChemError } from './errors';
import { molarMass } from './molar-mass';
import { computeStoichiometry, lineAmounts } from './stoichiometry';
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

// densities in g/mL (reference chemicals.tsv; sources MERCK, NIST, CRC as keyed there)
const ETHANOL = { molarMass: molarMass('C2H6O'), density: 0.7893 };
const ACETIC_ANHYDRIDE = { molarMass: molarMass('C4H6O3'), density: 1.082 };

describe('mass, volume and amount', () => {
  it('when 10.0 mL of ethanol is converted, then it is 7.893 g and 0.1713 mol', () => {
    // calc (reference worked-examples.md, Solutions): 10.0 × 0.7893 = 7.893 g; / 46.069
    expect(sig(toMass({ value: 10.0, unit: 'mL' }, ETHANOL))).toBe(7.893);
    expect(sig(toAmount({ value: 10.0, unit: 'mL' }, ETHANOL))).toBe(0.1713);
    expect(sig(toAmount({ value: 10.0, unit: 'mL' }, ETHANOL, 'mmol'))).toBe(171.3);
  });

  it('when 5.0 mL of acetic anhydride is converted, then it is 5.410 g and 0.05299 mol', () => {
    // calc (reference worked-examples.md, Aspirin): 5.0 × 1.082; 5.410 / 102.089
    expect(sig(toMass({ value: 5.0, unit: 'mL' }, ACETIC_ANHYDRIDE))).toBe(5.41);
    expect(sig(toAmount({ value: 5.0, unit: 'mL' }, ACETIC_ANHYDRIDE))).toBe(0.05299);
  });

  it('when an amount is asked for as a volume, then it goes through mass and density', () => {
    // calc: 0.1713 mol × 46.069 g/mol / 0.7893 g/mL
    const volume = toVolume({ value: 171.33, unit: 'mmol' }, ETHANOL);
    expect(sig(volume)).toBe(10);
    expect(toVolume({ value: 2, unit: 'L' }, {})).toBe(2000);
    expect(toVolume({ value: 7.893, unit: 'g' }, ETHANOL, 'L')).toBeCloseTo(0.01, 12);
  });

  it('when purity is below 100 %, then a mass holds fewer moles and an amount needs more mass', () => {
    // calc: 2.0 g × 0.98 / 138.122; 0.01 mol × 138.122 / 0.98
    const salicylic = molarMass('C7H6O3');
    expect(massToAmount(2.0, salicylic, 98)).toBeCloseTo((2.0 * 0.98) / 138.122, 12);
    expect(amountToMass(0.01, salicylic, 98)).toBeCloseTo(1.38122 / 0.98, 12);
    expect(toAmount({ value: 2.0, unit: 'g' }, { molarMass: salicylic, purityPercent: 98 })).toBe(
      massToAmount(2.0, salicylic, 98),
    );
    expect(toMass({ value: 10, unit: 'mmol' }, { molarMass: salicylic, purityPercent: 98 })).toBe(
      amountToMass(0.01, salicylic, 98),
    );
  });

  it('when the plain helpers are used, then they multiply and divide by density and molar mass', () => {
    expect(volumeToMass(5, 1.08)).toBeCloseTo(5.4, 12);
    expect(massToVolume(5.4, 1.08)).toBeCloseTo(5, 12);
    expect(massToAmount(18.015, 18.015)).toBe(1);
    expect(amountToMass(2, 18.015)).toBe(36.03);
    expect(toMass({ value: 250, unit: 'mg' })).toBe(0.25);
    expect(toMass({ value: 2.5, unit: 'g' }, {}, 'mg')).toBe(2500);
  });
});

describe('conversions: second opinion from js-quantities', () => {
  it.each([
    [5, 1.08],
    [10, 0.7893],
    [0.7, 0.79],
    [2.0, 1.044],
    [250, 1.184],
    [12.5, 1.836],
  ])('when %d mL at %d g/mL is turned into grams, then js-quantities agrees', (ml, density) => {
    // second opinion: js-quantities 1.8.0, Qty('5 ml').mul(Qty('1.08 g/ml')).to('g')
    const theirs = Qty(`${ml} ml`)
      .mul(Qty(`${density} g/ml`))
      .to('g').scalar;
    expect(toMass({ value: ml, unit: 'mL' }, { density })).toBeCloseTo(theirs, 10);
    const back = Qty(`${theirs} g`)
      .div(Qty(`${density} g/ml`))
      .to('ml').scalar;
    expect(toVolume({ value: theirs, unit: 'g' }, { density })).toBeCloseTo(back, 10);
  });

  it.each([
    [2.0, 'C7H6O3'],
    [5.41, 'C4H6O3'],
    [0.553, 'C3H6O'],
    [24.63, 'HCl'],
    [2.497, 'CuSO4·5H2O'],
    [100, 'NaCl'],
  ])('when %d g of %s is turned into mmol, then js-quantities agrees', (grams, formula) => {
    // second opinion: js-quantities 1.8.0, Qty('2.0 g').div(Qty('138.12 g/mol')).to('mmol')
    const m = molarMass(formula);
    const theirs = Qty(`${grams} g`)
      .div(Qty(`${m} g/mol`))
      .to('mmol').scalar;
    expect(toAmount({ value: grams, unit: 'g' }, { molarMass: m }, 'mmol')).toBeCloseTo(theirs, 9);
    const mass = Qty(`${theirs} mmol`)
      .mul(Qty(`${m} g/mol`))
      .to('mg').scalar;
    expect(toMass({ value: theirs, unit: 'mmol' }, { molarMass: m }, 'mg')).toBeCloseTo(mass, 7);
  });
});

describe('conversions: errors', () => {
  it('when a volume has to become a mass without a density, then "density missing" is raised', () => {
    const error = errorOf(() => toMass({ value: 5, unit: 'mL' }, { molarMass: 58.08 }));
    expect(error.code).toBe('density_missing');
    expect(error.message).toContain('density missing');
    expect(error.message).toContain('5 mL');
    expect(errorOf(() => toVolume({ value: 5, unit: 'g' })).code).toBe('density_missing');
    expect(errorOf(() => toAmount({ value: 5, unit: 'mL' }, { molarMass: 58.08 })).code).toBe(
      'density_missing',
    );
  });

  it('when moles are asked for without a molar mass, then "molar mass missing" is raised', () => {
    const error = errorOf(() => toAmount({ value: 5, unit: 'g' }, { density: 1 }));
    expect(error.code).toBe('molar_mass_missing');
    expect(error.message).toContain('molar mass missing');
    expect(errorOf(() => toMass({ value: 5, unit: 'mmol' })).code).toBe('molar_mass_missing');
  });

  it('when a quantity is negative, then it is refused with what to do', () => {
    const error = errorOf(() => toMass({ value: -5, unit: 'g' }));
    expect(error.code).toBe('negative_quantity');
    expect(error.message).toContain('cannot be negative');
    expect(error.message).toContain('-5 g');
    expect(error.message).toContain('positive number');
    expect(errorOf(() => massToVolume(-1, 1)).code).toBe('negative_quantity');
    expect(errorOf(() => massToAmount(-1, 18)).code).toBe('negative_quantity');
  });

  it('when a value is NaN or Infinity, then it is refused as not a number', () => {
    expect(errorOf(() => toMass({ value: Number.NaN, unit: 'g' })).code).toBe('not_a_number');
    expect(errorOf(() => toAmount({ value: Infinity, unit: 'g' }, { molarMass: 18 })).code).toBe(
      'not_a_number',
    );
    expect(errorOf(() => volumeToMass(5, Number.NaN)).message).toContain('density');
  });

  it('when density, molar mass or purity is out of range, then the error names it', () => {
    expect(errorOf(() => volumeToMass(5, 0)).code).toBe('not_positive');
    expect(errorOf(() => massToAmount(5, -18)).message).toContain('molar mass');
    const purity = errorOf(() => massToAmount(5, 18, 120));
    expect(purity.code).toBe('out_of_range');
    expect(purity.message).toContain('purity');
    expect(errorOf(() => amountToMass(1, 18, 0)).code).toBe('out_of_range');
  });

  it('when the result unit is of another dimension, then it is refused', () => {
    expect(errorOf(() => toMass({ value: 5, unit: 'g' }, {}, 'mL')).code).toBe(
      'incompatible_units',
    );
    expect(errorOf(() => toMass({ value: 5, unit: 'cups' })).code).toBe('unknown_unit');
  });
});

describe('conversions: a solid measured by volume', () => {
  // from memory: poured table salt weighs about 1.2 g/mL; its crystal density is 2.165 g/mL
  // (chemicals.tsv, also from memory)
  const tableSalt = {
    physicalState: 'solid',
    density: 2.165,
    bulkDensity: 1.2,
    molarMass: molarMass('NaCl'),
  };

  it('when 10 mL of table salt is converted, then the bulk density gives about 12 g, never the crystal 21.65 g', () => {
    const grams = toMass({ value: 10, unit: 'mL' }, tableSalt);
    expect(grams).toBeCloseTo(12, 12);
    expect(grams).not.toBeCloseTo(21.65, 1);
    // second opinion: js-quantities 1.8.0 (independent-libraries.md)
    expect(grams).toBeCloseTo(Qty('10 ml').mul(Qty('1.2 g/ml')).to('g').scalar, 12);
    expect(toVolume({ value: 12, unit: 'g' }, tableSalt)).toBeCloseTo(10, 12);
    // calc: 12 g / 58.440 g/mol (CIAAW2021) = 0.20534 mol
    expect(toAmount({ value: 10, unit: 'mL' }, tableSalt)).toBeCloseTo(0.20534, 5);
  });

  it('when a solid has no bulk density, then a volume is refused with the reason, even with a crystal density', () => {
    const salt = { physicalState: 'solid', density: 2.165 };
    const byVolume = errorOf(() => toMass({ value: 10, unit: 'mL' }, salt));
    expect(byVolume.code).toBe('bulk_density_missing');
    expect(byVolume.message).toContain('bulk (poured) density');
    expect(byVolume.message).toContain('10 mL');
    expect(errorOf(() => toVolume({ value: 12, unit: 'g' }, salt)).code).toBe(
      'bulk_density_missing',
    );
    // weighing a solid needs no density at all
    expect(toMass({ value: 12, unit: 'g' }, salt)).toBe(12);
  });

  it('when the material is a liquid or a solution, then its density is used as before', () => {
    expect(measuringDensity({ physicalState: 'liquid', density: 1.082, bulkDensity: 3 })).toBe(
      1.082,
    );
    expect(measuringDensity({ physicalState: 'solution', density: 1.04 })).toBe(1.04);
    expect(measuringDensity({ physicalState: 'solid', density: 2.165 })).toBeNull();
    expect(measuringDensity({ physicalState: 'solid', density: 2.165, bulkDensity: 1.2 })).toBe(
      1.2,
    );
  });

  it('when a procedure line is a volume of a solid without a bulk density, then its moles are unknown and the warning asks for the bulk density', () => {
    const line = {
      name: 'sodium chloride',
      role: 'reagent' as const,
      quantity: { value: 10, unit: 'mL' },
      molarMass: molarMass('NaCl'),
      solid: true,
    };
    expect(lineAmounts(line).missing).toEqual(['bulk density']);
    const result = computeStoichiometry([line]);
    expect(result.warnings[0]?.message).toContain('bulk (poured) density');
    // with one, 10 mL weighs 12 g (from memory, as above)
    expect(lineAmounts({ ...line, density: 1.2 }).massG).toBeCloseTo(12, 12);
  });
});
