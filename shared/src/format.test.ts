import { describe, expect, it } from 'vitest';
import {
  countOf,
  formatBytes,
  formatDate,
  formatDateTime,
  formatFullPrecision,
  formatNumber,
  formatQuantity,
  formatRounded,
  formatTake,
  formatTime,
  plainNumber,
  quantityDecimals,
} from './format';

describe('formatQuantity', () => {
  it('when an amount is shown, then it stays in its own unit and is never rescaled', () => {
    expect(formatQuantity(0.852, 'mL')).toBe('0.852 mL');
    expect(formatQuantity(1000, 'mL')).toBe('1,000.00 mL');
    expect(formatQuantity(12345, 'g')).toBe('12,345.00 g');
    expect(formatQuantity(0.25, 'g')).toBe('0.250 g');
  });

  it('when an amount is 1 or more, then a g or mL amount has two decimals and grouped thousands', () => {
    expect(formatQuantity(250, 'g')).toBe('250.00 g');
    expect(formatQuantity(7698, 'mL')).toBe('7,698.00 mL');
    expect(formatQuantity(2698.471, 'mL')).toBe('2,698.47 mL');
    expect(formatQuantity(34.947, 'mL')).toBe('34.95 mL');
  });

  it('when an amount is below 1, then it keeps 3 significant figures down to the unit finest step', () => {
    expect(formatQuantity(0.85201, 'mL')).toBe('0.852 mL');
    expect(formatQuantity(0.0523, 'g')).toBe('0.0523 g');
    expect(formatQuantity(0.00012, 'g')).toBe('0.0001 g'); // finest 0.1 mg
    expect(formatQuantity(0.0004, 'mL')).toBe('0.00 mL'); // below the finest 1 µL: reads as zero
    expect(formatQuantity(0.9996, 'g')).toBe('1.00 g');
  });

  it('when other units are shown, then each has its own balance-like decimals', () => {
    expect(formatQuantity(2.5, 'kg')).toBe('2.500 kg');
    expect(formatQuantity(12.34, 'mg')).toBe('12.3 mg');
    expect(formatQuantity(9.5214, 'mmol')).toBe('9.52 mmol');
    expect(formatQuantity(1.5, 'pieces')).toBe('1.50 pieces');
  });

  it('when a value is zero, negative or missing, then it reads plainly', () => {
    expect(formatQuantity(0, 'g')).toBe('0.00 g');
    expect(formatQuantity(-0.0000001, 'g')).toBe('0.00 g');
    expect(formatQuantity(-12.5, 'mL')).toBe('-12.50 mL');
    expect(formatQuantity(12.5, 'mL', { sign: 'always' })).toBe('+12.50 mL');
    expect(formatQuantity(null, 'g')).toBe('—');
    expect(formatQuantity(Number.NaN, 'g')).toBe('—');
    expect(formatQuantity(Number.POSITIVE_INFINITY, 'g')).toBe('—');
  });

  it('when rounding down, then the text is never more than the value', () => {
    expect(formatQuantity(34.947, 'mL', { rounding: 'down' })).toBe('34.94 mL');
    expect(formatQuantity(0.29, 'g', { rounding: 'down' })).toBe('0.290 g');
    expect(formatQuantity(2.29, 'g', { rounding: 'down' })).toBe('2.29 g');
  });

  it('when decimals are given by a measuring rule, then they are used with the same grouping', () => {
    expect(formatQuantity(7698, 'mL', { decimals: 0 })).toBe('7,698 mL');
    expect(formatRounded({ value: 12.5, unit: 'mL', decimals: 1 })).toBe('12.5 mL');
  });

  it('when the decimals are asked for, then they follow the size of the amount', () => {
    expect(quantityDecimals(34.947, 'g')).toBe(2);
    expect(quantityDecimals(0.852, 'mL')).toBe(3);
    expect(quantityDecimals(0.0523, 'g')).toBe(4);
  });
});

describe('formatTake', () => {
  it('when a part of a container is taken, then the take is rounded down, never above the content', () => {
    expect(formatTake(34.947 - 0.0005, 34.947, 'mL')).toBe('34.94 mL');
    expect(formatTake(10, 34.947, 'mL')).toBe('10.00 mL');
  });

  it('when a container is emptied, then the sheet says all and shows its content', () => {
    expect(formatTake(34.947, 34.947, 'mL')).toBe('all (34.95 mL)');
    expect(formatTake(34.947 + 1e-12, 34.947, 'mL')).toBe('all (34.95 mL)');
  });

  it('when any take is at most its content, then its number is at most the content', () => {
    for (const holds of [0.85201, 1.005, 2.999, 34.947, 99.995, 2698.475]) {
      for (const share of [0.1, 0.5, 0.9, 0.9999]) {
        const text = formatTake(holds * share, holds, 'mL');
        expect(Number(text.replace(/[^0-9.]/g, ''))).toBeLessThanOrEqual(holds);
      }
    }
  });
});

describe('plain and full-precision numbers', () => {
  it('when a number is written for a data file, then it has no grouping and no float noise', () => {
    expect(plainNumber(2698.47)).toBe('2698.47');
    expect(plainNumber(0.1 + 0.2)).toBe('0.3');
    expect(plainNumber(0.85201)).toBe('0.85201');
  });

  it('when a number is shown at full precision, then it has 6 significant figures', () => {
    expect(formatFullPrecision(0.852013)).toBe('0.852013');
    expect(formatFullPrecision(1 / 3)).toBe('0.333333');
    expect(formatNumber(1234.5, 1)).toBe('1,234.5');
  });
});

describe('formatDate', () => {
  it('when a calendar date is shown, then it is that day in every time zone', () => {
    expect(formatDate('2026-03-01', { locale: 'en-GB' })).toBe('1 Mar 2026');
    expect(formatDate('2026-03-01', { locale: 'en-US', timeZone: 'America/Los_Angeles' })).toBe(
      'Mar 1, 2026',
    );
    expect(formatDate('2026-03-01', { locale: 'de-DE' })).toBe('01.03.2026');
  });

  it('when a date-time is shown, then it is the day and time in the given zone', () => {
    const at = '2026-03-01T23:30:00.000Z';
    expect(formatDate(at, { locale: 'en-GB', timeZone: 'UTC' })).toBe('1 Mar 2026');
    expect(formatDate(at, { locale: 'en-GB', timeZone: 'Europe/Berlin' })).toBe('2 Mar 2026');
    expect(formatDateTime(at, { locale: 'en-GB', timeZone: 'UTC' })).toBe('1 Mar 2026, 23:30');
    expect(formatDateTime(at, { locale: 'en-GB', timeZone: 'UTC', showZone: true })).toBe(
      '1 Mar 2026, 23:30 UTC',
    );
  });

  it('when there is no date or it is not one, then a dash shows', () => {
    expect(formatDate(null)).toBe('—');
    expect(formatDate('soon')).toBe('—');
    expect(formatDateTime(undefined)).toBe('—');
    expect(formatTime('soon')).toBe('—');
  });

  it('when only the time of day is shown, then it is in the locale and time zone asked for', () => {
    const at = '2026-03-01T23:30:00Z';
    expect(formatTime(at, { locale: 'en-GB', timeZone: 'UTC' })).toBe('23:30');
    expect(formatTime(at, { locale: 'en-GB', timeZone: 'Europe/Berlin' })).toBe('00:30');
  });
});

describe('formatBytes', () => {
  it('when a file size is shown, then it is in binary units with one decimal, bytes below 1 KiB', () => {
    // common practice, no source: 1 KiB = 1024 bytes (IEC binary prefixes)
    expect(formatBytes(512)).toBe('512 bytes');
    expect(formatBytes(520192)).toBe('508.0 KiB');
    expect(formatBytes(5 * 1024 * 1024 + 104858)).toBe('5.1 MiB');
    expect(formatBytes(3 * 1024 ** 3)).toBe('3.0 GiB');
  });
});

describe('countOf', () => {
  it('when there is one, then the noun is singular; otherwise plural', () => {
    // English plural rules (CLDR "one" for 1 only) // common practice, no source
    expect(countOf(1, 'condition')).toBe('1 condition');
    expect(countOf(21, 'condition')).toBe('21 conditions');
    expect(countOf(0, 'e-mail')).toBe('0 e-mails');
    expect(countOf(2, 'plan or run', 'plans or runs')).toBe('2 plans or runs');
    expect(countOf(1200, 'container')).toBe('1,200 containers');
  });
});
