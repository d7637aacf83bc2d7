/**
 * The one way Lotwise writes amounts and dates, for the web app and for everything the server
 * writes (alerts, e-mails, error messages). See docs/decisions.md, "One writing of amounts and
 * dates".
 *
 * - An amount stays in the unit it is recorded in (a container counted in mL always reads in
 *   mL); it is never rescaled to µL or L.
 * - Numbers follow a locale's decimal mark and grouping: the reader's on screen (the web app
 *   passes the browser's), `en` where none is given (text the server writes, messages).
 *   Data files use {@link plainNumber}.
 * - Decimals follow the unit, like a balance: at least the unit's usual decimals and at least 3
 *   significant figures, never finer than the unit's finest step.
 * - Dates are locale-aware: the reader's language on screen, the lab's configured one in text
 *   the server writes.
 */

/** The locale of text the server writes when none is configured. */
export const defaultTextLocale = 'en-GB';

/** Decimals shown per unit: `usual` at least, up to `finest` for 3 significant figures. */
interface UnitPrecision {
  usual: number;
  finest: number;
}

// A top-loading balance reads 0.01 g; small amounts go on an analytical balance (0.1 mg).
// A 1 µL step is the finest a micropipette is read at. // common practice, no source
const precisionByUnit: Record<string, UnitPrecision> = {
  µg: { usual: 0, finest: 1 },
  mg: { usual: 1, finest: 2 },
  g: { usual: 2, finest: 4 },
  kg: { usual: 3, finest: 6 },
  µL: { usual: 1, finest: 2 },
  mL: { usual: 2, finest: 3 },
  L: { usual: 3, finest: 6 },
  µmol: { usual: 1, finest: 2 },
  mmol: { usual: 2, finest: 4 },
  mol: { usual: 3, finest: 6 },
};
const otherUnit: UnitPrecision = { usual: 2, finest: 4 };

/** Significant figures every amount keeps (within its unit's finest step). */
const significantFigures = 3;

function isNumber(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

function decimalsFor(size: number, precision: UnitPrecision): number {
  if (size === 0) return precision.usual;
  const forFigures = significantFigures - 1 - Math.floor(Math.log10(size));
  return Math.min(precision.finest, Math.max(precision.usual, forFigures));
}

/**
 * How many decimals an amount of `unit` is written with: 2 for 34.947 g, 3 for 0.852 mL,
 * 4 for 0.0523 g.
 */
export function quantityDecimals(value: number, unit: string): number {
  const precision = precisionByUnit[unit.trim()] ?? otherUnit;
  const size = Math.abs(value);
  const decimals = decimalsFor(size, precision);
  // 0.9996 g at 3 figures reads 1.000: write it as 1.00, like any other gram amount.
  const rounded = Math.round(size * 10 ** decimals) / 10 ** decimals;
  return rounded === size ? decimals : decimalsFor(rounded, precision);
}

/** Round towards zero at `decimals`, ignoring float noise (0.29 stays 0.29, not 0.28). */
function roundDown(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  const scaled = Math.abs(value) * factor;
  const down = Math.floor(scaled + 1e-9 * Math.max(1, scaled)) / factor;
  return Math.sign(value) * down;
}

const numberFormats = new Map<string, Intl.NumberFormat>();

/** The locale numbers are written in when none is given: a decimal point, comma grouping. */
export const defaultNumberLocale = 'en';

/**
 * A number with exactly `decimals` decimals, grouped thousands, in `locale`:
 * `formatNumber(2698.471, 2)` = `2,698.47`; in `de-DE` `2.698,47`. No "-0".
 */
export function formatNumber(
  value: number,
  decimals: number,
  sign: 'auto' | 'always' = 'auto',
  locale: string = defaultNumberLocale,
) {
  const key = `${locale}|${decimals}|${sign}`;
  let format = numberFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, {
      minimumFractionDigits: decimals,
      maximumFractionDigits: decimals,
      signDisplay: sign === 'always' ? 'exceptZero' : 'negative',
    });
    numberFormats.set(key, format);
  }
  return format.format(value);
}

/** The decimal mark of a locale: `.` in en, `,` in de-DE and fr-FR (for reading typed numbers). */
export function decimalMarkOf(locale: string): string {
  const parts = new Intl.NumberFormat(locale).formatToParts(1.5);
  return parts.find((p) => p.type === 'decimal')?.value ?? '.';
}

/** A number with up to `maxDecimals` decimals, trailing zeros dropped: `114.1`, `1,250`. */
export function formatDecimal(
  value: number,
  maxDecimals: number,
  locale: string = defaultNumberLocale,
): string {
  return new Intl.NumberFormat(locale, {
    maximumFractionDigits: maxDecimals,
    signDisplay: 'negative',
  }).format(value);
}

export interface QuantityFormatOptions {
  /**
   * Fixed decimals instead of the unit's rule: for an amount already rounded to what a
   * balance or a piece of glassware measures (@lotwise/chem `DisplayValue.decimals`).
   */
  decimals?: number;
  /** `down`: never write more than the value (what may still be taken, a limit). */
  rounding?: 'nearest' | 'down';
  /** `always`: a plus sign on positive changes (ledger entries). */
  sign?: 'auto' | 'always';
  /** BCP 47 locale of the decimal mark and grouping; `en` when not given. */
  locale?: string;
}

/**
 * An amount with its unit, in the unit it is recorded in: `formatQuantity(0.852, 'mL')` =
 * `0.852 mL`, `formatQuantity(2698.471, 'mL')` = `2,698.47 mL`, `formatQuantity(250, 'g')` =
 * `250.00 g`. No value gives `—`.
 */
export function formatQuantity(
  value: number | null | undefined,
  unit: string,
  options: QuantityFormatOptions = {},
): string {
  if (!isNumber(value)) return '—';
  const decimals = options.decimals ?? quantityDecimals(value, unit);
  const shown = options.rounding === 'down' ? roundDown(value, decimals) : value;
  return `${formatNumber(shown, decimals, options.sign, options.locale)} ${unit.trim()}`;
}

/** A rounded value from @lotwise/chem (`DisplayValue`) written by the same rule. */
export function formatRounded(
  display: { value: number; unit: string; decimals: number },
  locale?: string,
): string {
  return formatQuantity(display.value, display.unit, { decimals: display.decimals, locale });
}

/** `display` with its `text` written by {@link formatRounded}: for API answers. */
export function withRoundedText<T extends { value: number; unit: string; decimals: number }>(
  display: T,
): T & { text: string } {
  return { ...display, text: formatRounded(display) };
}

/**
 * What to take from a container that holds `holds`: never written larger than the content.
 * Taking it all reads `all (34.95 mL)`, the content as the container's page shows it; a part
 * is rounded down (34.947 -> `34.94 mL`).
 */
export function formatTake(take: number, holds: number, unit: string, locale?: string): string {
  if (!isNumber(take)) return '—';
  const all = isNumber(holds) && take >= holds - 1e-9 * Math.max(1, Math.abs(holds));
  return all
    ? `all (${formatQuantity(holds, unit, { locale })})`
    : formatQuantity(take, unit, { rounding: 'down', locale });
}

/**
 * A number with enough digits to check a hand calculation, without float noise or grouping:
 * 6 significant figures (`0.85201`, `1.5`). For "at full precision" notes and factors.
 */
export function formatFullPrecision(value: number): string {
  if (!isNumber(value)) return '—';
  return String(Number(value.toPrecision(6)));
}

/**
 * A number for data files (CSV): decimal point, no grouping, float noise dropped at a
 * millionth (the finest step a quantity is stored with), so it reads back as the same amount.
 */
export function plainNumber(value: number): string {
  return String(Number(value.toFixed(6)));
}

export interface DateFormatOptions {
  /** BCP 47 locale; the runtime's (the reader's, in a browser) when not given. */
  locale?: string;
  /** IANA time zone for a date-time; the runtime's when not given. */
  timeZone?: string;
}

const calendarDatePattern = /^\d{4}-\d{2}-\d{2}$/;

function toDate(value: string | Date): Date | null {
  const date = typeof value === 'string' ? new Date(value) : value;
  return Number.isNaN(date.getTime()) ? null : date;
}

/**
 * A calendar date in the locale's medium style: `3 Dec 2026` (en-GB), `Dec 3, 2026` (en-US).
 * A `YYYY-MM-DD` date is that day everywhere (never shifted by the reader's time zone); a
 * date-time is the day it is in `timeZone`.
 */
export function formatDate(
  value: string | Date | null | undefined,
  options: DateFormatOptions = {},
): string {
  if (!value) return '—';
  const calendar = typeof value === 'string' && calendarDatePattern.test(value);
  const date = toDate(calendar ? `${value as string}T00:00:00.000Z` : value);
  if (!date) return '—';
  return new Intl.DateTimeFormat(options.locale, {
    dateStyle: 'medium',
    timeZone: calendar ? 'UTC' : options.timeZone,
  }).format(date);
}

/**
 * Date and time in the locale's style: `3 Dec 2026, 09:15`. With `showZone`, the time zone
 * follows (`3 Dec 2026, 09:15 UTC`): for text read away from the screen, such as e-mails.
 */
export function formatDateTime(
  value: string | Date | null | undefined,
  options: DateFormatOptions & { showZone?: boolean } = {},
): string {
  if (!value) return '—';
  const date = toDate(value);
  if (!date) return '—';
  const text = new Intl.DateTimeFormat(options.locale, {
    dateStyle: 'medium',
    timeStyle: 'short',
    timeZone: options.timeZone,
  }).format(date);
  if (!options.showZone) return text;
  const zone = options.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  return `${text} ${zone}`;
}

/** The time of day in the locale's short style: `09:15` (en-GB), `9:15 AM` (en-US). */
export function formatTime(
  value: string | Date | null | undefined,
  options: DateFormatOptions = {},
): string {
  if (!value) return '—';
  const date = toDate(value);
  if (!date) return '—';
  return new Intl.DateTimeFormat(options.locale, {
    timeStyle: 'short',
    timeZone: options.timeZone,
  }).format(date);
}

const byteUnits = ['bytes', 'KiB', 'MiB', 'GiB', 'TiB'] as const;

/**
 * A file size as people read it, in binary units with one decimal: `508.0 KiB`, `1.2 GiB`;
 * under 1 KiB in bytes (`512 bytes`).
 */
export function formatBytes(bytes: number): string {
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < byteUnits.length - 1) {
    value /= 1024;
    unit++;
  }
  return unit === 0
    ? `${formatNumber(bytes, 0)} bytes`
    : `${formatNumber(value, 1)} ${byteUnits[unit]}`;
}

const englishPlurals = new Intl.PluralRules('en');

/**
 * A count with its noun in the right number, for every "N things" Lotwise writes:
 * `countOf(1, 'container')` = `1 container`, `countOf(21, 'condition')` = `21 conditions`,
 * `countOf(2, 'e-mail')` = `2 e-mails`; an irregular plural is given (`countOf(3, 'lot
 * history', 'lot histories')`). The count is grouped like every other number.
 */
export function countOf(count: number, singular: string, plural = `${singular}s`): string {
  const noun = englishPlurals.select(count) === 'one' ? singular : plural;
  return `${formatNumber(count, 0)} ${noun}`;
}
