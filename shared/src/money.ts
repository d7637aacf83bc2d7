import { z } from 'zod';

/**
 * Money in Lotwise: whole minor units (cents) as integers everywhere — in the database, on the
 * wire and in every calculation — in the one currency the lab is configured with (`CURRENCY`).
 * Only the screen and the texts the server writes turn them into "€12.34" with `formatMoney`.
 */

/** An ISO 4217 code such as EUR, USD, GBP, CHF or JPY, in capitals. */
export const currencyCodeSchema = z
  .string()
  .trim()
  .regex(/^[A-Z]{3}$/, 'must be a three-letter ISO 4217 currency code such as EUR')
  .refine(isCurrencyCode, 'is not a currency this system knows');

/** Whole minor units (cents), 0 or more, at most 100 million in the major unit. */
export const minorAmountSchema = z
  .number({ error: 'must be a whole number of cents' })
  .int('must be a whole number of cents')
  .min(0, 'must be 0 or more')
  .max(10_000_000_000, 'must be at most 100,000,000.00');

export function isCurrencyCode(code: string): boolean {
  if (!/^[A-Z]{3}$/.test(code)) return false;
  try {
    return (
      new Intl.NumberFormat('en', { style: 'currency', currency: code }).resolvedOptions()
        .currency === code
    );
  } catch {
    return false;
  }
}

const digitsCache = new Map<string, number>();

/** Decimals of the currency's minor unit: 2 for EUR, 0 for JPY, 3 for KWD (ISO 4217). */
export function currencyDigits(currency: string): number {
  let digits = digitsCache.get(currency);
  if (digits === undefined) {
    digits =
      new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
        .maximumFractionDigits ?? 2;
    digitsCache.set(currency, digits);
  }
  return digits;
}

/** Minor units as a plain decimal string in the major unit: 123456 EUR -> "1234.56" (CSV). */
export function minorToDecimalText(minor: number, currency: string): string {
  const digits = currencyDigits(currency);
  const sign = minor < 0 ? '-' : '';
  const whole = Math.abs(Math.trunc(minor));
  if (digits === 0) return `${sign}${whole}`;
  const text = String(whole).padStart(digits + 1, '0');
  return `${sign}${text.slice(0, -digits)}.${text.slice(-digits)}`;
}

/**
 * A decimal text in the major unit to minor units, exactly (no float arithmetic): "12.5" EUR
 * -> 1250. Null when the text is not a plain amount or has more decimals than the currency.
 */
export function decimalTextToMinor(text: string, currency: string): number | null {
  const digits = currencyDigits(currency);
  const match = /^\s*(\d{1,12})(?:[.,](\d+))?\s*$/.exec(text);
  if (!match) return null;
  const fraction = match[2] ?? '';
  if (fraction.length > digits) return null;
  return Number(match[1]) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
}

const moneyFormats = new Map<string, Intl.NumberFormat>();

/**
 * Minor units written in the reader's locale: `formatMoney(123456, 'EUR', 'en-GB')` =
 * "€1,234.56", in de-DE "1.234,56 €". Exact: the integer is split into major and minor
 * digits before formatting, so no cent is lost to floating point.
 */
export function formatMoney(minor: number, currency: string, locale?: string): string {
  const key = `${locale ?? ''}|${currency}`;
  let format = moneyFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, { style: 'currency', currency });
    moneyFormats.set(key, format);
  }
  // A decimal string keeps every digit; Intl formats strings exactly (ES2023).
  return format.format(minorToDecimalText(minor, currency) as unknown as number);
}
