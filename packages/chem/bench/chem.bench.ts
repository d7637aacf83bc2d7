import { bench, describe } from 'vitest';
import { computeStoichiometry, molarMass, parseFormula, type ProcedureLine } from '../src/index';

// ~50 formulas of the kind a teaching-lab catalogue holds.
const FORMULAS = [
  'H2O', 'C2H6O', 'C3H6O', 'C4H8O2', 'C2H4O2', 'C4H6O3', 'C7H6O3', 'C9H8O4', 'C5H12O',
  'C7H14O2', 'C7H6O', 'C17H14O', 'NaOH', 'HCl (aq)', 'H2SO4', 'H3PO4', 'CuSO4·5H2O', 'NaCl',
  'NaHCO3', 'KMnO4', 'Zn', 'NaNO2', 'C4H10O', 'C4H8O', 'C6H14', 'C8H9NO', 'Ca(OH)2',
  'Pb(NO3)2', 'BaCl2·2H2O', 'MgSO4·7H2O', '(NH4)2SO4', 'Al2(SO4)3', 'K4Fe(CN)6·3H2O',
  'CoCl2·6H2O', 'Na2CO3·10H2O', 'AgNO3', 'SnCl2·2H2O', 'CuSO4', 'C6H12O6', 'C12H22O11',
  'C8H10N4O2', 'KAl(SO4)2·12H2O', '(NH4)2Fe(SO4)2·6H2O', 'K2Cr2O7', 'Na2S2O3·5H2O',
  '[Cu(NH3)4]SO4·H2O', 'Cu(CH3COO)2·H2O', 'CaSO4·0.5H2O', 'CDCl3', 'C6H4(COOH)2',
]; // prettier-ignore

const TEN_LINES: ProcedureLine[] = [
  { name: 'benzaldehyde', role: 'reagent', coefficient: 2, quantity: { value: 2.0, unit: 'mL' }, density: 1.044, molarMass: 106.124 },
  { name: 'acetone', role: 'limiting-reagent', quantity: { value: 0.7, unit: 'mL' }, density: 0.79, molarMass: 58.08 },
  { name: 'sodium hydroxide solution', role: 'reagent', quantity: { value: 20, unit: 'mL' }, concentration: { molarity: 2.5 }, density: 1.1, molarMass: 39.997 },
  { name: 'ethanol', role: 'solvent', quantity: { value: 20, unit: 'mL' }, density: 0.7893 },
  { name: 'water', role: 'solvent', quantity: { value: 20, unit: 'mL' }, density: 0.998 },
  { name: 'catalyst', role: 'catalyst', quantity: { value: 50, unit: 'mg' }, molarMass: 100 },
  { name: 'hydrochloric acid 37 %', role: 'work-up', quantity: { value: 2, unit: 'mL' }, density: 1.184, concentration: { percentWw: 37 }, molarMass: 36.458 },
  { name: 'ice water', role: 'work-up', quantity: { value: 50, unit: 'mL' } },
  { name: 'dibenzalacetone', role: 'product', quantity: { value: 1.9, unit: 'g' }, molarMass: 234.298 },
  { name: 'water formed', role: 'product', coefficient: 2, molarMass: 18.015 },
]; // prettier-ignore

describe('formulas', () => {
  bench('parseFormula × 50', () => {
    for (const formula of FORMULAS) parseFormula(formula);
  });
  bench('molarMass × 50', () => {
    for (const formula of FORMULAS) molarMass(formula);
  });
});

describe('stoichiometry', () => {
  bench('computeStoichiometry, 10 lines', () => {
    computeStoichiometry(TEN_LINES);
  });
});
