import { describe, expect, it } from 'vitest';
import { daysBetween, daysLeftInMonth, relativeDays } from './dates';

describe('dates', () => {
  it('when two calendar dates are compared, then whole days between them come out', () => {
    expect(daysBetween('2026-02-27', '2026-03-01')).toBe(2);
    expect(daysBetween('2026-03-01', '2026-02-27')).toBe(-2);
  });

  it('when the month has days left, then they are counted to its last day', () => {
    expect(daysLeftInMonth(new Date('2026-02-10T12:00:00Z'))).toBe(18);
    expect(daysLeftInMonth(new Date('2026-12-31T08:00:00Z'))).toBe(0);
  });

  it('reads days as words', () => {
    expect(relativeDays(0)).toBe('today');
    expect(relativeDays(5)).toBe('in 5 days');
    expect(relativeDays(-3)).toBe('3 days ago');
  });
});
