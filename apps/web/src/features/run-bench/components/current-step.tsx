import type { TimelineStepView } from '@lotwise/shared';
import { formatMinutes } from '@lotwise/chem';
import {
  ChevronLeft,
  ChevronRight,
  CircleCheck,
  Clock,
  Hand,
  Play,
  Square,
  Thermometer,
  Timer,
  Undo2,
} from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { formatClock } from '../lib/words';
import { StepCautionLine } from './step-caution';

export interface StepActions {
  start: (index: number) => void;
  end: (index: number) => void;
  startTimer: (index: number) => void;
  browse: (index: number | null) => void;
}

/** Whether the step is under way, done or still to come, in words. */
function stepStatus(times: { startedAt: string | null; endedAt: string | null }) {
  if (times.endedAt) return `Done at ${formatClock(times.endedAt)}`;
  if (times.startedAt) return `Under way since ${formatClock(times.startedAt)}`;
  return 'Not started';
}

/**
 * The step in front of the person, in large type: what to do, the window to keep and what to
 * do outside it, the amount to add, the caution and the hold point, and the buttons that
 * start and end it. Browsing to another step starts nothing.
 */
export function CurrentStep({
  steps,
  index,
  currentIndex,
  times,
  timerRunning,
  mayWrite,
  actions,
}: {
  steps: readonly TimelineStepView[];
  index: number;
  currentIndex: number | null;
  times: { startedAt: string | null; endedAt: string | null };
  timerRunning: boolean;
  mayWrite: boolean;
  actions: StepActions;
}) {
  const step = steps[index]!;
  const browsing = currentIndex !== null && currentIndex !== index;
  const underWay = times.startedAt !== null && times.endedAt === null;
  return (
    <section
      aria-labelledby="bench-step-heading"
      aria-describedby="bench-step-status"
      className="flex flex-col gap-3 rounded-lg border-2 border-accent-600 bg-white px-4 py-4"
    >
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
        <p className="text-sm font-semibold text-accent-700 uppercase">
          Step {index + 1} of {steps.length}
        </p>
        <p id="bench-step-status" className="text-sm text-ink-700">
          {stepStatus(times)}
          {browsing && ` · step ${currentIndex + 1} is under way`}
        </p>
      </div>
      <h2 id="bench-step-heading" className="text-2xl leading-snug font-semibold text-ink-900">
        {step.text}
      </h2>
      <dl className="flex flex-col gap-2 text-lg text-ink-900">
        {step.windowText && (
          <div>
            <dt className="sr-only">Temperature window</dt>
            <dd className="flex items-start gap-2">
              <Thermometer aria-hidden="true" className="mt-1 size-5 shrink-0 text-accent-700" />
              <span>
                Keep at <strong className="tabular-nums">{step.windowText}</strong>
                {step.outsideWindow && (
                  <span className="block text-base text-ink-700">
                    If outside: {step.outsideWindow}
                  </span>
                )}
              </span>
            </dd>
          </div>
        )}
        {step.additionChemical && (
          <div>
            <dt className="sr-only">Addition</dt>
            <dd className="flex items-start gap-2">
              <Hand aria-hidden="true" className="mt-1 size-5 shrink-0 text-accent-700" />
              <span>
                Add <strong className="tabular-nums">{step.additionAmount ?? 'the amount'}</strong>{' '}
                of {step.additionChemical}
                {step.addition && <span className="text-ink-700"> — {step.addition}</span>}
              </span>
            </dd>
          </div>
        )}
        {!step.additionChemical && step.addition && (
          <div>
            <dt className="sr-only">Addition</dt>
            <dd className="flex items-start gap-2">
              <Hand aria-hidden="true" className="mt-1 size-5 shrink-0 text-accent-700" />
              <span>{step.addition}</span>
            </dd>
          </div>
        )}
        {step.durationMinutes !== null && (
          <div>
            <dt className="sr-only">Duration</dt>
            <dd className="flex items-start gap-2">
              <Clock aria-hidden="true" className="mt-1 size-5 shrink-0 text-accent-700" />
              <span>Takes {formatMinutes(step.durationMinutes)}</span>
            </dd>
          </div>
        )}
      </dl>
      {step.caution && <StepCautionLine caution={step.caution} />}
      {step.holdPoint && (
        <p className="rounded-md border border-ink-300 bg-ink-50 px-3 py-2 text-base text-ink-900">
          <strong>Hold point:</strong> do not go on until {step.holdPoint}
        </p>
      )}

      {mayWrite && (
        <div className="flex flex-wrap gap-2">
          {!underWay && (
            <Button
              variant="primary"
              icon={<Play aria-hidden="true" className="size-4" />}
              onClick={() => actions.start(index)}
            >
              {times.endedAt ? `Start step ${index + 1} again` : `Start step ${index + 1}`}
            </Button>
          )}
          {underWay && step.durationMinutes !== null && !timerRunning && (
            <Button
              variant="primary"
              icon={<Timer aria-hidden="true" className="size-4" />}
              onClick={() => actions.startTimer(index)}
            >
              Start timer ({formatMinutes(step.durationMinutes)})
            </Button>
          )}
          {underWay &&
            (step.holdPoint ? (
              // A long hold point wraps: a plain button, as the shared one keeps to one line.
              <button
                type="button"
                className="inline-flex min-h-11 items-center gap-2 rounded-md border border-accent-700 bg-accent-600 px-3.5 py-2 text-left text-sm font-medium text-white hover:bg-accent-700"
                onClick={() => actions.end(index)}
              >
                <CircleCheck aria-hidden="true" className="size-4 shrink-0" />
                <span>Done: {step.holdPoint}</span>
              </button>
            ) : (
              <Button
                icon={<Square aria-hidden="true" className="size-4" />}
                onClick={() => actions.end(index)}
              >
                End step {index + 1}
              </Button>
            ))}
        </div>
      )}

      <nav
        aria-label="Browse the steps"
        className="flex flex-wrap items-center gap-2 border-t border-ink-100 pt-3"
      >
        <Button
          variant="ghost"
          disabled={index === 0}
          icon={<ChevronLeft aria-hidden="true" className="size-4" />}
          onClick={() => actions.browse(index - 1)}
        >
          Previous step
        </Button>
        <Button
          variant="ghost"
          disabled={index === steps.length - 1}
          onClick={() => actions.browse(index + 1)}
        >
          Next step
          <ChevronRight aria-hidden="true" className="size-4" />
        </Button>
        {browsing && (
          <Button
            variant="ghost"
            icon={<Undo2 aria-hidden="true" className="size-4" />}
            onClick={() => actions.browse(null)}
          >
            Back to step {currentIndex + 1}
          </Button>
        )}
      </nav>
    </section>
  );
}
