import { decimalMarkOf } from '@lotwise/shared';
import { readerLocale } from './format';

/** Which of the marks in `text` is the decimal mark; null when they only group thousands. */
function decimalMarkIn(text: string, marks: string[], localeMark: string): string | null {
  const last = marks.at(-1)!;
  // Both marks: the last one is the decimal mark (1,234.5 and 1.234,5 read alike).
  if (marks.some((m) => m !== last)) return last;
  // The same mark more than once only groups (1,234,567).
  if (marks.length > 1) return null;
  if (last === localeMark) return last;
  // The other mark alone: three digits after a non-zero whole part group thousands, the way
  // the locale writes them (1,250 in en); anything else is a decimal (1,5 in en; 0,852).
  return /^-?[1-9]\d{0,2}[.,]\d{3}$/.test(text) ? null : last;
}

/**
 * A number typed by a person, in their locale (the browser's when not given): `1.234,5` in
 * de-DE and `1,234.5` in en-GB are both 1234.5; `1,5` is 1.5 in both. Spaces, including the
 * no-break spaces some locales group with, are ignored. Empty text is `null`; anything else
 * that is not a finite number is `NaN`, so the form can say so.
 *
 * Ambiguous text is read as the locale writes it: `1,250` is 1250 in en-GB and 1.25 in de-DE,
 * `1.250` is 1.25 in en-GB and 1250 in de-DE. A single mark followed by other than three
 * digits is always a decimal mark (`1.5` and `1,5` are 1.5 everywhere).
 */
export function parseDecimal(
  text: string | null | undefined,
  locale: string = readerLocale(),
): number | null {
  const trimmed = (text ?? '').replace(/[\s\u00a0\u202f]+/g, '').replace(/^\u2212/, '-');
  if (trimmed === '') return null;
  const marks = trimmed.match(/[.,]/g) ?? [];
  let normalized = trimmed;
  if (marks.length > 0) {
    const decimal = decimalMarkIn(trimmed, marks, decimalMarkOf(locale));
    const cut = decimal === null ? -1 : trimmed.lastIndexOf(decimal);
    const whole = cut < 0 ? trimmed : trimmed.slice(0, cut);
    const fraction = cut < 0 ? null : trimmed.slice(cut + 1);
    const groups = whole.split(/[.,]/);
    // Grouped thousands: 1 to 3 digits first, then groups of exactly 3.
    const grouped = groups.every((g, i) => (i === 0 ? /^-?\d{1,3}$/.test(g) : /^\d{3}$/.test(g)));
    if (groups.length > 1 && !grouped) return Number.NaN;
    normalized = groups.join('') + (fraction === null ? '' : `.${fraction}`);
  }
  if (!/^-?(\d+(\.\d*)?|\.\d+)$/.test(normalized)) return Number.NaN;
  const value = Number(normalized);
  return Number.isFinite(value) ? value : Number.NaN;
}
