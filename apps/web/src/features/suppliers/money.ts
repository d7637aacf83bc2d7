import {
  currencyDigits,
  decimalTextToMinor,
  formatMoney,
  minorToDecimalText,
} from '@lotwise/shared';

/** Minor units in the reader's own locale (the browser's), e.g. €12.50 or 12,50 €. */
export function moneyText(minor: number, currency: string): string {
  return formatMoney(minor, currency, undefined);
}

/** What a money field shows for an amount: plain digits, "12.50". */
export function moneyInputText(minor: number, currency: string): string {
  return minorToDecimalText(minor, currency);
}

/**
 * A typed amount ("12.50", "12,5", "0") to whole minor units; a sentence saying what is
 * wrong when it cannot be read exactly.
 */
export function parseMoneyInput(
  text: string,
  currency: string,
): { minor: number; error: null } | { minor: null; error: string } {
  if (text.trim() === '') return { minor: null, error: 'is required (0 for none)' };
  const minor = decimalTextToMinor(text, currency);
  if (minor === null) {
    return {
      minor: null,
      error: `must be an amount in ${currency} such as 12.50, without currency sign, with at most ${currencyDigits(currency)} decimals`,
    };
  }
  if (minor > 10_000_000_000) return { minor: null, error: 'must be at most 100,000,000.00' };
  return { minor, error: null };
}
