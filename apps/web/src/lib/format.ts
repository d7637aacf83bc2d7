/**
 * Formatting of numbers and dates for screens: the web app's entry to the one rule in
 * `@lotwise/shared` (format.ts), which the server's messages use too. Amounts always carry
 * their unit; callers put them in a `tabular-nums` element so columns line up.
 */
import {
  formatDate as formatSharedDate,
  formatDateTime as formatSharedDateTime,
  formatDecimal,
  formatNumber,
  formatQuantity,
  formatTake,
} from '@lotwise/shared';

/**
 * An amount in the unit it is recorded in, at balance-like precision: `250` g ->
 * `250.00 g`, `0.852` mL -> `0.852 mL`, `2698.471` mL -> `2,698.47 mL`.
 */
export function formatAmount(value: number | null | undefined, unit: string): string {
  return formatQuantity(value, unit);
}

/** What to take from a container: never more than it holds (`all (34.95 mL)` when emptied). */
export function formatTakeAmount(take: number, holds: number, unit: string): string {
  return formatTake(take, holds, unit);
}

/** Molar mass in g/mol with two decimals, e.g. `180.16 g/mol`. */
export function formatMolarMass(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatNumber(value, 2)} g/mol`;
}

export function formatDensity(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatNumber(value, 3)} g/mL`;
}

export function formatPercent(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatDecimal(value, 2)} %`;
}

export function formatCount(value: number): string {
  return formatNumber(value, 0);
}

/** A calendar date in the reader's locale, e.g. `3 Dec 2025`; `YYYY-MM-DD` never shifts a day. */
export function formatDate(value: string | Date | null | undefined, locale?: string): string {
  return formatSharedDate(value, { locale });
}

/** Date and time in the reader's locale and time zone, e.g. `3 Dec 2025, 14:05`. */
export function formatDateTime(value: string | Date | null | undefined, locale?: string): string {
  return formatSharedDateTime(value, { locale });
}
