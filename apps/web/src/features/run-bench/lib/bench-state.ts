import { currentStepAt, deviationOf, type TimelineEvent } from '@lotwise/chem';
import type { DeviationView, RunTimeline, TimelineStepView } from '@lotwise/shared';
import type { QueuedEntry } from './queue';

/**
 * What the bench shows: the server's timeline with the entries still waiting on this device
 * laid in among them, so an entry appears the moment it is taken and the current step,
 * running timers and deviations read the same offline as online.
 */
export interface BenchEntry {
  clientId: string;
  kind: TimelineEvent['kind'];
  at: string;
  stepIndex: number | null;
  temperatureC: number | null;
  text: string;
  durationMinutes: number | null;
  /** A timer: when it rings. */
  endsAt: string | null;
  timerClientId: string | null;
  deviation: DeviationView | null;
  photoUrl: string | null;
  /** A photo still on the device. */
  photoBlob: Blob | null;
  recordedBy: string | null;
  /** `stored` on the server; `waiting` on this device; `refused` by the server (see message). */
  sync: 'stored' | 'waiting' | 'refused';
  message: string;
  /** The outbox entry, for a refused one's discard button. */
  queued: QueuedEntry | null;
}

export interface BenchState {
  entries: BenchEntry[];
  /** The step under way now, or null. */
  currentStepIndex: number | null;
  /** Timers started and not stopped, soonest end first. */
  runningTimers: BenchEntry[];
  /** Per step: when it was last started and ended (ended only if after that start). */
  stepTimes: { startedAt: string | null; endedAt: string | null }[];
  waitingCount: number;
  refused: BenchEntry[];
}

function byTime(a: BenchEntry, b: BenchEntry) {
  return Date.parse(a.at) - Date.parse(b.at);
}

function timerEnd(at: string, minutes: number | null): string | null {
  return minutes === null ? null : new Date(Date.parse(at) + minutes * 60_000).toISOString();
}

/** A waiting entry's deviation, judged as the server will judge it, with the step's instruction. */
function localDeviation(
  entry: BenchEntry,
  earlier: readonly BenchEntry[],
  steps: readonly TimelineStepView[],
): DeviationView | null {
  const deviation = deviationOf(
    entry,
    earlier,
    steps.map((step) => ({ ...step, holdPoint: step.holdPoint || null })),
  );
  if (!deviation) return null;
  const instruction =
    deviation.reason === 'reading-outside-window'
      ? (steps[deviation.stepIndex]?.outsideWindow ?? '')
      : '';
  return { ...deviation, instruction };
}

/**
 * A timer stopped early, judged as the server judges it: against the timer it stops and the
 * length that timer was set to run (a short timer inside a long step stopped as it rings is
 * no deviation).
 */
function timerEndDeviation(
  entry: BenchEntry,
  before: readonly BenchEntry[],
  steps: readonly TimelineStepView[],
): DeviationView | null {
  const running = runningTimers(before.filter((other) => other.sync !== 'refused'));
  const timer = entry.timerClientId
    ? running.find((other) => other.clientId === entry.timerClientId)
    : running.findLast((other) => other.stepIndex === entry.stepIndex);
  if (!timer) return null;
  entry.stepIndex = timer.stepIndex ?? entry.stepIndex;
  const earlier = before.filter((other) => other.kind !== 'timer-start' || other === timer);
  const judgedSteps = steps.map((step, index) =>
    index === timer.stepIndex && timer.durationMinutes !== null
      ? { ...step, durationMinutes: timer.durationMinutes }
      : step,
  );
  return localDeviation(entry, earlier, judgedSteps);
}

/** Lays the device's outbox into the server's timeline and works out what is under way at `now`. */
export function benchState(
  timeline: Pick<RunTimeline, 'entries' | 'steps'>,
  queued: readonly QueuedEntry[],
  now: Date,
): BenchState {
  const { steps } = timeline;
  const waitingIds = new Set(queued.map((entry) => entry.input.clientId));
  const stored: BenchEntry[] = timeline.entries
    .filter((entry) => !waitingIds.has(entry.clientId))
    .map((entry) => ({
      clientId: entry.clientId,
      kind: entry.kind,
      at: entry.at,
      stepIndex: entry.stepIndex,
      temperatureC: entry.temperatureC,
      text: entry.text,
      durationMinutes: entry.durationMinutes,
      endsAt: entry.endsAt,
      timerClientId: entry.timerClientId,
      deviation: entry.deviation,
      photoUrl: entry.photoUrl,
      photoBlob: null,
      recordedBy: entry.recordedBy?.displayName ?? null,
      sync: 'stored',
      message: '',
      queued: null,
    }));

  const entries = [...stored].sort(byTime);
  for (const item of queued) {
    const input = item.input;
    const at = new Date(input.at).toISOString();
    const before = entries.filter((entry) => Date.parse(entry.at) <= Date.parse(at));
    const stepIndex =
      input.stepIndex ?? (input.kind === 'reading' ? currentStepAt(before, at) : null);
    const duration =
      input.kind === 'timer-start'
        ? (input.durationMinutes ??
          (stepIndex !== null ? (steps[stepIndex]?.durationMinutes ?? null) : null))
        : (input.durationMinutes ?? null);
    const entry: BenchEntry = {
      clientId: input.clientId,
      kind: input.kind,
      at,
      stepIndex,
      temperatureC: input.temperatureC ?? null,
      text: input.text ?? '',
      durationMinutes: duration,
      endsAt: input.kind === 'timer-start' ? timerEnd(at, duration) : null,
      timerClientId: input.timerClientId ?? null,
      deviation: null,
      photoUrl: null,
      photoBlob: item.photo?.blob ?? null,
      recordedBy: null,
      sync: item.state,
      message: item.message,
      queued: item,
    };
    entry.deviation =
      entry.kind === 'timer-end'
        ? timerEndDeviation(entry, before, steps)
        : localDeviation(entry, before, steps);
    entries.push(entry);
    entries.sort(byTime);
  }

  const counted = entries.filter((entry) => entry.sync !== 'refused');
  return {
    entries,
    currentStepIndex: currentStepAt(counted, now.toISOString()),
    runningTimers: runningTimers(counted),
    stepTimes: steps.map((_, index) => stepTime(counted, index)),
    waitingCount: queued.filter((entry) => entry.state === 'waiting').length,
    refused: entries.filter((entry) => entry.sync === 'refused'),
  };
}

/** Timers started and not stopped: a `timer-end` stops the timer it names, else its step's latest. */
function runningTimers(entries: readonly BenchEntry[]): BenchEntry[] {
  const running: BenchEntry[] = [];
  for (const entry of entries) {
    if (entry.kind === 'timer-start') running.push(entry);
    if (entry.kind !== 'timer-end') continue;
    const stopped = entry.timerClientId
      ? running.findIndex((timer) => timer.clientId === entry.timerClientId)
      : running.findLastIndex((timer) => timer.stepIndex === entry.stepIndex);
    if (stopped >= 0) running.splice(stopped, 1);
  }
  return running
    .filter((timer) => timer.endsAt !== null)
    .sort((a, b) => Date.parse(a.endsAt!) - Date.parse(b.endsAt!));
}

function stepTime(entries: readonly BenchEntry[], index: number) {
  let startedAt: string | null = null;
  let endedAt: string | null = null;
  for (const entry of entries) {
    if (entry.stepIndex !== index) continue;
    if (entry.kind === 'step-start') {
      startedAt = entry.at;
      endedAt = null;
    }
    if (entry.kind === 'step-end' && startedAt !== null) endedAt = entry.at;
  }
  return { startedAt, endedAt };
}

/** "29:59", "1:05:00": what is left of a timer, counting down to zero. */
export function formatCountdown(milliseconds: number): string {
  const total = Math.max(0, Math.ceil(milliseconds / 1000));
  const hours = Math.floor(total / 3600);
  const minutes = Math.floor((total % 3600) / 60);
  const seconds = total % 60;
  const two = (value: number) => String(value).padStart(2, '0');
  return hours > 0 ? `${hours}:${two(minutes)}:${two(seconds)}` : `${minutes}:${two(seconds)}`;
}
