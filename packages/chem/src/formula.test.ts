import { MF } from 'mf-parser';
import { describe, expect, it } from 'vitest';
import { ELEMENTS } from './elements';
import { ChemError } from './errors';
import { canonicalFormula, hillFormula, hillOrder, parseFormula, tryParseFormula } from './formula';
import { molarMass as molarMassOf } from './molar-mass';

function errorOf(formula: string): ChemError {
  const result = tryParseFormula(formula);
  if (result.ok) throw new Error(`expected "${formula}" to fail`);
  return result.error;
}

describe('parseFormula: compositions', () => {
  it.each([
    ['H2O', { H: 2, O: 1 }],
    ['NaCl', { Cl: 1, Na: 1 }],
    ['Ca(OH)2', { Ca: 1, H: 2, O: 2 }],
    ['(NH4)2SO4', { H: 8, N: 2, O: 4, S: 1 }],
    ['Al2(SO4)3', { Al: 2, O: 12, S: 3 }],
    ['K4Fe(CN)6·3H2O', { C: 6, H: 6, Fe: 1, K: 4, N: 6, O: 3 }],
    ['[Cu(NH3)4]SO4·H2O', { Cu: 1, H: 14, N: 4, O: 5, S: 1 }],
    ['Ca3{PO4}2', { Ca: 3, O: 8, P: 2 }],
    ['Fe((CN)2)3', { C: 6, Fe: 1, N: 6 }],
    ['CH3COOH', { C: 2, H: 4, O: 2 }],
    ['C9H8O4', { C: 9, H: 8, O: 4 }],
    ['CDCl3', { C: 1, Cl: 3, D: 1 }],
  ])('when "%s" is parsed, then its atoms are counted', (formula, elements) => {
    expect(parseFormula(formula).elements).toEqual(elements);
  });

  it.each(['CuSO4·5H2O', 'CuSO4*5H2O', 'CuSO4•5H2O', 'CuSO4 . 5H2O', 'CuSO4 · 5 H2O'])(
    'when the hydrate is written "%s", then it is the pentahydrate CuSO4·5H2O',
    (formula) => {
      const parsed = parseFormula(formula);
      expect(parsed.elements).toEqual({ Cu: 1, H: 10, O: 9, S: 1 });
      expect(parsed.normalized).toBe('CuSO4·5H2O');
      expect(parsed.parts.map((part) => part.multiplier)).toEqual([1, 5]);
    },
  );

  it('when a part has a decimal or two-digit multiplier, then it multiplies the whole part', () => {
    expect(parseFormula('CaSO4·0.5H2O').elements).toEqual({ Ca: 1, H: 1, O: 4.5, S: 1 });
    expect(parseFormula('CaSO4 . 0.5H2O').elements).toEqual({ Ca: 1, H: 1, O: 4.5, S: 1 });
    expect(parseFormula('Na2CO3·10H2O').elements).toEqual({ C: 1, H: 20, Na: 2, O: 13 });
    // sodium percarbonate: a leading number on the first part of an adduct is read
    expect(parseFormula('2Na2CO3·3H2O2').elements).toEqual({ C: 2, H: 6, Na: 4, O: 12 });
  });

  it.each([
    ['HCl (aq)', 'aq'],
    ['HCl(aq)', 'aq'],
    ['NaCl(s)', 's'],
    ['H2O (l)', 'l'],
    ['CO2(g) ', 'g'],
    ['CuSO4·5H2O (s)', 's'],
  ])('when "%s" ends with a state label, then it is ignored and recorded', (formula, state) => {
    const parsed = parseFormula(formula);
    expect(parsed.state).toBe(state);
    expect(parsed.normalized).not.toContain('(');
  });

  it('when the formula has spaces or subscript digits, then they are tolerated', () => {
    expect(parseFormula('  C2H6O ').normalized).toBe('C2H6O');
    expect(parseFormula('Ca (OH)2').normalized).toBe('Ca(OH)2');
    expect(parseFormula('H₂SO₄').normalized).toBe('H2SO4');
    expect(parseFormula('H₂SO₄').elements).toEqual({ H: 2, O: 4, S: 1 });
  });

  it('when a formula is parsed, then parts keep their positions and compositions', () => {
    const parsed = parseFormula('BaCl2 · 2H2O');
    expect(parsed.parts).toEqual([
      { multiplier: 1, text: 'BaCl2', composition: { Ba: 1, Cl: 2 }, position: 1 },
      { multiplier: 2, text: '2H2O', composition: { H: 4, O: 2 }, position: 9 },
    ]);
    expect(parsed.input).toBe('BaCl2 · 2H2O');
    expect(parsed.firstPosition).toEqual({ Ba: 1, Cl: 3, H: 10, O: 12 });
  });

  it('when every element symbol of the periodic table is parsed, then each is accepted', () => {
    for (const element of ELEMENTS) {
      expect(parseFormula(`${element.symbol}2`).elements).toEqual({ [element.symbol]: 2 });
    }
  });
});

describe('parseFormula: readings it refuses rather than guesses', () => {
  it('when a "." stands between two digits, then the formula is refused with the position of the dot', () => {
    // second opinion: mf-parser 3.9.3 reads "CuSO4.5H2O" as O4.5 while a hydrate reading gives
    // CuSO4·5H2O; the two differ, so Lotwise asks instead of picking one
    const mfDecimal = new MF('CuSO4.5H2O').getInfo().atoms as Record<string, number>;
    const mfHydrate = new MF('CuSO4 . 5H2O').getInfo().atoms as Record<string, number>;
    expect(mfDecimal.O).not.toBe(mfHydrate.O);
    for (const [formula, position] of [
      ['C1.5H3', 3],
      ['C2H4.5O', 5],
      ['CuSO4.5H2O', 6],
      ['Ca(OH)2.5', 8],
      ['CaSO4.0.5H2O', 6],
    ] as const) {
      const error = errorOf(formula);
      expect(error.code).toBe('decimal_count');
      expect(error.position).toBe(position);
      expect(error.message).toContain(`"." at position ${position} stands between two digits`);
    }
    expect(errorOf('CuSO4.5H2O').message).toContain('"CuSO4·5H2O"');
    expect(errorOf('C1.5H3').message).toContain('counts in a formula are whole numbers');
  });

  it('when a number leads a formula with no hydrate or adduct part, then it is refused, not doubled', () => {
    const error = errorOf('2H2O');
    expect(error.code).toBe('leading_multiplier');
    expect(error.position).toBe(1);
    expect(error.message).toContain('write "H2O"');
    expect(errorOf('0.5H2O').message).toContain('write "H2O"');
    expect(errorOf('  3 NaCl (s)').position).toBe(3);
    // the same number on a hydrate part is read as usual
    expect(molarMassOf('BaCl2·2H2O')).toBeCloseTo(244.26, 2); // formula-masses.tsv (calc, CIAAW2021)
  });

  it('when a hydrate is a dot with spaces, "*", "•" or subscripts, then it is stored in one form', () => {
    for (const typed of [
      'CuSO₄·5H₂O',
      'CuSO4 . 5H2O',
      'CuSO4*5H2O',
      'CuSO4 · 5 H2O',
      'CuSO4•5H2O',
    ]) {
      expect(canonicalFormula(typed)).toBe('CuSO4·5H2O');
    }
    expect(canonicalFormula('HCl (aq)')).toBe('HCl(aq)');
    expect(canonicalFormula('C1H4')).toBe('CH4');
    expect(canonicalFormula('CaSO4 . 0.5 H2O')).toBe('CaSO4·0.5H2O');
    expect(canonicalFormula('CuSO4·1H2O')).toBe('CuSO4·H2O');
    expect(canonicalFormula('[Cu(NH3)4]SO4 · H2O')).toBe('[Cu(NH3)4]SO4·H2O');
    // second opinion: mf-parser 3.9.3 gives the stored form the pentahydrate's mass
    expect(new MF('CuSO4 . 5H2O').getInfo().mass).toBeCloseTo(249.677, 1); // formula-masses.tsv (calc)
    expect(molarMassOf(canonicalFormula('CuSO₄ . 5H₂O'))).toBeCloseTo(249.677, 3); // formula-masses.tsv (calc, CIAAW2021)
  });
});

describe('Hill order', () => {
  it('when carbon is present, then C and H come first and the rest alphabetically', () => {
    expect(hillOrder(['O', 'H', 'C', 'N', 'Cl'])).toEqual(['C', 'H', 'Cl', 'N', 'O']);
    expect(hillFormula(parseFormula('CH3CH2OH').elements)).toBe('C2H6O');
    expect(hillFormula(parseFormula('C6H5NHCOCH3').elements)).toBe('C8H9NO');
  });

  it('when carbon is absent, then every symbol is alphabetical, H included', () => {
    expect(hillFormula(parseFormula('H2SO4').elements)).toBe('H2O4S');
    expect(hillFormula(parseFormula('NaCl').elements)).toBe('ClNa');
  });
});

describe('parseFormula: errors', () => {
  it('when an element is unknown, then the error names it and its position', () => {
    const error = errorOf('C6H5Xx');
    expect(error).toBeInstanceOf(ChemError);
    expect(error.code).toBe('unknown_element');
    expect(error.position).toBe(5);
    expect(error.message).toBe('unknown element "Xx" at position 5');
  });

  it('when the whole formula is lowercase, then the error suggests the capitals', () => {
    const error = errorOf('nacl');
    expect(error.code).toBe('lowercase_element');
    expect(error.position).toBe(1);
    expect(error.suggestion).toBe('NaCl');
    expect(error.message).toContain('capital letter');
    expect(error.message).toContain('did you mean "NaCl"?');
  });

  it.each([
    ['co2', 'CO2'],
    ['h2o', 'H2O'],
    ['cuso4·5h2o', 'CuSO4·5H2O'],
    ['kmno4', 'KMnO4'],
    ['caco3', 'CaCO3'],
    ['nh4cl', 'NH4Cl'],
    ['hno3', 'HNO3'],
    ['Cuso4', 'CuSO4'],
    ['HCL', 'HCl'],
  ])('when "%s" is typed, then "%s" is suggested', (typed, suggestion) => {
    expect(errorOf(typed).suggestion).toBe(suggestion);
  });

  it('when no capitalization makes sense, then no suggestion is made', () => {
    const error = errorOf('xyz');
    expect(error.code).toBe('lowercase_element');
    expect(error.suggestion).toBeUndefined();
  });

  it('when a parenthesis is never closed, then the error points at it', () => {
    const error = errorOf('Ca(OH2');
    expect(error.code).toBe('unbalanced_parenthesis');
    expect(error.position).toBe(3);
    expect(error.message).toContain('"(" at position 3 is never closed');
  });

  it('when a closing parenthesis has no opening one, then the error points at it', () => {
    const error = errorOf('CaOH)2');
    expect(error.code).toBe('unbalanced_parenthesis');
    expect(error.position).toBe(5);
    expect(error.message).toContain('")" at position 5 has no matching opening bracket');
  });

  it('when brackets are crossed, then the error says which one to use', () => {
    const error = errorOf('[Cu(NH3]4)');
    expect(error.code).toBe('unbalanced_parenthesis');
    expect(error.position).toBe(8);
    expect(error.message).toContain('does not close "(" opened at position 4: use ")"');
  });

  it('when a count is zero, then the error says so with its position', () => {
    const error = errorOf('H2O0');
    expect(error.code).toBe('zero_count');
    expect(error.position).toBe(4);
    expect(error.message).toContain('count 0');
    expect(errorOf('CuSO4·0H2O').code).toBe('zero_count');
  });

  it('when the formula is empty or only a state label, then the error says it is empty', () => {
    for (const formula of ['', '   ', '(aq)']) {
      const error = errorOf(formula);
      expect(error.code).toBe('empty_formula');
      expect(error.message).toContain('formula is empty');
    }
  });

  it('when a hydrate part is missing, then the error names the dangling separator', () => {
    const after = errorOf('CuSO4·');
    expect(after.code).toBe('empty_part');
    expect(after.position).toBe(6);
    expect(after.message).toContain('nothing after "·"');
    expect(errorOf('·5H2O').code).toBe('empty_part');
    expect(errorOf('CuSO4··5H2O').code).toBe('empty_part');
    expect(errorOf('CuSO4·5').message).toContain('multiplier 5');
  });

  it('when brackets are empty, then the error says so', () => {
    const error = errorOf('Ca()2');
    expect(error.code).toBe('empty_group');
    expect(error.position).toBe(3);
  });

  it('when a hydrate is joined by a space only, then the error shows how to write it', () => {
    const error = errorOf('CuSO4 5H2O');
    expect(error.code).toBe('unexpected_character');
    expect(error.position).toBe(7);
    expect(error.message).toContain('CuSO4·5H2O');
  });

  it('when a charge or other sign is written, then the error names the character', () => {
    const error = errorOf('SO4-2');
    expect(error.code).toBe('unexpected_character');
    expect(error.message).toContain('"-" at position 4');
  });

  it('when an unknown element sits inside a hydrate, then the position counts from the start', () => {
    const error = errorOf('CuSO4·5Hq2O');
    expect(error.code).toBe('unknown_element');
    expect(error.message).toBe('unknown element "Hq" at position 8');
    expect(errorOf('CuSO4 · 5 Q2O').message).toBe('unknown element "Q" at position 11');
  });

  it('when parseFormula is given a bad formula, then it throws the same ChemError', () => {
    expect(() => parseFormula('Xx')).toThrow(ChemError);
    expect(() => parseFormula('Xx')).toThrow('unknown element "Xx" at position 1');
  });
});
