import {
  Camera,
  CirclePlay,
  CircleStop,
  NotebookPen,
  Thermometer,
  Timer,
  TimerOff,
  type LucideIcon,
} from 'lucide-react';
import { formatMinutes, minutesBetween } from '@lotwise/chem';
import {
  noCautionFlags,
  type RunTimeline,
  type TimelineEntry,
  type TimelineStepView,
} from '@lotwise/shared';
import { cautionFlagItems } from '../../preparations/components/preparation-safety';
import { cn } from '../../../lib/cn';
import { clockTime, entryKindLabels, formatC, spansDays } from '../labels';
import { DeviationNote } from './deviation-note';

const kindIcons: Record<TimelineEntry['kind'], LucideIcon> = {
  reading: Thermometer,
  note: NotebookPen,
  photo: Camera,
  'step-start': CirclePlay,
  'step-end': CircleStop,
  'timer-start': Timer,
  'timer-end': TimerOff,
};

/** "took 28 min", "under way", "not started". */
function tookText(step: TimelineStepView) {
  if (!step.startedAt) return 'not started';
  if (!step.endedAt) return 'under way';
  return formatMinutes(minutesBetween(step.startedAt, step.endedAt));
}

/** A step's caution in the words the procedure's caution flags use. */
function stepCaution(caution: TimelineStepView['caution']) {
  if (!caution) return null;
  return cautionFlagItems({ ...noCautionFlags, [caution]: true })[0] ?? null;
}

function StepDetails({ step }: { step: TimelineStepView }) {
  const addition = [step.additionAmount, step.additionChemical, step.addition]
    .filter(Boolean)
    .join(' ');
  const caution = stepCaution(step.caution);
  return (
    <>
      <span className="block text-ink-900">{step.text}</span>
      {addition && <span className="block text-xs text-ink-700">Add {addition}</span>}
      {caution && (
        <span className="flex items-start gap-1 text-xs font-medium text-ink-900">
          <caution.icon aria-hidden="true" className="mt-px size-3.5 shrink-0 text-warn-700" />
          {caution.text}
        </span>
      )}
      {step.holdPoint && (
        <span className="block text-xs text-ink-700">Do not go on until {step.holdPoint}</span>
      )}
    </>
  );
}

/** Each step with its window and planned time, when it really started and ended, and how long it took. */
export function StepsTable({ steps, withDate }: { steps: TimelineStepView[]; withDate: boolean }) {
  if (steps.length === 0) {
    return <p className="text-sm text-ink-600">The procedure has no steps written.</p>;
  }
  const time = (at: string | null) => (at ? clockTime(at, withDate) : '—');
  return (
    <div className="stack-table rounded-lg border border-ink-200 bg-white">
      <table className="w-full text-sm">
        <caption className="sr-only">Steps: planned and actual times</caption>
        <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">
              Step
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Window
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Planned
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Started
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Ended
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Took
            </th>
          </tr>
        </thead>
        <tbody>
          {steps.map((step) => (
            <tr key={step.index} className="border-b border-ink-100 align-top last:border-b-0">
              <th scope="row" className="px-3 py-2 text-left font-normal">
                <span className="font-semibold">Step {step.index + 1}</span>
                <StepDetails step={step} />
              </th>
              <td data-label="Window" className="px-3 py-2 tabular-nums">
                {step.windowText ?? '—'}
              </td>
              <td data-label="Planned" className="px-3 py-2 tabular-nums">
                {step.durationMinutes === null ? '—' : formatMinutes(step.durationMinutes)}
              </td>
              <td data-label="Started" className="px-3 py-2 tabular-nums">
                {time(step.startedAt)}
              </td>
              <td data-label="Ended" className="px-3 py-2 tabular-nums">
                {time(step.endedAt)}
              </td>
              <td data-label="Took" className="px-3 py-2 tabular-nums">
                {tookText(step)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** "Step 2 started", "Reading", "Timer stopped". */
function entryTitle(entry: TimelineEntry) {
  if (entry.stepIndex !== null && (entry.kind === 'step-start' || entry.kind === 'step-end')) {
    return `Step ${entry.stepIndex + 1} ${entry.kind === 'step-start' ? 'started' : 'ended'}`;
  }
  return entryKindLabels[entry.kind];
}

function EntryBody({ entry, timeline }: { entry: TimelineEntry; timeline: RunTimeline }) {
  const step = entry.stepIndex === null ? undefined : timeline.steps[entry.stepIndex];
  switch (entry.kind) {
    case 'reading':
      return (
        <p>
          <span className="font-semibold tabular-nums">{formatC(entry.temperatureC ?? 0)}</span>
          {step?.windowText && <span className="text-ink-700"> (window {step.windowText})</span>}
          {entry.text && <span className="block text-ink-800">{entry.text}</span>}
        </p>
      );
    case 'note':
      return <p className="whitespace-pre-line text-ink-900">{entry.text}</p>;
    case 'photo':
      return (
        <figure className="flex flex-col gap-1">
          {entry.photoUrl ? (
            <a
              href={entry.photoUrl}
              target="_blank"
              rel="noreferrer"
              className="self-start rounded-md outline-offset-2"
            >
              <img
                src={entry.photoUrl}
                alt={entry.text || `Photo taken at ${clockTime(entry.at)}`}
                className="h-28 w-auto max-w-full rounded-md border border-ink-200 object-cover print:h-40"
              />
              <span className="sr-only"> (opens the full image)</span>
            </a>
          ) : (
            <span className="text-ink-600">The photo is no longer stored.</span>
          )}
          {entry.text && <figcaption className="text-ink-800">{entry.text}</figcaption>}
        </figure>
      );
    case 'step-start':
      return step?.durationMinutes ? (
        <p className="text-ink-700">planned {formatMinutes(step.durationMinutes)}</p>
      ) : null;
    case 'step-end': {
      const started = step?.startedAt;
      if (!started || !step) return null;
      const took = minutesBetween(started, entry.at);
      return (
        <p className="text-ink-700 tabular-nums">
          after {formatMinutes(Math.max(took, 0))}
          {step.durationMinutes !== null && ` of a planned ${formatMinutes(step.durationMinutes)}`}
        </p>
      );
    }
    case 'timer-start':
      return (
        <p className="text-ink-700 tabular-nums">
          {entry.durationMinutes !== null && formatMinutes(entry.durationMinutes)}
          {entry.endsAt && `, to ring at ${clockTime(entry.endsAt)}`}
          {entry.text && <span className="block text-ink-800">{entry.text}</span>}
        </p>
      );
    case 'timer-end':
      return entry.text ? <p className="text-ink-800">{entry.text}</p> : null;
  }
}

/** Every entry of the run in time order: what was done, read, noted and photographed. */
export function EntryList({ timeline, withDate }: { timeline: RunTimeline; withDate: boolean }) {
  return (
    <ol aria-label="Entries in time order" className="flex flex-col">
      {timeline.entries.map((entry) => {
        const Icon = kindIcons[entry.kind];
        const step = entry.stepIndex === null ? undefined : timeline.steps[entry.stepIndex];
        const during =
          entry.stepIndex !== null && entry.kind !== 'step-start' && entry.kind !== 'step-end';
        return (
          <li
            key={entry.id}
            data-testid="timeline-entry"
            className={cn(
              'grid grid-cols-[4.5rem_1fr] gap-x-3 border-b border-ink-100 py-2 text-sm break-inside-avoid last:border-b-0',
              withDate && 'grid-cols-[7.5rem_1fr]',
            )}
          >
            <time dateTime={entry.at} className="pt-px font-medium text-ink-700 tabular-nums">
              {clockTime(entry.at, withDate)}
            </time>
            <div className="min-w-0">
              <p className="flex flex-wrap items-baseline gap-x-2">
                <span className="inline-flex items-center gap-1.5 font-semibold text-ink-900">
                  <Icon aria-hidden="true" className="size-4 shrink-0 self-center text-ink-600" />
                  {entryTitle(entry)}
                </span>
                {during && (
                  <span className="text-xs text-ink-600">during step {entry.stepIndex! + 1}</span>
                )}
                {entry.recordedBy && (
                  <span className="text-xs text-ink-600">· {entry.recordedBy.displayName}</span>
                )}
              </p>
              {entry.kind === 'step-start' && step && <p className="text-ink-900">{step.text}</p>}
              <EntryBody entry={entry} timeline={timeline} />
              {entry.deviation && (
                <DeviationNote
                  deviation={entry.deviation}
                  step={timeline.steps[entry.deviation.stepIndex]}
                />
              )}
            </div>
          </li>
        );
      })}
    </ol>
  );
}

/** The run's timeline: its steps with planned and actual times, then every entry. */
export function RunTimelineView({ timeline }: { timeline: RunTimeline }) {
  const withDate = spansDays([
    ...timeline.entries.map((entry) => entry.at),
    ...timeline.steps.flatMap((step) => [step.startedAt, step.endedAt].filter((at) => at !== null)),
  ]);
  return (
    <div className="flex flex-col gap-3">
      <StepsTable steps={timeline.steps} withDate={withDate} />
      {timeline.entries.length > 0 && (
        <div className="rounded-lg border border-ink-200 bg-white px-3 print:border-0 print:px-0">
          <EntryList timeline={timeline} withDate={withDate} />
        </div>
      )}
    </div>
  );
}
