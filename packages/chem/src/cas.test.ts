import { describe, expect, it } from 'vitest';
import { casCheckDigit, formatCasNumber, isValidCasNumber, validateCasNumber } from './cas';

// CAS check-digit rule (reference cas-numbers.md, key CAS); reasons checked against "why (calc)"
const REFERENCE_ROWS: [string, boolean, string | null][] = [
  ['7732-18-5', true, null], // sum 105
  ['64-17-5', true, null], // sum 45
  ['7758-99-8', true, null], // sum 148
  ['50-78-2', true, null], // sum 42
  ['35225-79-7', true, null], // sum 107
  ['64-17-6', false, 'check digit should be 5'],
  ['50-87-2', false, 'check digit should be 3'], // transposition
  ['7732-81-5', false, 'check digit should be 2'], // transposition
  ['7732185', false, 'needs hyphens, e.g. 7732-18-5'],
  ['1-23-4', false, 'first group needs 2 to 7 digits'],
];

// CAS RNs of the reference chemicals.tsv (sources as keyed there), all valid by the rule
const CATALOGUE = [
  '7732-18-5', '64-17-5', '67-64-1', '141-78-6', '64-19-7', '108-24-7', '69-72-7', '50-78-2',
  '123-51-3', '123-92-2', '100-52-7', '538-58-9', '1310-73-2', '7647-01-0', '7664-93-9',
  '7664-38-2', '7758-99-8', '7647-14-5', '144-55-8', '7722-64-7', '7440-66-6', '7632-00-0',
  '60-29-7', '109-99-9', '110-54-3', '103-84-4',
]; // prettier-ignore

describe('CAS RN check', () => {
  it.each(REFERENCE_ROWS)('when %s is checked, then valid is %s (%s)', (cas, valid, reason) => {
    const check = validateCasNumber(cas);
    expect(check.valid).toBe(valid);
    if (!check.valid) expect(check.reason).toBe(reason);
  });

  it('when the published example 107-07-3 is summed, then the check digit is 3', () => {
    // CAS (reference cas-numbers.md): 1x7 + 2x0 + 3x7 + 4x0 + 5x1 = 33 -> 3
    expect(casCheckDigit('10707')).toBe(3);
    expect(casCheckDigit('107-07')).toBe(3);
    expect(validateCasNumber('107-07-3')).toEqual({ valid: true });
  });

  it.each(CATALOGUE)('when the catalogue number %s is checked, then it is valid', (cas) => {
    expect(isValidCasNumber(cas)).toBe(true);
  });

  it.each([
    ['', 'is empty: write it like 7732-18-5'],
    ['7732 18 5', 'may contain only digits and hyphens, e.g. 7732-18-5'],
    ['7732-185', 'needs three groups joined by two hyphens, e.g. 7732-18-5'],
    ['12345678-12-3', 'first group needs 2 to 7 digits'],
    ['7732-1-5', 'middle group needs 2 digits'],
    ['7732-18-55', 'last group is a single check digit'],
    ['07732-18-5', 'first group cannot start with 0'],
    ['64-17-X', 'may contain only digits and hyphens, e.g. 7732-18-5'],
    ['1234567', 'needs hyphens, e.g. 7732-18-5'],
  ])('when "%s" is checked, then the reason is "%s"', (cas, reason) => {
    expect(validateCasNumber(cas)).toEqual({ valid: false, reason });
  });

  it('when digits without hyphens form a valid number, then the reason shows it hyphenated', () => {
    expect(validateCasNumber('64175')).toEqual({
      valid: false,
      reason: 'needs hyphens, e.g. 64-17-5',
    });
  });

  it('when surrounding spaces are typed, then they are ignored', () => {
    expect(validateCasNumber(' 64-17-5 ')).toEqual({ valid: true });
  });
});

describe('formatCasNumber', () => {
  it.each([
    ['7732185', '7732-18-5'],
    ['64175', '64-17-5'],
    ['35225797', '35225-79-7'],
    [' 50-78-2 ', '50-78-2'],
  ])('when "%s" is formatted, then it reads %s', (input, formatted) => {
    expect(formatCasNumber(input)).toBe(formatted);
  });

  it.each(['7732186', '1234', '12345678901', 'abc'])(
    'when "%s" cannot be a valid number, then null',
    (input) => {
      expect(formatCasNumber(input)).toBeNull();
    },
  );
});
