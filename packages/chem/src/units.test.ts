import Qty from 'js-quantities';
import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import {
  BASE_UNITS,
  convert,
  dimensionOf,
  isUnit,
  parseUnit,
  toBaseUnit,
  tryParseUnit,
  UNIT_SYMBOLS,
  unitsOf,
} from './units';

function errorOf(fn: () => unknown): ChemError {
  try {
    fn();
  } catch (error) {
    if (error instanceof ChemError) return error;
    throw error;
  }
  throw new Error('expected a ChemError');
}

describe('parseUnit', () => {
  it.each([
    ['µg', 'µg', 'mass', 1e-6],
    ['μg', 'µg', 'mass', 1e-6], // Greek mu instead of the micro sign
    ['ug', 'µg', 'mass', 1e-6],
    ['mg', 'mg', 'mass', 1e-3],
    ['g', 'g', 'mass', 1],
    ['kg', 'kg', 'mass', 1e3],
    ['µL', 'µL', 'volume', 1e-3],
    ['uL', 'µL', 'volume', 1e-3],
    ['ul', 'µL', 'volume', 1e-3],
    ['mL', 'mL', 'volume', 1],
    ['ml', 'mL', 'volume', 1],
    ['L', 'L', 'volume', 1e3],
    ['l', 'L', 'volume', 1e3],
    ['µmol', 'µmol', 'amount', 1e-6],
    ['umol', 'µmol', 'amount', 1e-6],
    ['mmol', 'mmol', 'amount', 1e-3],
    ['mol', 'mol', 'amount', 1],
    [' mL ', 'mL', 'volume', 1],
  ])('when "%s" is parsed, then it is %s (%s, × %d to base)', (text, symbol, dimension, factor) => {
    expect(parseUnit(text)).toMatchObject({ symbol, dimension });
    expect(parseUnit(text).factor).toBeCloseTo(factor, 15);
  });

  it('when a unit is unknown, then the error lists the valid ones', () => {
    const error = errorOf(() => parseUnit('oz'));
    expect(error.code).toBe('unknown_unit');
    expect(error.message).toContain('unknown unit "oz"');
    for (const symbol of UNIT_SYMBOLS) expect(error.message).toContain(symbol);
    expect(tryParseUnit('ML').ok).toBe(false); // megalitre is not a lab unit; case matters
    expect(isUnit('')).toBe(false);
  });

  it('when units are listed by dimension, then each has its own, base unit included', () => {
    expect(unitsOf('mass')).toEqual(['µg', 'mg', 'g', 'kg']);
    expect(unitsOf('volume')).toEqual(['µL', 'mL', 'L']);
    expect(unitsOf('amount')).toEqual(['µmol', 'mmol', 'mol']);
    expect(BASE_UNITS).toEqual({ mass: 'g', volume: 'mL', amount: 'mol' });
    expect(dimensionOf('ul')).toBe('volume');
  });
});

describe('convert', () => {
  it.each([
    [250, 'mL', 'L', 0.25],
    [5, 'mg', 'g', 0.005],
    [1.5, 'kg', 'g', 1500],
    [20, 'µL', 'mL', 0.02],
    [9.521, 'mmol', 'mol', 0.009521],
    [0.0144, 'mol', 'mmol', 14.4],
    [3, 'g', 'µg', 3e6],
    [7, 'umol', 'mmol', 0.007],
    [0.1, 'L', 'µL', 1e5],
  ])('when %d %s is converted to %s, then it is exactly %d', (value, from, to, expected) => {
    // exact decimal arithmetic: factors are powers of ten, no float noise expected
    expect(convert(value, from, to)).toBe(expected);
  });

  it('when a mass is converted to a volume, then the error says a density is needed', () => {
    const error = errorOf(() => convert(5, 'g', 'mL'));
    expect(error.code).toBe('incompatible_units');
    expect(error.message).toContain('cannot convert g (a mass) to mL (a volume)');
    expect(error.message).toContain('density');
    expect(errorOf(() => convert(5, 'mol', 'g')).message).toContain('molar mass');
    expect(errorOf(() => convert(5, 'mL', 'mmol')).code).toBe('incompatible_units');
  });

  it('when the value is not a number, then the error says so', () => {
    expect(errorOf(() => convert(Number.NaN, 'g', 'mg')).code).toBe('not_a_number');
    expect(errorOf(() => convert(Infinity, 'g', 'mg')).message).toContain('finite number');
  });

  it('when a ledger correction is negative, then it converts like any number', () => {
    expect(convert(-250, 'mg', 'g')).toBe(-0.25);
  });

  it('when a quantity is brought to its base unit, then the dimension comes with it', () => {
    expect(toBaseUnit({ value: 250, unit: 'mg' })).toEqual({
      value: 0.25,
      dimension: 'mass',
      unit: 'g',
    });
  });
});

describe('convert: second opinion from js-quantities', () => {
  // js-quantities 1.8.0 spells units ug, mg, g, kg, ul, ml, l, umol, mmol, mol
  const spelling: Record<string, string> = {
    µg: 'ug',
    mg: 'mg',
    g: 'g',
    kg: 'kg',
    µL: 'ul',
    mL: 'ml',
    L: 'l',
    µmol: 'umol',
    mmol: 'mmol',
    mol: 'mol',
  };
  const values = [0.001, 0.25, 1, 3.7, 12.5, 250, 1000, 98765.4321];

  for (const dimension of ['mass', 'volume', 'amount'] as const) {
    it(`when every pair of ${dimension} units is converted, then js-quantities agrees`, () => {
      // second opinion: js-quantities 1.8.0, Qty('<value> <unit>').to('<unit>')
      for (const from of unitsOf(dimension)) {
        for (const to of unitsOf(dimension)) {
          for (const value of values) {
            const theirs = Qty(`${value} ${spelling[from]}`).to(spelling[to] ?? '').scalar;
            const ours = convert(value, from, to);
            expect(Math.abs(ours - theirs), `${value} ${from} -> ${to}`).toBeLessThanOrEqual(
              Math.abs(theirs) * 1e-12,
            );
          }
        }
      }
    });
  }
});
