/**
 * Formatting of numbers and dates for screens. Amounts always carry their unit; callers put
 * them in a `tabular-nums` element so columns line up.
 */

const decimalsByUnit: Record<string, number> = {
  g: 2,
  mg: 1,
  kg: 3,
  µg: 0,
  mL: 2,
  L: 3,
  µL: 0,
  mol: 4,
  mmol: 2,
};

function number(value: number, decimals: number): string {
  return new Intl.NumberFormat('en', {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  }).format(value);
}

/** `250` + `g` -> `250.00 g` (balance-like precision per unit). */
export function formatAmount(value: number | null | undefined, unit: string): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  return `${number(value, decimalsByUnit[unit] ?? 2)} ${unit}`;
}

/** Molar mass in g/mol with two decimals, e.g. `180.16 g/mol`. */
export function formatMolarMass(value: number | null | undefined): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  return `${number(value, 2)} g/mol`;
}

export function formatDensity(value: number | null | undefined): string {
  if (value === null || value === undefined) return '—';
  return `${number(value, 3)} g/mL`;
}

export function formatPercent(value: number | null | undefined): string {
  if (value === null || value === undefined) return '—';
  return `${new Intl.NumberFormat('en', { maximumFractionDigits: 2 }).format(value)} %`;
}

export function formatCount(value: number): string {
  return new Intl.NumberFormat('en').format(value);
}

function toDate(value: string | Date): Date | null {
  const date = typeof value === 'string' ? new Date(value) : value;
  return Number.isNaN(date.getTime()) ? null : date;
}

/** A calendar date in the reader's locale, e.g. `3 Dec 2025`. */
export function formatDate(value: string | Date | null | undefined, locale?: string): string {
  if (!value) return '—';
  const date = toDate(value);
  return date ? new Intl.DateTimeFormat(locale, { dateStyle: 'medium' }).format(date) : '—';
}

/** Date and time in the reader's locale, e.g. `3 Dec 2025, 14:05`. */
export function formatDateTime(value: string | Date | null | undefined, locale?: string): string {
  if (!value) return '—';
  const date = toDate(value);
  return date
    ? new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(date)
    : '—';
}
