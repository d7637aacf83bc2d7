import type { RunTimeline, TimelineEntry, TimelineStepView, DeviationView } from '@lotwise/shared';

/** Test data of our own, shaped like `GET /api/runs/:id/timeline`. */
export function makeTimelineStep(overrides: Partial<TimelineStepView> = {}): TimelineStepView {
  return {
    index: 0,
    text: 'Cool the amine solution in an ice bath',
    durationMinutes: 10,
    temperatureLowC: 0,
    temperatureHighC: 5,
    outsideWindow: '',
    lineIndex: null,
    addition: '',
    caution: null,
    holdPoint: '',
    additionAmount: null,
    additionChemical: null,
    windowText: '0–5 °C',
    startedAt: null,
    endedAt: null,
    ...overrides,
  };
}

let nextEntryId = 1;

export function makeTimelineEntry(overrides: Partial<TimelineEntry> = {}): TimelineEntry {
  const id = overrides.id ?? nextEntryId++;
  return {
    id,
    clientId: `client-entry-${id}`,
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
    recordedBy: { id: 3, displayName: 'Mira Member' },
    receivedAt: overrides.at ?? '2026-12-03T09:00:00.000Z',
    ...overrides,
  };
}

const outsideDeviation: DeviationView = {
  reason: 'reading-outside-window',
  stepIndex: 1,
  message: '9 °C is 2 °C above the window of step 2 (5–7 °C)',
  instruction: 'Slow the addition and add ice to the bath.',
};

/**
 * A diazotisation-like run: step 1 cooled 09:00–09:10 (0–5 °C), step 2 an addition
 * 09:10–09:30 (5–7 °C) with one reading outside, step 3 still under way without a window.
 */
export function makeTimeline(overrides: Partial<RunTimeline> = {}): RunTimeline {
  const steps = [
    makeTimelineStep({
      index: 0,
      startedAt: '2026-12-03T09:00:00.000Z',
      endedAt: '2026-12-03T09:10:00.000Z',
    }),
    makeTimelineStep({
      index: 1,
      text: 'Add the nitrite solution dropwise, keeping the mixture between 5 and 7 °C',
      durationMinutes: 20,
      temperatureLowC: 5,
      temperatureHighC: 7,
      windowText: '5–7 °C',
      outsideWindow: 'Slow the addition and add ice to the bath.',
      lineIndex: 1,
      addition: 'dropwise over about 20 min',
      additionAmount: '12.5 mL',
      additionChemical: 'Sodium nitrite solution',
      caution: 'exothermicAddition',
      startedAt: '2026-12-03T09:10:00.000Z',
      endedAt: '2026-12-03T09:30:00.000Z',
    }),
    makeTimelineStep({
      index: 2,
      text: 'Stir in the ice bath',
      durationMinutes: 30,
      temperatureLowC: null,
      temperatureHighC: null,
      windowText: null,
      holdPoint: 'the solution is clear',
      startedAt: '2026-12-03T09:30:00.000Z',
      endedAt: null,
    }),
  ];
  const entries = [
    makeTimelineEntry({ id: 1, kind: 'step-start', at: steps[0]!.startedAt!, stepIndex: 0 }),
    makeTimelineEntry({
      id: 2,
      kind: 'reading',
      at: '2026-12-03T09:05:00.000Z',
      stepIndex: 0,
      temperatureC: 3,
    }),
    makeTimelineEntry({ id: 3, kind: 'step-end', at: steps[0]!.endedAt!, stepIndex: 0 }),
    makeTimelineEntry({ id: 4, kind: 'step-start', at: steps[1]!.startedAt!, stepIndex: 1 }),
    makeTimelineEntry({
      id: 5,
      kind: 'timer-start',
      at: steps[1]!.startedAt!,
      stepIndex: 1,
      durationMinutes: 20,
      endsAt: '2026-12-03T09:30:00.000Z',
    }),
    makeTimelineEntry({
      id: 6,
      kind: 'reading',
      at: '2026-12-03T09:15:00.000Z',
      stepIndex: 1,
      temperatureC: 6,
    }),
    makeTimelineEntry({
      id: 7,
      kind: 'reading',
      at: '2026-12-03T09:20:00.000Z',
      stepIndex: 1,
      temperatureC: 9,
      deviation: outsideDeviation,
    }),
    makeTimelineEntry({
      id: 8,
      kind: 'note',
      at: '2026-12-03T09:21:00.000Z',
      stepIndex: 1,
      text: 'Addition slowed, more ice added',
    }),
    makeTimelineEntry({
      id: 9,
      kind: 'photo',
      at: '2026-12-03T09:25:00.000Z',
      stepIndex: 1,
      uploadId: 40,
      photoUrl: '/api/runs/10/photos/40',
      text: 'Pale yellow solution',
    }),
    makeTimelineEntry({ id: 10, kind: 'step-end', at: steps[1]!.endedAt!, stepIndex: 1 }),
    makeTimelineEntry({ id: 11, kind: 'step-start', at: steps[2]!.startedAt!, stepIndex: 2 }),
  ];
  return {
    runId: 10,
    status: 'open',
    steps,
    entries,
    currentStepIndex: 2,
    runningTimers: [],
    deviations: [{ entryId: 7, at: '2026-12-03T09:20:00.000Z', deviation: outsideDeviation }],
    ...overrides,
  };
}
