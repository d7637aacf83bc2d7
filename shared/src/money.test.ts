import { describe, expect, it } from 'vitest';
import {
  currencyDigits,
  decimalTextToMinor,
  formatMoney,
  isCurrencyCode,
  minorToDecimalText,
} from './money';

describe('money', () => {
  it('when a currency is named, then its minor-unit digits follow ISO 4217', () => {
    // ISO 4217 list one: EUR 2, JPY 0, KWD 3 minor-unit digits
    expect(currencyDigits('EUR')).toBe(2);
    expect(currencyDigits('JPY')).toBe(0);
    expect(currencyDigits('KWD')).toBe(3);
    expect(isCurrencyCode('EUR')).toBe(true);
    expect(isCurrencyCode('EURO')).toBe(false);
    expect(isCurrencyCode('eur')).toBe(false);
  });

  it('when minor units are written, then every cent is kept, even beyond float precision', () => {
    expect(formatMoney(123456, 'EUR', 'en-GB')).toBe('€1,234.56');
    expect(formatMoney(123456, 'EUR', 'de-DE')).toBe('1.234,56\u00a0€');
    expect(formatMoney(5, 'EUR', 'en-GB')).toBe('€0.05');
    expect(formatMoney(-250, 'EUR', 'en-GB')).toBe('-€2.50');
    expect(formatMoney(1234, 'JPY', 'en-GB')).toBe('JP¥1,234');
    expect(formatMoney(9007199254740991, 'EUR', 'en-GB')).toBe('€90,071,992,547,409.91');
  });

  it('when amounts are exported or typed, then decimal text and minor units convert exactly', () => {
    expect(minorToDecimalText(123456, 'EUR')).toBe('1234.56');
    expect(minorToDecimalText(7, 'EUR')).toBe('0.07');
    expect(minorToDecimalText(-7, 'EUR')).toBe('-0.07');
    expect(decimalTextToMinor('12.5', 'EUR')).toBe(1250);
    expect(decimalTextToMinor('0,07', 'EUR')).toBe(7);
    expect(decimalTextToMinor('19.999', 'EUR')).toBeNull();
    expect(decimalTextToMinor('abc', 'EUR')).toBeNull();
    expect(decimalTextToMinor('1200', 'JPY')).toBe(1200);
  });
});
