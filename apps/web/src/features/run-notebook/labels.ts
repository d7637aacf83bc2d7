import type { DeviationView, TimelineEntry } from '@lotwise/shared';
import { formatDecimal } from '@lotwise/shared';
import { readerLocale } from '../../lib/format';

/** A temperature as Lotwise writes it: `6.5 °C` (`6,5 °C` in de-DE). */
export function formatC(value: number): string {
  return `${formatDecimal(value, 1, readerLocale())} °C`;
}

export const entryKindLabels: Record<TimelineEntry['kind'], string> = {
  reading: 'Reading',
  note: 'Note',
  photo: 'Photo',
  'step-start': 'Step started',
  'step-end': 'Step ended',
  'timer-start': 'Timer started',
  'timer-end': 'Timer stopped',
};

/** What happened, in words: the heading of each deviation. */
export const deviationReasonLabels: Record<DeviationView['reason'], string> = {
  'reading-outside-window': 'Reading outside the window',
  'step-ended-early': 'Step ended before its time',
  'timer-ended-early': 'Timer stopped before its time',
  'hold-point-skipped': 'Hold point passed without confirmation',
};

/** "09:15" in the reader's time zone; with the date when the run spans more than one day. */
export function clockTime(at: string, withDate = false): string {
  return new Intl.DateTimeFormat(readerLocale(), {
    ...(withDate ? { day: 'numeric', month: 'short' } : {}),
    hour: '2-digit',
    minute: '2-digit',
  }).format(new Date(at));
}

/** Whether the entries fall on more than one calendar day (then times carry their date). */
export function spansDays(times: readonly string[]): boolean {
  const days = new Set(times.map((at) => new Date(at).toDateString()));
  return days.size > 1;
}
