import { describe, expect, it } from 'vitest';
import {
  countsTowardCombinedLimit,
  ghsFlammableCategoryOf,
  isClassI,
  LITRES_PER_US_GALLON,
  liquidClassOf,
  SQUARE_METRES_PER_SQUARE_FOOT,
} from './flammability';

describe('NFPA 30 liquid class', () => {
  it('when the flash point is just below, at or just above 22.8 °C, then IA/IB turns into IC at 22.8', () => {
    expect(liquidClassOf(22.7, 80)).toBe('IB'); // NFPA 30 (2024) §4.3.1: Class I below 22.8 °C (73 °F)
    expect(liquidClassOf(22.8, 80)).toBe('IC'); // NFPA 30 (2024) §4.3.1: IC at 22.8 °C and above
    expect(liquidClassOf(22.9, 80)).toBe('IC'); // NFPA 30 (2024) §4.3.1
  });

  it('when the flash point is below 22.8 °C, then the boiling point splits IA (below 37.8) from IB (37.8 or above)', () => {
    expect(liquidClassOf(-45, 37.7)).toBe('IA'); // NFPA 30 (2024) §4.3.1: IA boiling point below 37.8 °C (100 °F)
    expect(liquidClassOf(-45, 37.8)).toBe('IB'); // NFPA 30 (2024) §4.3.1: IB boiling point at or above 37.8 °C
    expect(liquidClassOf(-45, 37.9)).toBe('IB'); // NFPA 30 (2024) §4.3.1
  });

  it('when the flash point is just below, at or just above 37.8 °C, then IC turns into II at 37.8', () => {
    expect(liquidClassOf(37.7, 120)).toBe('IC'); // NFPA 30 (2024) §4.3.1: IC below 37.8 °C (100 °F)
    expect(liquidClassOf(37.8, 120)).toBe('II'); // NFPA 30 (2024) §4.3.2: Class II at 37.8 °C and above
    expect(liquidClassOf(37.9, 120)).toBe('II'); // NFPA 30 (2024) §4.3.2
  });

  it('when the flash point is just below, at or just above 60 °C, then II turns into IIIA at 60', () => {
    expect(liquidClassOf(59.9, 150)).toBe('II'); // NFPA 30 (2024) §4.3.2: II below 60 °C (140 °F)
    expect(liquidClassOf(60, 150)).toBe('IIIA'); // NFPA 30 (2024) §4.3.3: IIIA at 60 °C and above
    expect(liquidClassOf(60.1, 150)).toBe('IIIA'); // NFPA 30 (2024) §4.3.3
  });

  it('when the flash point is just below, at or just above 93 °C, then IIIA turns into IIIB at 93', () => {
    expect(liquidClassOf(92.9, 250)).toBe('IIIA'); // NFPA 30 (2024) §4.3.3: IIIA below 93 °C (200 °F)
    expect(liquidClassOf(93, 250)).toBe('IIIB'); // NFPA 30 (2024) §4.3.3: IIIB at 93 °C and above
    expect(liquidClassOf(93.1, 250)).toBe('IIIB'); // NFPA 30 (2024) §4.3.3
  });

  it('when the boiling point is unknown, then only a flash point below 22.8 °C leaves the class open', () => {
    expect(liquidClassOf(-20, null)).toBeNull(); // NFPA 30 (2024) §4.3.1: IA/IB need the boiling point
    expect(liquidClassOf(30, null)).toBe('IC'); // NFPA 30 (2024) §4.3.1: IC does not depend on it
    expect(liquidClassOf(100, null)).toBe('IIIB'); // NFPA 30 (2024) §4.3.3
  });

  it('when there is no flash point or it is not a number, then there is no class', () => {
    expect(liquidClassOf(null, 80)).toBeNull(); // common practice, no source
    expect(liquidClassOf(Number.NaN, 80)).toBeNull(); // common practice, no source
    expect(liquidClassOf(-20, Number.NaN)).toBeNull(); // common practice, no source
  });

  it('when given the classes, then IA–IC are Class I and all but IIIB count toward the combined limit', () => {
    expect(['IA', 'IB', 'IC'].every((c) => isClassI(c as 'IA'))).toBe(true); // NFPA 30 (2024) §4.3.1
    expect(isClassI('II')).toBe(false); // NFPA 30 (2024) §4.3.2
    expect(countsTowardCombinedLimit('IIIA')).toBe(true); // NFPA 45 (2024) Table 9.1.1, public summary: Classes I, II and IIIA
    expect(countsTowardCombinedLimit('IIIB')).toBe(false); // NFPA 45 (2024) Table 9.1.1, public summary
  });
});

describe('GHS flammable-liquid category', () => {
  it('when the flash point is below 23 °C, then the initial boiling point splits 1 (35 °C or below) from 2 (above 35)', () => {
    expect(ghsFlammableCategoryOf(-45, 34.9)).toBe(1); // GHS Rev. 10 Table 2.6.1: cat. 1 IBP ≤ 35 °C
    expect(ghsFlammableCategoryOf(-45, 35)).toBe(1); // GHS Rev. 10 Table 2.6.1: cat. 1 IBP ≤ 35 °C (at the boundary)
    expect(ghsFlammableCategoryOf(-45, 35.1)).toBe(2); // GHS Rev. 10 Table 2.6.1: cat. 2 IBP > 35 °C
  });

  it('when the flash point is just below, at or just above 23 °C, then 2 turns into 3 at 23', () => {
    expect(ghsFlammableCategoryOf(22.9, 80)).toBe(2); // GHS Rev. 10 Table 2.6.1: cat. 2 flash point < 23 °C
    expect(ghsFlammableCategoryOf(23, 80)).toBe(3); // GHS Rev. 10 Table 2.6.1: cat. 3 flash point ≥ 23 °C
    expect(ghsFlammableCategoryOf(23.1, 80)).toBe(3); // GHS Rev. 10 Table 2.6.1
  });

  it('when the flash point is just below, at or just above 60 °C, then 3 turns into 4 above 60', () => {
    expect(ghsFlammableCategoryOf(59.9, 150)).toBe(3); // GHS Rev. 10 Table 2.6.1: cat. 3 flash point ≤ 60 °C
    expect(ghsFlammableCategoryOf(60, 150)).toBe(3); // GHS Rev. 10 Table 2.6.1: cat. 3 includes 60 °C
    expect(ghsFlammableCategoryOf(60.1, 150)).toBe(4); // GHS Rev. 10 Table 2.6.1: cat. 4 flash point > 60 °C
  });

  it('when the flash point is just below, at or just above 93 °C, then 4 ends at 93', () => {
    expect(ghsFlammableCategoryOf(92.9, 250)).toBe(4); // GHS Rev. 10 Table 2.6.1: cat. 4 flash point ≤ 93 °C
    expect(ghsFlammableCategoryOf(93, 250)).toBe(4); // GHS Rev. 10 Table 2.6.1: cat. 4 includes 93 °C
    expect(ghsFlammableCategoryOf(93.1, 250)).toBeNull(); // GHS Rev. 10 Table 2.6.1: above 93 °C not a flammable liquid
  });

  it('when the initial boiling point is unknown, then only a flash point below 23 °C leaves the category open', () => {
    expect(ghsFlammableCategoryOf(-20, null)).toBeNull(); // GHS Rev. 10 Table 2.6.1: 1 and 2 need the IBP
    expect(ghsFlammableCategoryOf(40, null)).toBe(3); // GHS Rev. 10 Table 2.6.1: 3 does not depend on it
    expect(ghsFlammableCategoryOf(70, null)).toBe(4); // GHS Rev. 10 Table 2.6.1
  });

  it('when there is no flash point, then there is no category', () => {
    expect(ghsFlammableCategoryOf(null, 80)).toBeNull(); // common practice, no source
    expect(ghsFlammableCategoryOf(Number.NaN, 80)).toBeNull(); // common practice, no source
  });

  it('when worked for three handbook liquids, then ether, ethanol and acetic acid get 1/IA, 2/IB and 3/II', () => {
    // Figures: NIOSH Pocket Guide to Chemical Hazards (ethanol read; ether and acetic acid from memory)
    expect([liquidClassOf(-45, 34.6), ghsFlammableCategoryOf(-45, 34.6)]).toEqual(['IA', 1]); // NFPA 30 (2024) §4.3.1; GHS Rev. 10 Table 2.6.1
    expect([liquidClassOf(12.8, 78.3), ghsFlammableCategoryOf(12.8, 78.3)]).toEqual(['IB', 2]); // NFPA 30 (2024) §4.3.1; GHS Rev. 10 Table 2.6.1
    expect([liquidClassOf(39.4, 118), ghsFlammableCategoryOf(39.4, 118)]).toEqual(['II', 3]); // NFPA 30 (2024) §4.3.2; GHS Rev. 10 Table 2.6.1
  });
});

describe('exact conversions', () => {
  it('when converting gallons and square feet, then the exact factors apply', () => {
    expect(LITRES_PER_US_GALLON).toBe(3.785411784); // NIST SP 811 Appendix B: 1 gal (US) = 3.785411784 L
    expect(SQUARE_METRES_PER_SQUARE_FOOT).toBe(0.09290304); // NIST SP 811 Appendix B: 1 ft² = 0.09290304 m²
  });
});
