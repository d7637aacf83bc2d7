import { describe, expect, it } from 'vitest';
import { parseDecimal } from './numbers';

// Decimal and grouping marks per locale as CLDR gives them through Intl. // common practice, no source
describe('parseDecimal', () => {
  it('when typed in de-DE, then the decimal comma and point grouping are read', () => {
    expect(parseDecimal('1,5', 'de-DE')).toBe(1.5);
    expect(parseDecimal('1.234,5', 'de-DE')).toBe(1234.5);
    expect(parseDecimal('0,852', 'de-DE')).toBe(0.852);
    expect(parseDecimal('1.250', 'de-DE')).toBe(1250);
    expect(parseDecimal('1.5', 'de-DE')).toBe(1.5);
    expect(parseDecimal('1 234,5', 'de-DE')).toBe(1234.5);
  });

  it('when typed in en-GB, then the decimal point and comma grouping are read', () => {
    expect(parseDecimal('1.5', 'en-GB')).toBe(1.5);
    expect(parseDecimal('1,234.5', 'en-GB')).toBe(1234.5);
    expect(parseDecimal('1,250', 'en-GB')).toBe(1250);
    expect(parseDecimal('1,5', 'en-GB')).toBe(1.5);
    expect(parseDecimal('0,852', 'en-GB')).toBe(0.852);
    expect(parseDecimal('1.234,5', 'en-GB')).toBe(1234.5);
  });

  it('when the text is empty or not a number, then null or NaN', () => {
    expect(parseDecimal('  ', 'en-GB')).toBeNull();
    expect(parseDecimal('abc', 'de-DE')).toBeNaN();
    expect(parseDecimal('1,2,3', 'en-GB')).toBeNaN();
    expect(parseDecimal('1.2.3,4', 'de-DE')).toBeNaN();
    expect(parseDecimal('-2,5', 'de-DE')).toBe(-2.5);
  });
});
