import { describe, expect, it } from 'vitest';
import { formatAmount, formatDate, formatLitres, formatMolarMass } from './format';

describe('format', () => {
  it('when an amount is shown, then it carries its unit at balance precision', () => {
    expect(formatAmount(250, 'g', 'en-GB')).toBe('250.00 g');
    expect(formatAmount(1234.5, 'mL', 'en-GB')).toBe('1,234.50 mL');
    expect(formatAmount(null, 'g')).toBe('—');
  });

  it('when the reader is German, then amounts have a decimal comma and point grouping, with the same decimals', () => {
    // de-DE writes 1.234,50 (CLDR) // common practice, no source
    expect(formatAmount(1.5, 'g', 'de-DE')).toBe('1,50 g');
    expect(formatAmount(1234.5, 'mL', 'de-DE')).toBe('1.234,50 mL');
    expect(formatAmount(0.0523, 'g', 'de-DE')).toBe('0,0523 g');
  });

  it('when a date is shown, then it follows the locale', () => {
    expect(formatDate('2026-12-03', 'en-GB')).toBe('3 Dec 2026');
    expect(formatDate('2026-12-03', 'de-DE')).toBe('03.12.2026');
  });

  it('when a molar mass is shown, then it has two decimals and g/mol', () => {
    expect(formatMolarMass(180.156)).toBe('180.16 g/mol');
  });
});

describe('formatLitres', () => {
  // common practice, no source: one decimal for room totals, two below a litre.
  it('when a total is a litre or more, then it has one decimal; below a litre, two', () => {
    expect(formatLitres(15.14, 'en')).toBe('15.1 L');
    expect(formatLitres(0.04, 'en')).toBe('0.04 L');
    expect(formatLitres(0, 'en')).toBe('0.0 L');
    expect(formatLitres(-4.3, 'de-DE')).toBe('-4,3 L');
  });
});
