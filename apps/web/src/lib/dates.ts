/**
 * Calendar-date arithmetic for screens. Dates are `YYYY-MM-DD` strings as the API sends them;
 * "today" is the UTC date, as on the server, so a list and its filter agree.
 */

const dayMs = 86_400_000;

function utcDay(iso: string): number {
  const [year, month, day] = iso.slice(0, 10).split('-').map(Number);
  return Date.UTC(year!, month! - 1, day!);
}

/** Today (UTC) as `YYYY-MM-DD`. */
export function todayIsoDate(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** Whole days from `from` to `to`: positive when `to` is later. */
export function daysBetween(from: string, to: string): number {
  return Math.round((utcDay(to) - utcDay(from)) / dayMs);
}

/** Days from today to the last day of this month (0 on the last day). */
export function daysLeftInMonth(now: Date = new Date()): number {
  const end = Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + 1, 0);
  return daysBetween(todayIsoDate(now), new Date(end).toISOString().slice(0, 10));
}

/** "today", "tomorrow", "in 5 days", "yesterday", "12 days ago". */
export function relativeDays(days: number): string {
  if (days === 0) return 'today';
  if (days === 1) return 'tomorrow';
  if (days === -1) return 'yesterday';
  return days > 0 ? `in ${days} days` : `${-days} days ago`;
}
