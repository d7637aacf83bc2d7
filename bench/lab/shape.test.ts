import { isValidCasNumber } from '@lotwise/chem';
import { describe, expect, it } from 'vitest';
import { benchCasNumber, benchChemicalName } from './shape';

describe('generated chemicals', () => {
  it('when CAS RNs are generated, then each passes the CAS check-digit rule and none repeats', () => {
    const numbers = Array.from({ length: 5000 }, (_, i) => benchCasNumber(i + 1));
    // CAS check digit: the CAS Registry's published rule, as packages/chem implements it.
    expect(numbers.every((cas) => isValidCasNumber(cas))).toBe(true);
    expect(new Set(numbers).size).toBe(numbers.length);
    expect(numbers.filter((cas) => cas.startsWith('5012')).length).toBe(10);
  });

  it('when names are generated, then each is unique', () => {
    const names = Array.from({ length: 5000 }, (_, i) => benchChemicalName(i + 1));
    expect(new Set(names).size).toBe(names.length);
  });
});
