/**
 * CAS Registry Numbers: 2 to 7 digits, hyphen, 2 digits, hyphen, 1 check digit. The check
 * digit is the sum of the other digits, taken right to left and multiplied by 1, 2, 3…,
 * modulo 10 (rule as published by CAS). It filters typos; it does not prove the number
 * exists.
 */

/** Outcome of {@link validateCasNumber}. */
export type CasCheck = { valid: true } | { valid: false; reason: string };

const EXAMPLE = '7732-18-5';

/**
 * The check digit for the digits before it, e.g. "10707" -> 3 for 107-07-3.
 * Non-digits are ignored, so "107-07" works too.
 */
export function casCheckDigit(digitsBeforeCheck: string): number {
  const digits = digitsBeforeCheck.replace(/\D/g, '');
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    sum += (i + 1) * Number(digits[digits.length - 1 - i]);
  }
  return sum % 10;
}

/**
 * Check a CAS RN's form and check digit. Surrounding spaces are ignored. Reasons are
 * phrases that fit after the field name, e.g. "check digit should be 5",
 * "needs hyphens, e.g. 7732-18-5", "first group needs 2 to 7 digits".
 */
export function validateCasNumber(cas: string): CasCheck {
  const text = typeof cas === 'string' ? cas.trim() : '';
  if (text === '') return { valid: false, reason: `is empty: write it like ${EXAMPLE}` };
  if (/^\d+$/.test(text)) {
    const formatted = formatCasNumber(text);
    return { valid: false, reason: `needs hyphens, e.g. ${formatted ?? EXAMPLE}` };
  }
  if (/[^\d-]/.test(text)) {
    return {
      valid: false,
      reason: `may contain only digits and hyphens, e.g. ${EXAMPLE}`,
    };
  }
  const groups = text.split('-');
  if (groups.length !== 3) {
    return {
      valid: false,
      reason: `needs three groups joined by two hyphens, e.g. ${EXAMPLE}`,
    };
  }
  const [first = '', second = '', check = ''] = groups;
  if (first.length < 2 || first.length > 7) {
    return { valid: false, reason: 'first group needs 2 to 7 digits' };
  }
  if (first.startsWith('0')) {
    return { valid: false, reason: 'first group cannot start with 0' };
  }
  if (second.length !== 2) return { valid: false, reason: 'middle group needs 2 digits' };
  if (check.length !== 1) return { valid: false, reason: 'last group is a single check digit' };
  const expected = casCheckDigit(first + second);
  if (Number(check) !== expected) {
    return { valid: false, reason: `check digit should be ${expected}` };
  }
  return { valid: true };
}

/** True when {@link validateCasNumber} accepts the number. */
export function isValidCasNumber(cas: string): boolean {
  return validateCasNumber(cas).valid;
}

/**
 * Put a CAS RN into its hyphenated form: "7732185" -> "7732-18-5", " 64-17-5 " ->
 * "64-17-5". Spaces and hyphens in the input are ignored. Returns null when the digits
 * cannot form a valid number (wrong length or wrong check digit).
 */
export function formatCasNumber(input: string): string | null {
  const compact = String(input).replace(/[\s-]/g, '');
  if (!/^\d{5,10}$/.test(compact)) return null;
  const formatted = `${compact.slice(0, -3)}-${compact.slice(-3, -1)}-${compact.slice(-1)}`;
  return validateCasNumber(formatted).valid ? formatted : null;
}
