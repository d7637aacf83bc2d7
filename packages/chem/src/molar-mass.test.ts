import { MF } from 'mf-parser';
import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import {
  atomicWeight,
  elementMassFraction,
  massComposition,
  molarMass,
  tryMolarMass,
  waterOfCrystallization,
} from './molar-mass';
import { dec } from './testing/numbers';

// calc from CIAAW2021 (reference formula-masses.tsv): formula, g/mol to 3 decimals
const FORMULA_MASSES: [string, number][] = [
  ['Ca(OH)2', 74.092],
  ['Pb(NO3)2', 331.208],
  ['BaCl2·2H2O', 244.26],
  ['MgSO4·7H2O', 246.466],
  ['(NH4)2SO4', 132.134],
  ['Al2(SO4)3', 342.132],
  ['K4Fe(CN)6·3H2O', 422.39],
  ['CoCl2·6H2O', 237.923],
  ['Na2CO3·10H2O', 286.138],
  ['AgNO3', 169.874],
  ['SnCl2·2H2O', 225.64],
  ['CuSO4', 159.602],
  ['CuSO4·5H2O', 249.677],
];

// reference chemicals.tsv: formula, molar_mass_calc (calc from CIAAW2021),
// molar_mass_published (source key), published value recalled rather than read
const CHEMICALS: [string, string, number, number, string, boolean][] = [
  ['water', 'H2O', 18.015, 18.0153, 'NIST', false],
  ['ethanol', 'C2H6O', 46.069, 46.07, 'MERCK', false],
  ['acetone', 'C3H6O', 58.08, 58.08, 'MERCK', false],
  ['ethyl acetate', 'C4H8O2', 88.106, 88.11, 'MERCK', false],
  ['acetic acid, glacial', 'C2H4O2', 60.052, 60.05, 'MERCK', false],
  ['acetic anhydride', 'C4H6O3', 102.089, 102.0886, 'NIST', false],
  ['salicylic acid', 'C7H6O3', 138.122, 138.1207, 'NIST', false],
  ['acetylsalicylic acid', 'C9H8O4', 180.159, 180.16, 'MERCK', false],
  ['isoamyl alcohol', 'C5H12O', 88.15, 88.15, 'CLP-ATP17', false],
  ['isoamyl acetate', 'C7H14O2', 130.187, 130.187, 'CLP-ATP17', false],
  ['benzaldehyde', 'C7H6O', 106.124, 106.12, 'MERCK', false],
  ['dibenzalacetone', 'C17H14O', 234.298, 234.29, 'calc', false],
  ['sodium hydroxide', 'NaOH', 39.997, 40.0, 'MERCK', false],
  ['hydrochloric acid 37 % w/w', 'HCl (aq)', 36.458, 36.46, 'CLP-ATP17', false],
  ['sulfuric acid 98 % w/w', 'H2SO4', 98.072, 98.08, 'CLP-ATP17', false],
  ['phosphoric acid 85 % w/w', 'H3PO4', 97.994, 97.994, 'CLP-ATP17', false],
  ['copper(II) sulfate pentahydrate', 'CuSO4·5H2O', 249.677, 249.68, 'memory', true],
  ['sodium chloride', 'NaCl', 58.44, 58.44, 'calc', false],
  ['sodium bicarbonate', 'NaHCO3', 84.006, 84.01, 'calc', false],
  ['potassium permanganate', 'KMnO4', 158.032, 158.034, 'CLP-ATP17', false],
  ['zinc powder', 'Zn', 65.38, 65.38, 'calc', false],
  ['sodium nitrite', 'NaNO2', 68.995, 69.0, 'MERCK', false],
  ['diethyl ether', 'C4H10O', 74.123, 74.12, 'NIST', false],
  ['tetrahydrofuran', 'C4H8O', 72.107, 72.11, 'MERCK', false],
  ['n-hexane', 'C6H14', 86.178, 86.18, 'calc', false],
  ['acetanilide', 'C8H9NO', 135.166, 135.17, 'calc', false],
];

// The same formulas in the spelling mf-parser 3.9.3 reads correctly: hydrates as "A . nB".
const FOR_MF_PARSER = (formula: string) =>
  formula.replace(/\s*\((aq|s|l|g)\)$/, '').replace(/·/g, ' . ');

// A broad set for the mf-parser second opinion: salts, organics, complexes, hydrates.
const BROAD_SET = [
  ...FORMULA_MASSES.map(([formula]) => formula),
  ...CHEMICALS.map(([, formula]) => formula),
  'C6H12O6', 'C12H22O11', 'C8H10N4O2', 'C6H8O7', 'C2H2O4·2H2O', 'CaCO3', 'CaCl2·2H2O',
  'FeSO4·7H2O', 'FeCl3·6H2O', 'Fe2(SO4)3', 'KAl(SO4)2·12H2O', 'NH4Fe(SO4)2·12H2O',
  '(NH4)2Fe(SO4)2·6H2O', 'K2Cr2O7', 'KIO3', 'Na2S2O3·5H2O', 'Na2B4O7·10H2O', 'Mg(NO3)2·6H2O',
  'Ni(NO3)2·6H2O', 'ZnSO4·7H2O', 'MnCl2·4H2O', 'Cu(CH3COO)2·H2O', 'Pb(CH3COO)2·3H2O',
  'C6H5COOH', 'C10H8', 'C6H5NH2', 'CH2Cl2', 'CHCl3', 'C2H5Br', 'KBr', 'NaI', 'LiCl', 'H3BO3',
  'Na2SiO3', 'NaF', 'Ba(OH)2·8H2O', 'SnCl4', 'AgCl', 'Ca3(PO4)2', 'C6H4(COOH)2',
]; // prettier-ignore

describe('molar mass against the reference', () => {
  it.each(FORMULA_MASSES)(
    'when the molar mass of %s is computed, then it is %d g/mol',
    (formula, expected) => {
      // calc from CIAAW2021 (reference formula-masses.tsv), exact to the 3 decimals given
      expect(Math.abs(molarMass(formula) - expected)).toBeLessThan(0.0005);
    },
  );

  it.each(CHEMICALS)(
    'when the molar mass of %s (%s) is computed, then it matches calc %d and published %d (%s)',
    (_name, formula, calc, published, source, recalled) => {
      const value = molarMass(formula);
      // calc from CIAAW2021 (reference chemicals.tsv, molar_mass_calc)
      expect(Math.abs(value - calc)).toBeLessThan(0.0005);
      // published value (reference chemicals.tsv, molar_mass_published, key in the row);
      // published tables round or use other atomic weights, hence 0.01; from memory: 0.05
      expect(Math.abs(value - published), source).toBeLessThan(recalled ? 0.05 : 0.011);
    },
  );

  it.each(FORMULA_MASSES.map(([formula]) => formula))(
    'when tryMolarMass is given %s, then it returns the same value as ok',
    (formula) => {
      expect(tryMolarMass(formula)).toEqual({ ok: true, value: molarMass(formula) });
    },
  );
});

describe('molar mass: second opinion', () => {
  it.each(BROAD_SET)('when %s is computed, then mf-parser agrees', (formula) => {
    // second opinion: mf-parser 3.9.3, new MF(f).getInfo().mass. Its atomic masses are
    // not the CIAAW 2021 abridged ones (S 32.065 against 32.06), so allow 0.015 g/mol or
    // 0.012 % of the mass, whichever is larger.
    const theirs = new MF(FOR_MF_PARSER(formula)).getInfo().mass;
    const ours = molarMass(formula);
    expect(Math.abs(ours - theirs)).toBeLessThan(Math.max(0.015, 1.2e-4 * ours));
  });

  it.each([
    // textbook values, from memory (rounded to 2 decimals; wider tolerance)
    ['C6H12O6', 180.16], // glucose
    ['C12H22O11', 342.3], // sucrose
    ['C8H10N4O2', 194.19], // caffeine
    ['CaCO3', 100.09],
    ['NH3', 17.03],
    ['CO2', 44.01],
    ['NaCl', 58.44],
    ['H2SO4', 98.08],
    ['KMnO4', 158.03],
  ])('when the textbook formula %s is computed, then it is about %d g/mol', (formula, expected) => {
    // from memory
    expect(Math.abs(molarMass(formula) - expected)).toBeLessThan(0.02);
  });
});

describe('composition and water of crystallization', () => {
  it('when the pentahydrate is analysed, then it is 36.08 % water', () => {
    // calc from CIAAW2021 (reference formula-masses.tsv note): 5 × 18.015 / 249.677
    const water = waterOfCrystallization('CuSO4·5H2O');
    expect(water.waterPerFormulaUnit).toBe(5);
    expect(dec(water.percent, 2)).toBe(36.08);
    expect(water.waterMass).toBeCloseTo(90.075, 9);
    expect(water.anhydrousMolarMass).toBeCloseTo(159.602, 9);
    expect(water.molarMass).toBeCloseTo(249.677, 9);
  });

  it.each([
    // calc from CIAAW2021: n × 18.015 / M, values of formula-masses.tsv
    ['MgSO4·7H2O', 7, 51.17], // 126.105 / 246.466
    ['Na2CO3·10H2O', 10, 62.96], // 180.15 / 286.138
    ['BaCl2·2H2O', 2, 14.75], // 36.03 / 244.26
    ['CaSO4·0.5H2O', 0.5, 6.21], // 9.0075 / 145.1415
  ])('when %s is analysed, then it has %d water and %d % water', (formula, n, percent) => {
    const water = waterOfCrystallization(formula);
    expect(water.waterPerFormulaUnit).toBe(n);
    expect(dec(water.percent, 2)).toBe(percent);
  });

  it('when a salt is anhydrous or is water itself, then it has no water of crystallization', () => {
    expect(waterOfCrystallization('CuSO4').waterPerFormulaUnit).toBe(0);
    expect(waterOfCrystallization('H2O').percent).toBe(0);
    // H2O2 in an adduct is peroxide, not water
    expect(waterOfCrystallization('Na2CO3·1.5H2O2').waterPerFormulaUnit).toBe(0);
  });

  it('when water is broken down by element, then it is 11.19 % H and 88.81 % O', () => {
    // calc from CIAAW2021: 2.016 / 18.015 and 15.999 / 18.015
    const shares = massComposition('H2O');
    expect(shares.map((share) => share.symbol)).toEqual(['H', 'O']);
    expect(shares.map((share) => dec(share.percent, 2))).toEqual([11.19, 88.81]);
    expect(shares[0]).toMatchObject({ name: 'hydrogen', count: 2, mass: 2.016 });
    const total = shares.reduce((sum, share) => sum + share.massFraction, 0);
    expect(total).toBeCloseTo(1, 12);
  });

  it('when the copper of the pentahydrate is asked for, then it is 25.45 %', () => {
    // calc from CIAAW2021: 63.546 / 249.677
    expect(dec(elementMassFraction('CuSO4·5H2O', 'Cu') * 100, 2)).toBe(25.45);
    expect(elementMassFraction('CuSO4', 'Na')).toBe(0);
  });
});

describe('molar mass: errors', () => {
  it('when an element has no standard atomic weight, then the error says so with its position', () => {
    const result = tryMolarMass('NaTcO4');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error.code).toBe('no_standard_atomic_weight');
    expect(result.error.position).toBe(3);
    expect(result.error.message).toContain(
      'technetium (Tc) at position 3 has no standard atomic weight',
    );
    for (const formula of ['PmCl3', 'Po', 'UO2(NO3)2·6H2O']) {
      expect(tryMolarMass(formula).ok).toBe(formula.startsWith('U'));
    }
  });

  it('when the formula is bad, then tryMolarMass returns the parse error', () => {
    const result = tryMolarMass('C6H5Xx');
    expect(result).toMatchObject({ ok: false, error: { code: 'unknown_element', position: 5 } });
    if (!result.ok) expect(result.error.message).toBe('unknown element "Xx" at position 5');
    expect(() => molarMass('Ca(OH')).toThrow(ChemError);
  });

  it('when an atomic weight is asked for, then unknown symbols and Tc are refused', () => {
    expect(atomicWeight('Cu')).toBe(63.546); // CIAAW 2021 abridged (reference atomic-weights.tsv)
    expect(() => atomicWeight('Xx')).toThrow('unknown element "Xx"');
    expect(() => atomicWeight('Tc')).toThrow('no standard atomic weight');
  });
});
