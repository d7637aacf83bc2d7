/**
 * The rules a run's timeline is checked against while a preparation is under way: is a
 * temperature inside the step's window, was a step ended before its time, was a hold point
 * passed without being confirmed. Pure functions: the server flags what it stores, and the
 * bench page flags an entry the same way while it waits offline to be sent.
 */

/** A step of a procedure as the timeline rules need it. */
export interface TimelineStep {
  /** How long the step lasts, minutes (not scaled with the batch); null: no set time. */
  durationMinutes: number | null;
  /** The window the mixture is kept in, °C; either end may be open (null). */
  temperatureLowC: number | null;
  temperatureHighC: number | null;
  /** "Do not go on until …": a later step must not start before this one is ended. */
  holdPoint: string | null;
}

export const TIMELINE_KINDS = [
  'reading',
  'note',
  'photo',
  'step-start',
  'step-end',
  'timer-start',
  'timer-end',
] as const;
export type TimelineKind = (typeof TIMELINE_KINDS)[number];

/** One entry of a run's timeline as the rules read it. */
export interface TimelineEvent {
  kind: TimelineKind;
  /** When it happened (ISO 8601), not when it reached the server. */
  at: string;
  stepIndex: number | null;
  temperatureC?: number | null;
}

export type WindowCheck =
  | { inside: true }
  | { inside: false; side: 'below' | 'above'; /** How far outside, °C (> 0). */ byC: number };

/**
 * Whether a temperature is inside a window. The ends belong to the window ("5 to 7 °C"
 * includes 5 and 7); an open end (null) does not limit.
 */
export function checkTemperatureWindow(
  temperatureC: number,
  window: { temperatureLowC: number | null; temperatureHighC: number | null },
): WindowCheck {
  const { temperatureLowC: low, temperatureHighC: high } = window;
  if (low !== null && temperatureC < low) {
    return { inside: false, side: 'below', byC: roundTenth(low - temperatureC) };
  }
  if (high !== null && temperatureC > high) {
    return { inside: false, side: 'above', byC: roundTenth(temperatureC - high) };
  }
  return { inside: true };
}

/** "5–7 °C", "at most 30 °C", "at least 60 °C"; null when the step has no window. */
export function temperatureWindowText(window: {
  temperatureLowC: number | null;
  temperatureHighC: number | null;
}): string | null {
  const { temperatureLowC: low, temperatureHighC: high } = window;
  if (low !== null && high !== null) return `${formatC(low)}–${formatC(high)} °C`;
  if (high !== null) return `at most ${formatC(high)} °C`;
  if (low !== null) return `at least ${formatC(low)} °C`;
  return null;
}

export const DEVIATION_REASONS = [
  'reading-outside-window',
  'step-ended-early',
  'timer-ended-early',
  'hold-point-skipped',
] as const;
export type DeviationReason = (typeof DEVIATION_REASONS)[number];

export interface Deviation {
  reason: DeviationReason;
  /** The step the deviation is about (for a skipped hold point: the step holding). */
  stepIndex: number;
  /** In words, with the window or the time it is measured against. */
  message: string;
}

/** Minutes between two ISO instants (b − a). */
export function minutesBetween(a: string, b: string): number {
  return (Date.parse(b) - Date.parse(a)) / 60_000;
}

/**
 * The step under way at `at`: the latest step started at or before `at` that was not
 * ended before `at`; null when none is.
 */
export function currentStepAt(events: readonly TimelineEvent[], at: string): number | null {
  const time = Date.parse(at);
  const ordered = events
    .filter((event) => event.stepIndex !== null && Date.parse(event.at) <= time)
    .filter((event) => event.kind === 'step-start' || event.kind === 'step-end')
    .sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
  const open = new Set<number>();
  let latest: number | null = null;
  for (const event of ordered) {
    if (event.kind === 'step-start') {
      open.add(event.stepIndex!);
      latest = event.stepIndex;
    } else {
      open.delete(event.stepIndex!);
      if (latest === event.stepIndex) latest = null;
    }
  }
  if (latest !== null) return latest;
  const stillOpen = [...open];
  return stillOpen.length ? stillOpen[stillOpen.length - 1]! : null;
}

/**
 * The deviation a new entry makes, judged against the entries before it and the
 * procedure's steps; null when it keeps to the procedure.
 *
 * - a reading outside its step's temperature window;
 * - a step ended, or its timer stopped, before the step's duration had passed (timed from
 *   the step's latest start, or the timer's latest start);
 * - a step started while an earlier step with a hold point was started and not yet ended,
 *   or never started at all.
 */
export function deviationOf(
  entry: TimelineEvent,
  earlier: readonly TimelineEvent[],
  steps: readonly TimelineStep[],
): Deviation | null {
  const stepIndex = entry.stepIndex;
  if (stepIndex === null || stepIndex < 0 || stepIndex >= steps.length) return null;
  const step = steps[stepIndex]!;
  const label = `step ${stepIndex + 1}`;

  if (entry.kind === 'reading' && entry.temperatureC !== null && entry.temperatureC !== undefined) {
    const check = checkTemperatureWindow(entry.temperatureC, step);
    if (check.inside) return null;
    return {
      reason: 'reading-outside-window',
      stepIndex,
      message: `${formatC(entry.temperatureC)} °C is ${formatC(check.byC)} °C ${check.side} the window of ${label} (${temperatureWindowText(step)})`,
    };
  }

  if ((entry.kind === 'step-end' || entry.kind === 'timer-end') && step.durationMinutes !== null) {
    const startKind = entry.kind === 'step-end' ? 'step-start' : 'timer-start';
    const start = latestBefore(earlier, entry.at, (event) => {
      return event.kind === startKind && event.stepIndex === stepIndex;
    });
    if (!start) return null;
    const elapsed = minutesBetween(start.at, entry.at);
    // Half a minute of slack: a person taps "done" as the alarm rings.
    if (elapsed >= step.durationMinutes - 0.5) return null;
    const what =
      entry.kind === 'step-end' ? `${label} was ended` : `the timer of ${label} was stopped`;
    return {
      reason: entry.kind === 'step-end' ? 'step-ended-early' : 'timer-ended-early',
      stepIndex,
      message: `${what} after ${formatMinutes(elapsed)} of its ${formatMinutes(step.durationMinutes)}`,
    };
  }

  if (entry.kind === 'step-start') {
    for (let index = 0; index < stepIndex; index += 1) {
      const holding = steps[index]!;
      if (!holding.holdPoint) continue;
      const ended = latestBefore(earlier, entry.at, (event) => {
        return event.kind === 'step-end' && event.stepIndex === index;
      });
      if (ended) continue;
      return {
        reason: 'hold-point-skipped',
        stepIndex: index,
        message: `step ${stepIndex + 1} was started before the hold point of step ${index + 1} was confirmed ("${holding.holdPoint}")`,
      };
    }
  }
  return null;
}

function latestBefore(
  events: readonly TimelineEvent[],
  at: string,
  match: (event: TimelineEvent) => boolean,
): TimelineEvent | undefined {
  const time = Date.parse(at);
  let found: TimelineEvent | undefined;
  for (const event of events) {
    if (!match(event) || Date.parse(event.at) > time) continue;
    if (!found || Date.parse(event.at) >= Date.parse(found.at)) found = event;
  }
  return found;
}

function roundTenth(value: number) {
  return Math.round(value * 10) / 10;
}

function formatC(value: number) {
  return String(roundTenth(value));
}

/** "30 min", "4 h", "1 h 30 min", "12.5 min" (below 10 min, to the tenth). */
export function formatMinutes(minutes: number): string {
  const whole = minutes < 10 ? roundTenth(minutes) : Math.round(minutes);
  if (whole < 60) return `${whole} min`;
  const hours = Math.floor(whole / 60);
  const rest = Math.round(whole - hours * 60);
  return rest ? `${hours} h ${rest} min` : `${hours} h`;
}
