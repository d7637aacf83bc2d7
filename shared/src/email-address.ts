import { regexes } from 'zod/v4/core';

// The one rule for an e-mail address: the contract's emailSchema is built from it, and a
// form that does not load zod (sign-in, the first page) checks with the same pieces.

export const emailAddressMessage = 'must be an e-mail address such as name@example.test';

/** As the contract stores an address: no surrounding spaces, lower case. */
export function normalizeEmail(value: string): string {
  return value.trim().toLowerCase();
}

/** True for an address the contract accepts (after {@link normalizeEmail}). */
export function isEmailAddress(value: string): boolean {
  return regexes.email.test(value);
}
