import { z } from 'zod';

const isoDatePattern = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True for a real calendar date written YYYY-MM-DD. */
export function isIsoDate(text: string): boolean {
  const match = isoDatePattern.exec(text);
  if (!match) return false;
  const date = new Date(Date.UTC(+match[1]!, +match[2]! - 1, +match[3]!));
  return date.getUTCDate() === +match[3]! && date.getUTCMonth() === +match[2]! - 1;
}

/** A calendar date such as `2026-03-01` (no time, no zone). */
export const isoDateSchema = z
  .string()
  .trim()
  .refine(isIsoDate, 'must be a date written YYYY-MM-DD, e.g. 2026-03-01');

/** Today's date (UTC) as YYYY-MM-DD. */
export function todayIso(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}
