import { formatDecimal } from '@lotwise/shared';
import { formatTime, readerLocale } from '../../../lib/format';

/** The time of day in the reader's locale, e.g. `09:14`. */
export function formatClock(at: string | Date): string {
  return formatTime(at);
}

/** A temperature as read at the bench, to the tenth: `6.4 °C` (`6,4 °C` in de-DE). */
export function formatTemperature(celsius: number): string {
  return `${formatDecimal(celsius, 1, readerLocale())} °C`;
}

/** The value for an `<input type="datetime-local">` showing `at` in the device's time zone. */
export function toLocalInputValue(at: Date): string {
  const local = new Date(at.getTime() - at.getTimezoneOffset() * 60_000);
  return local.toISOString().slice(0, 16);
}
