import { describe, expect, it } from 'vitest';
import type { TimelineEntry, TimelineStepView } from '@lotwise/shared';
import { benchState, formatCountdown } from './bench-state';
import type { QueuedEntry } from './queue';

function step(index: number, fields: Partial<TimelineStepView> = {}): TimelineStepView {
  return {
    index,
    text: `Step ${index + 1}`,
    durationMinutes: null,
    temperatureLowC: null,
    temperatureHighC: null,
    outsideWindow: '',
    lineIndex: null,
    addition: '',
    caution: null,
    holdPoint: '',
    additionAmount: null,
    additionChemical: null,
    windowText: null,
    startedAt: null,
    endedAt: null,
    ...fields,
  };
}

const steps = [
  step(0, {
    durationMinutes: 30,
    temperatureLowC: 5,
    temperatureHighC: 7,
    windowText: '5–7 °C',
    outsideWindow: 'add ice to the bath',
  }),
  step(1, { durationMinutes: 240 }),
];

function stored(id: number, fields: Partial<TimelineEntry>): TimelineEntry {
  return {
    id,
    clientId: `stored-entry-${id}`,
    kind: 'note',
    at: '2026-12-03T09:00:00.000Z',
    stepIndex: null,
    temperatureC: null,
    text: '',
    uploadId: null,
    photoUrl: null,
    durationMinutes: null,
    endsAt: null,
    timerClientId: null,
    deviation: null,
    recordedBy: { id: 3, displayName: 'Member One' },
    receivedAt: '2026-12-03T09:00:00.000Z',
    ...fields,
  };
}

function waiting(seq: number, input: QueuedEntry['input']): QueuedEntry {
  return { key: [1, seq], runId: 1, input, photo: null, state: 'waiting', message: '' };
}

const startedStep1 = stored(1, {
  kind: 'step-start',
  stepIndex: 0,
  at: '2026-12-03T09:00:00.000Z',
});

describe('the bench state', () => {
  it('when a reading waits offline outside the step window, then it is flagged with the window and the step words', () => {
    const state = benchState(
      { steps, entries: [startedStep1] },
      [
        waiting(1, {
          clientId: 'reading-one',
          kind: 'reading',
          at: '2026-12-03T09:05:00Z',
          temperatureC: 8.2,
        }),
      ],
      new Date('2026-12-03T09:06:00Z'),
    );
    const reading = state.entries.find((entry) => entry.clientId === 'reading-one')!;
    expect(reading).toMatchObject({ sync: 'waiting', stepIndex: 0 });
    expect(reading.deviation).toEqual({
      reason: 'reading-outside-window',
      stepIndex: 0,
      message: '8.2 °C is 1.2 °C above the window of step 1 (5–7 °C)',
      instruction: 'add ice to the bath',
    });
    expect(state.waitingCount).toBe(1);
    expect(state.currentStepIndex).toBe(0);
  });

  it('when a step timer is started offline, then it counts down from the step duration until stopped', () => {
    const timer = waiting(1, {
      clientId: 'timer-one',
      kind: 'timer-start',
      at: '2026-12-03T09:01:00Z',
      stepIndex: 0,
    });
    const running = benchState(
      { steps, entries: [startedStep1] },
      [timer],
      new Date('2026-12-03T09:02:00Z'),
    );
    expect(running.runningTimers.map((entry) => entry.endsAt)).toEqual([
      '2026-12-03T09:31:00.000Z',
    ]);

    const stopped = benchState(
      { steps, entries: [startedStep1] },
      [
        timer,
        waiting(2, {
          clientId: 'timer-one-end',
          kind: 'timer-end',
          at: '2026-12-03T09:31:10Z',
          stepIndex: 0,
          timerClientId: 'timer-one',
        }),
      ],
      new Date('2026-12-03T09:32:00Z'),
    );
    expect(stopped.runningTimers).toEqual([]);
  });

  it('when a timer is stopped offline, then it is judged against its own length, as the server does', () => {
    const shortTimer = waiting(1, {
      clientId: 'short-timer',
      kind: 'timer-start',
      at: '2026-12-03T09:01:00Z',
      stepIndex: 0,
      durationMinutes: 5,
    });
    const stop = (at: string) =>
      benchState(
        { steps, entries: [startedStep1] },
        [
          shortTimer,
          waiting(2, {
            clientId: 'short-timer-end',
            kind: 'timer-end',
            at,
            stepIndex: 0,
            timerClientId: 'short-timer',
          }),
        ],
        new Date(at),
      ).entries.find((entry) => entry.clientId === 'short-timer-end')!.deviation;
    // Stopped as it rang: 5 of its 5 minutes, though the step itself takes 30.
    expect(stop('2026-12-03T09:06:00Z')).toBeNull();
    expect(stop('2026-12-03T09:03:00Z')).toMatchObject({
      reason: 'timer-ended-early',
      message: 'the timer of step 1 was stopped after 2 min of its 5 min',
    });
  });

  it('when an entry was sent but is still in the outbox, then it shows once, as waiting', () => {
    const state = benchState(
      { steps, entries: [startedStep1, stored(2, { clientId: 'note-one', text: 'Cloudy' })] },
      [
        waiting(1, {
          clientId: 'note-one',
          kind: 'note',
          at: '2026-12-03T09:00:00Z',
          text: 'Cloudy',
        }),
      ],
      new Date('2026-12-03T09:01:00Z'),
    );
    expect(state.entries.filter((entry) => entry.clientId === 'note-one')).toMatchObject([
      { sync: 'waiting' },
    ]);
  });

  it('when a step is ended, then no step is under way and its times are kept', () => {
    const state = benchState(
      {
        steps,
        entries: [
          startedStep1,
          stored(2, { kind: 'step-end', stepIndex: 0, at: '2026-12-03T09:40:00.000Z' }),
        ],
      },
      [],
      new Date('2026-12-03T09:41:00Z'),
    );
    expect(state.currentStepIndex).toBeNull();
    expect(state.stepTimes[0]).toEqual({
      startedAt: '2026-12-03T09:00:00.000Z',
      endedAt: '2026-12-03T09:40:00.000Z',
    });
  });

  it('when a timer is shown, then what is left reads as minutes and seconds, with hours when long', () => {
    expect(formatCountdown(30 * 60_000)).toBe('30:00');
    expect(formatCountdown(59_001)).toBe('1:00');
    expect(formatCountdown(4 * 3_600_000 + 5_000)).toBe('4:00:05');
    expect(formatCountdown(-2_000)).toBe('0:00');
  });
});
