import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import { molarMass } from './molar-mass';
import {
  AMOUNT_RULE,
  BALANCE_RULE,
  checkMeasurableFactor,
  checkScaleFactor,
  displayQuantity,
  factorForLimitingReagent,
  factorForProduct,
  GLASSWARE_RULE,
  parseScaleFactor,
  roundAmountForDisplay,
  roundMassForDisplay,
  roundVolumeForDisplay,
  scaleFactorFor,
  scaleFloor,
  scaleLines,
  scaleQuantity,
} from './scaling';
import { computeStoichiometry, type ProcedureLine } from './stoichiometry';
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

// Aspirin procedure of reference worked-examples.md (calc; quantities: practice).
function aspirin(): ProcedureLine[] {
  return [
    { name: 'salicylic acid', role: 'limiting-reagent', quantity: { value: 2.0, unit: 'g' }, molarMass: molarMass('C7H6O3') },
    { name: 'acetic anhydride', role: 'reagent', quantity: { value: 5.0, unit: 'mL' }, density: 1.082, molarMass: molarMass('C4H6O3') },
    { name: 'acetylsalicylic acid', role: 'product', molarMass: molarMass('C9H8O4') },
  ]; // prettier-ignore
}

describe('scaling by a factor', () => {
  it('when the aspirin procedure is scaled × 2.5, then 5.0 g SA, 12.5 mL Ac2O and 6.522 g expected', () => {
    // calc (reference worked-examples.md): scaled x2.5, theoretical yield 6.522 g
    const scaled = scaleLines(aspirin(), 2.5);
    expect(scaled[0]?.quantity).toEqual({ value: 5, unit: 'g' });
    expect(scaled[1]?.quantity).toEqual({ value: 12.5, unit: 'mL' });
    expect(scaled[0]?.originalQuantity).toEqual({ value: 2, unit: 'g' });
    expect(scaled[1]?.display?.text).toBe('12.5 mL');
    expect(scaled[2]?.quantity).toBeUndefined();
    const result = computeStoichiometry(scaled);
    expect(sig(result.lines[2]?.theoretical?.massG ?? 0)).toBe(6.522);
  });

  it('when scaled by 1/6, then full precision is kept and only the display is rounded', () => {
    const [sa, ac2o] = scaleLines(aspirin(), 1 / 6);
    expect(sa?.quantity?.value).toBeCloseTo(2 / 6, 15);
    expect(sa?.display?.text).toBe('0.333 g');
    expect(ac2o?.quantity?.value).toBeCloseTo(5 / 6, 15);
    expect(ac2o?.display?.text).toBe('0.83 mL');
    // other fields are copied untouched
    expect(ac2o?.density).toBe(1.082);
    expect(ac2o?.name).toBe('acetic anhydride');
  });

  it('when scaling a single quantity, then the unit is kept', () => {
    expect(scaleQuantity({ value: 250, unit: 'mg' }, 0.5)).toEqual({ value: 125, unit: 'mg' });
  });

  it.each([0, -2, Number.NaN, Infinity])('when the factor is %d, then it is refused', (factor) => {
    const error = errorOf(() => scaleLines(aspirin(), factor));
    expect(error.code).toBe('invalid_factor');
    expect(error.message).toContain('greater than 0');
    expect(() => checkScaleFactor(factor)).toThrow(ChemError);
  });

  it.each([
    ['2', 2],
    ['0.5', 0.5],
    ['1/6', 1 / 6],
    [' 3 / 4 ', 0.75],
    ['2,5', 2.5],
    ['x2', 2],
    ['×1.5', 1.5],
  ])('when "%s" is typed as a factor, then it reads %d', (text, factor) => {
    expect(parseScaleFactor(text)).toBe(factor);
  });

  it.each(['0', '-1', 'abc', '1/0', '', 'two'])(
    'when "%s" is typed as a factor, then it is refused',
    (text) => {
      expect(errorOf(() => parseScaleFactor(text)).code).toBe('invalid_factor');
    },
  );
});

describe('factor for a target', () => {
  it('when the limiting reagent should be 5.0 g, then the factor is 2.5', () => {
    expect(factorForLimitingReagent(aspirin(), { value: 5.0, unit: 'g' })).toBeCloseTo(2.5, 12);
    // calc: n(SA) = 2.0 / 138.122 = 14.48 mmol; 50 mmol wanted
    expect(factorForLimitingReagent(aspirin(), { value: 50, unit: 'mmol' })).toBeCloseTo(
      50 / ((2.0 / molarMass('C7H6O3')) * 1000),
      10,
    );
  });

  it('when the product should be 6.522 g, then the factor is 2.5 and the plan scales to it', () => {
    // calc (reference worked-examples.md): 6.522 g is the yield at × 2.5
    const factor = factorForProduct(aspirin(), { value: 6.522, unit: 'g' });
    expect(sig(factor, 4)).toBe(2.5);
    const result = computeStoichiometry(scaleLines(aspirin(), factor));
    expect(result.lines[2]?.theoretical?.massG).toBeCloseTo(6.522, 10);
  });

  it('when an 80 % yield is planned for, then the factor grows by 1 / 0.8', () => {
    const full = factorForProduct(aspirin(), { value: 5, unit: 'g' });
    const planned = factorForProduct(
      aspirin(),
      { value: 5, unit: 'g' },
      { expectedYieldPercent: 80 },
    );
    expect(planned).toBeCloseTo(full / 0.8, 12);
    expect(factorForProduct(aspirin(), { value: 5, unit: 'g' }, { productIndex: 2 })).toBe(full);
  });

  it('when the target cannot be reached from the data, then the error says what is missing', () => {
    const noDensity = errorOf(() => factorForProduct(aspirin(), { value: 5, unit: 'mL' }));
    expect(noDensity.code).toBe('density_missing');
    expect(noDensity.message).toContain('density');
    const notProduct = errorOf(() =>
      factorForProduct(aspirin(), { value: 5, unit: 'g' }, { productIndex: 0 }),
    );
    expect(notProduct.message).toContain('line 1 is not a product line');
    const noLimiting = errorOf(() =>
      factorForLimitingReagent([{ role: 'reagent', quantity: { value: 1, unit: 'g' } }], {
        value: 2,
        unit: 'g',
      }),
    );
    expect(noLimiting.code).toBe('no_limiting_reagent');
    expect(errorOf(() => factorForLimitingReagent(aspirin(), { value: 0, unit: 'g' })).code).toBe(
      'invalid_factor',
    );
    expect(errorOf(() => scaleFactorFor(0, 5)).message).toContain('must be above 0');
  });
});

describe('rounding for display (common practice, no source)', () => {
  it.each([
    [0.0123456, '0.0123 g'],
    [0.00012345, '0.0001 g'],
    [0.24683, '0.247 g'],
    [0.99996, '1.00 g'],
    [2.6087, '2.61 g'],
    [9.999, '10.00 g'],
    [24.634, '24.63 g'],
    [123.456, '123.5 g'],
    [1500.4, '1500 g'],
    [0, '0 g'],
  ])('when %d g is shown, then it reads %s', (grams, text) => {
    // common practice, no source
    expect(roundMassForDisplay(grams).text).toBe(text);
  });

  it.each([
    [0.7, '0.70 mL'],
    [0.833333, '0.83 mL'],
    [5.03, '5.0 mL'],
    [6.828, '6.8 mL'],
    [12.3, '12.5 mL'],
    [20.806, '21.0 mL'],
    [50, '50.0 mL'],
    [68.3, '68 mL'],
  ])('when %d mL is shown, then it reads %s', (ml, text) => {
    // common practice, no source
    expect(roundVolumeForDisplay(ml).text).toBe(text);
  });

  it.each([
    [0.0095214, '9.52 mmol'],
    [0.01448, '14.5 mmol'],
    [0.99999, '1.00 mol'],
    [1.234, '1.23 mol'],
    [0.000012, '0.0120 mmol'],
  ])('when %d mol is shown, then it reads %s', (mol, text) => {
    // common practice, no source
    expect(roundAmountForDisplay(mol).text).toBe(text);
  });

  it('when a rounded value is returned, then it carries its number, unit and rule text', () => {
    expect(roundMassForDisplay(2.6087)).toEqual({
      value: 2.61,
      unit: 'g',
      text: '2.61 g',
      decimals: 2,
      rule: BALANCE_RULE,
    });
    expect(roundVolumeForDisplay(12.3).rule).toBe(GLASSWARE_RULE);
    expect(roundAmountForDisplay(0.01).rule).toBe(AMOUNT_RULE);
    expect(GLASSWARE_RULE).toContain('0.5 mL');
    expect(BALANCE_RULE).toContain('0.01 g');
    expect(displayQuantity({ value: 2500, unit: 'mg' }).text).toBe('2.50 g');
    expect(displayQuantity({ value: 0.25, unit: 'L' }).text).toBe('250 mL');
    expect(displayQuantity({ value: 9.521, unit: 'mmol' }).text).toBe('9.52 mmol');
  });
});

describe('scale factor floor', () => {
  // worked-examples.md aspirin: 2.0 g salicylic acid, 5.0 mL acetic anhydride (1.082 g/mL)
  const aspirin: ProcedureLine[] = [
    {
      role: 'limiting-reagent',
      quantity: { value: 2.0, unit: 'g' },
      molarMass: molarMass('C7H6O3'),
    },
    {
      role: 'reagent',
      quantity: { value: 5.0, unit: 'mL' },
      molarMass: molarMass('C4H6O3'),
      density: 1.082,
    },
    { role: 'product', molarMass: molarMass('C9H8O4') },
  ];

  it('when the lines are 2.0 g and 5.0 mL, then the floor is 0.1 mg / 2.0 g and 0.01 mL / 5.0 mL', () => {
    // calc: 0.0001 / 2.0 = 0.00005 and 0.01 / 5.0 = 0.002 (finest steps of the rounding rules,
    // common practice, no source)
    expect(scaleFloor(aspirin)).toEqual({ anyLine: 0.00005, everyLine: 0.002 });
  });

  it('when every line rounds to zero, then the factor is refused stating the floor; otherwise it is kept', () => {
    let error: unknown;
    try {
      checkMeasurableFactor(aspirin, 0.00001);
    } catch (caught) {
      error = caught;
    }
    expect(error).toBeInstanceOf(ChemError);
    expect((error as ChemError).code).toBe('factor_too_small');
    expect((error as ChemError).message).toBe(
      'at ×0.00001 every amount rounds to zero on the balance (finest 0.1 mg) and the glassware (finest 0.01 mL): the lowest factor they allow is ×0.00005; from ×0.002 every line can be measured',
    );
    // at the floor each line is confirmed non-zero by the display rules themselves
    expect(roundMassForDisplay(2.0 * 0.00005).text).toBe('0.0001 g');
    expect(checkMeasurableFactor(aspirin, 0.00005)).toBe(0.00005);
    expect(checkMeasurableFactor(aspirin, 0.001)).toBe(0.001); // the volume rounds to 0, the mass does not
  });

  it('when a line is given in mmol, then its mass on the balance counts', () => {
    const lines: ProcedureLine[] = [
      { role: 'reagent', quantity: { value: 1, unit: 'mmol' }, molarMass: molarMass('NaCl') },
    ];
    // calc: 1 mmol x 58.440 g/mol = 0.05844 g; 0.0001 / 0.05844 = 0.001711 -> 0.0018
    expect(scaleFloor(lines)).toEqual({ anyLine: 0.0018, everyLine: 0.0018 });
    expect(scaleFloor([{ role: 'product', molarMass: 18 }])).toBeNull();
  });
});
