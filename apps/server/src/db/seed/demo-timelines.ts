import type { TimelineKind } from '@lotwise/chem';
import { timelineEntryInputSchema, type User } from '@lotwise/shared';
import type { Repositories } from '../store';
import { appendTimelineEntry } from '../../modules/run-timeline/run-timeline.service';

/**
 * One entry of a demo run's timeline: `min` minutes after the run's first step started;
 * `step` is the step's index (0 is step 1). A timer runs its step's duration.
 */
export interface DemoTimelineEntry {
  min: number;
  kind: TimelineKind;
  step?: number;
  temperatureC?: number;
  text?: string;
}

const start = (step: number, min: number): DemoTimelineEntry => ({ min, kind: 'step-start', step });
const end = (step: number, min: number): DemoTimelineEntry => ({ min, kind: 'step-end', step });
const timer = (step: number, min: number): DemoTimelineEntry => ({
  min,
  kind: 'timer-start',
  step,
});
const timerEnd = (step: number, min: number): DemoTimelineEntry => ({
  min,
  kind: 'timer-end',
  step,
});
const reading = (step: number, min: number, temperatureC: number): DemoTimelineEntry => ({
  min,
  kind: 'reading',
  step,
  temperatureC,
});
const note = (step: number, min: number, text: string): DemoTimelineEntry => ({
  min,
  kind: 'note',
  step,
  text,
});

/**
 * Aspirin at half scale, kept to the procedure: the bath held at 70–80 °C for the 15 min, the
 * ice bath below 10 °C until the crystals came (invented).
 */
export const aspirinTimeline: DemoTimelineEntry[] = [
  start(0, 0),
  end(0, 4),
  start(1, 5),
  note(1, 8, 'Anhydride measured in the hood; the flask stoppered while the bath warmed.'),
  end(1, 9),
  start(2, 10),
  timer(2, 10),
  reading(2, 12, 71.5),
  reading(2, 15, 75),
  reading(2, 19, 77.5),
  note(2, 20, 'All the solid dissolved after about 9 min.'),
  reading(2, 22, 78),
  timerEnd(2, 25),
  reading(2, 25, 77),
  end(2, 25.5),
  start(3, 26),
  note(3, 27, 'Fizzed for a few seconds; the vapour stayed in the hood.'),
  end(3, 29),
  start(4, 30),
  timer(4, 30),
  reading(4, 38, 9.5),
  note(4, 42, 'First crystals after 12 min, without scratching.'),
  reading(4, 44, 6),
  reading(4, 50, 4.5),
  timerEnd(4, 50),
  end(4, 51),
  start(5, 52),
  note(5, 74, 'Left to dry on the filter paper over lunch before weighing.'),
  end(5, 75),
];

/**
 * Dibenzalacetone with one deviation: the addition ran warm (31.5 °C against "at most 30 °C"),
 * was stopped and the bath iced, then went on more slowly (invented).
 */
export const dibenzalacetoneTimeline: DemoTimelineEntry[] = [
  start(0, 0),
  reading(0, 1, 21),
  end(0, 3),
  start(1, 4),
  end(1, 7),
  start(2, 8),
  timer(2, 8),
  reading(2, 8, 22),
  reading(2, 12, 26),
  reading(2, 15, 31.5),
  note(2, 15.5, 'Addition stopped with about half added; ice put into the water bath.'),
  reading(2, 18, 24),
  note(2, 19, 'Addition started again, one drop every 3–4 s.'),
  reading(2, 24, 27),
  timerEnd(2, 28),
  reading(2, 29, 26),
  end(2, 30),
  start(3, 30),
  timer(3, 30),
  reading(3, 40, 25),
  note(3, 45, 'Thick yellow solid; the stirrer bar stuck once and was freed with a spatula.'),
  reading(3, 50, 23.5),
  timerEnd(3, 60),
  end(3, 60),
  start(4, 61),
  timer(4, 61),
  reading(4, 66, 8),
  reading(4, 71, 5),
  timerEnd(4, 71),
  end(4, 72),
  start(5, 73),
  note(5, 90, 'Washings neutral after the fourth portion.'),
  end(5, 91),
  start(6, 95),
  note(6, 148, 'Pale yellow plates; left to dry on a watch glass.'),
  end(6, 150),
];

/**
 * Writes a demo run's timeline through the same code the API uses (so deviations and timers
 * are judged as at the bench), each entry received a few seconds after it was taken.
 * Inside the seed's transaction, while the run is still open.
 */
export async function seedRunTimeline(
  repos: Repositories,
  runId: number,
  entries: readonly DemoTimelineEntry[],
  startedAt: string,
  actor: User,
): Promise<void> {
  const t0 = Date.parse(startedAt);
  for (const [n, entry] of entries.entries()) {
    const at = new Date(t0 + entry.min * 60_000);
    const input = timelineEntryInputSchema.parse({
      clientId: `demo-run${runId}-${String(n + 1).padStart(3, '0')}`,
      kind: entry.kind,
      at: at.toISOString(),
      stepIndex: entry.step ?? null,
      temperatureC: entry.temperatureC ?? null,
      text: entry.text ?? '',
    });
    const receivedAt = new Date(at.getTime() + 4_000).toISOString();
    await appendTimelineEntry(repos, runId, input, actor, receivedAt);
  }
}
