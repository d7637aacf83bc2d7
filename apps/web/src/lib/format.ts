/**
 * Formatting of numbers and dates for screens: the web app's entry to the one rule in
 * `@lotwise/shared` (format.ts), in the reader's locale (the browser's first language), so a
 * German browser reads `1,50 g` and `3. Dez. 2026`. Amounts always carry their unit; callers
 * put them in a `tabular-nums` element so columns line up.
 */
import {
  formatDate as formatSharedDate,
  formatDateTime as formatSharedDateTime,
  formatDecimal,
  formatNumber,
  formatQuantity,
  formatRounded,
  formatTake,
  formatTime as formatSharedTime,
} from '@lotwise/shared';

/** The reader's locale: the browser's first language, `en` when it names none. */
export function readerLocale(): string {
  const preferred =
    typeof navigator === 'undefined' ? undefined : (navigator.languages?.[0] ?? navigator.language);
  try {
    return preferred ? Intl.getCanonicalLocales(preferred)[0]! : 'en';
  } catch {
    return 'en';
  }
}

/**
 * An amount in the unit it is recorded in, at balance-like precision: `250` g ->
 * `250.00 g` (`250,00 g` in de-DE), `0.852` mL -> `0.852 mL`, `2698.471` mL -> `2,698.47 mL`.
 */
export function formatAmount(
  value: number | null | undefined,
  unit: string,
  locale = readerLocale(),
): string {
  return formatQuantity(value, unit, { locale });
}

/** A rounded amount from @lotwise/chem (`DisplayValue`) in the reader's locale. */
export function formatRoundedAmount(
  display: { value: number; unit: string; decimals: number },
  locale = readerLocale(),
): string {
  return formatRounded(display, locale);
}

/** What to take from a container: never more than it holds (`all (34.95 mL)` when emptied). */
export function formatTakeAmount(
  take: number,
  holds: number,
  unit: string,
  locale = readerLocale(),
): string {
  return formatTake(take, holds, unit, locale);
}

/**
 * Litres of liquid against a room limit: one decimal (`15.1 L`, `15,1 L` in de-DE), two below
 * one litre so a small bottle does not read as nothing (`0.04 L`).
 */
export function formatLitres(value: number, locale = readerLocale()): string {
  const small = value !== 0 && Math.abs(value) < 1;
  return `${formatFixed(value, small ? 2 : 1, locale)} L`;
}

/** A number with exactly `decimals` decimals in the reader's locale (`1,234.50`, `1.234,50`). */
export function formatFixed(value: number, decimals: number, locale = readerLocale()): string {
  return formatNumber(value, decimals, 'auto', locale);
}

/** Molar mass in g/mol with two decimals, e.g. `180.16 g/mol`. */
export function formatMolarMass(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatNumber(value, 2, 'auto', readerLocale())} g/mol`;
}

export function formatDensity(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatNumber(value, 3, 'auto', readerLocale())} g/mL`;
}

export function formatPercent(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatDecimal(value, 2, readerLocale())} %`;
}

export function formatCount(value: number): string {
  return formatNumber(value, 0, 'auto', readerLocale());
}

/** A calendar date in the reader's locale, e.g. `3 Dec 2025`; `YYYY-MM-DD` never shifts a day. */
export function formatDate(
  value: string | Date | null | undefined,
  locale = readerLocale(),
): string {
  return formatSharedDate(value, { locale });
}

/** Date and time in the reader's locale and time zone, e.g. `3 Dec 2025, 14:05`. */
export function formatDateTime(
  value: string | Date | null | undefined,
  locale = readerLocale(),
): string {
  return formatSharedDateTime(value, { locale });
}

/** The time of day in the reader's locale and time zone, e.g. `14:05`. */
export function formatTime(
  value: string | Date | null | undefined,
  locale = readerLocale(),
): string {
  return formatSharedTime(value, { locale });
}

/** A temperature in °C with up to one decimal, e.g. `−17.8 °C`; `—` when not recorded. */
export function formatTemperature(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatDecimal(value, 1, readerLocale())} °C`;
}
