import { describe, expect, it } from 'vitest';
import {
  checkTemperatureWindow,
  currentStepAt,
  deviationOf,
  formatMinutes,
  temperatureWindowText,
  type TimelineEvent,
  type TimelineStep,
} from './timeline';

const step = (over: Partial<TimelineStep> = {}): TimelineStep => ({
  durationMinutes: null,
  temperatureLowC: null,
  temperatureHighC: null,
  holdPoint: null,
  ...over,
});
const at = (minutes: number) =>
  new Date(Date.UTC(2026, 10, 2, 9, 0) + minutes * 60_000).toISOString();

describe('temperature windows', () => {
  it('when a reading is on either end of the window, then it is inside', () => {
    const window = { temperatureLowC: 5, temperatureHighC: 7 };
    expect(checkTemperatureWindow(5, window)).toEqual({ inside: true });
    expect(checkTemperatureWindow(7, window)).toEqual({ inside: true });
    expect(checkTemperatureWindow(4.9, window)).toEqual({ inside: false, side: 'below', byC: 0.1 });
    expect(checkTemperatureWindow(9.25, window)).toEqual({
      inside: false,
      side: 'above',
      byC: 2.3,
    });
  });

  it('when an end is open, then it does not limit', () => {
    expect(
      checkTemperatureWindow(-40, { temperatureLowC: null, temperatureHighC: 30 }).inside,
    ).toBe(true);
    expect(checkTemperatureWindow(31, { temperatureLowC: null, temperatureHighC: 30 })).toEqual({
      inside: false,
      side: 'above',
      byC: 1,
    });
    expect(
      checkTemperatureWindow(500, { temperatureLowC: null, temperatureHighC: null }).inside,
    ).toBe(true);
  });

  it('names the window in words', () => {
    expect(temperatureWindowText({ temperatureLowC: 5, temperatureHighC: 7 })).toBe('5–7 °C');
    expect(temperatureWindowText({ temperatureLowC: null, temperatureHighC: 30 })).toBe(
      'at most 30 °C',
    );
    expect(temperatureWindowText({ temperatureLowC: 60, temperatureHighC: null })).toBe(
      'at least 60 °C',
    );
    expect(temperatureWindowText({ temperatureLowC: null, temperatureHighC: null })).toBeNull();
  });
});

describe('deviations', () => {
  const steps = [
    step({ temperatureLowC: 0, temperatureHighC: 5, durationMinutes: 30 }),
    step({ holdPoint: 'the solid has all dissolved' }),
    step({ durationMinutes: 240 }),
  ];

  it('when a reading is outside its step window, then it is a deviation naming the window', () => {
    const deviation = deviationOf(
      { kind: 'reading', at: at(10), stepIndex: 0, temperatureC: 8 },
      [],
      steps,
    );
    expect(deviation).toEqual({
      reason: 'reading-outside-window',
      stepIndex: 0,
      message: '8 °C is 3 °C above the window of step 1 (0–5 °C)',
    });
    expect(
      deviationOf({ kind: 'reading', at: at(10), stepIndex: 0, temperatureC: 4 }, [], steps),
    ).toBeNull();
  });

  it('when a step is ended before its duration, then it is a deviation; at the duration it is not', () => {
    const started: TimelineEvent[] = [{ kind: 'step-start', at: at(0), stepIndex: 0 }];
    expect(
      deviationOf({ kind: 'step-end', at: at(12), stepIndex: 0 }, started, steps),
    ).toMatchObject({
      reason: 'step-ended-early',
      message: 'step 1 was ended after 12 min of its 30 min',
    });
    expect(deviationOf({ kind: 'step-end', at: at(30), stepIndex: 0 }, started, steps)).toBeNull();
  });

  it('when a timer is stopped early, then it is a deviation timed from the timer start', () => {
    const earlier: TimelineEvent[] = [
      { kind: 'step-start', at: at(0), stepIndex: 2 },
      { kind: 'timer-start', at: at(60), stepIndex: 2 },
    ];
    expect(
      deviationOf({ kind: 'timer-end', at: at(240), stepIndex: 2 }, earlier, steps),
    ).toMatchObject({
      reason: 'timer-ended-early',
      message: 'the timer of step 3 was stopped after 3 h of its 4 h',
    });
  });

  it('when a later step starts before a hold point is confirmed, then the holding step is named', () => {
    const earlier: TimelineEvent[] = [{ kind: 'step-start', at: at(0), stepIndex: 1 }];
    expect(
      deviationOf({ kind: 'step-start', at: at(5), stepIndex: 2 }, earlier, steps),
    ).toMatchObject({
      reason: 'hold-point-skipped',
      stepIndex: 1,
    });
    const confirmed = [...earlier, { kind: 'step-end' as const, at: at(4), stepIndex: 1 }];
    expect(
      deviationOf({ kind: 'step-start', at: at(5), stepIndex: 2 }, confirmed, steps),
    ).toBeNull();
  });
});

describe('the current step', () => {
  it('is the latest started and not ended at that time', () => {
    const events: TimelineEvent[] = [
      { kind: 'step-start', at: at(0), stepIndex: 0 },
      { kind: 'step-end', at: at(30), stepIndex: 0 },
      { kind: 'step-start', at: at(31), stepIndex: 1 },
    ];
    expect(currentStepAt(events, at(10))).toBe(0);
    expect(currentStepAt(events, at(30.5))).toBeNull();
    expect(currentStepAt(events, at(40))).toBe(1);
  });
});

describe('minutes in words', () => {
  it('reads as a person would say it', () => {
    expect(formatMinutes(30)).toBe('30 min');
    expect(formatMinutes(240)).toBe('4 h');
    expect(formatMinutes(90)).toBe('1 h 30 min');
    expect(formatMinutes(2.46)).toBe('2.5 min');
  });
});
