import { CircleCheck } from 'lucide-react';
import { countOf, type RunTimeline } from '@lotwise/shared';
import { clockTime, deviationReasonLabels, spansDays } from '../labels';
import { measuredAgainst } from './deviation-note';

/**
 * Every deviation of the run, in time order: when, at which step, what happened, the
 * window or time it is measured against and what the step says to do.
 */
export function DeviationsList({
  timeline,
}: {
  timeline: Pick<RunTimeline, 'steps' | 'deviations'>;
}) {
  const { deviations, steps } = timeline;
  if (deviations.length === 0) {
    return (
      <p className="flex items-start gap-2 text-sm text-ok-700">
        <CircleCheck aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
        No deviations recorded: every reading was inside its window and every step kept its time.
      </p>
    );
  }
  const withDate = spansDays(deviations.map((item) => item.at));
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm font-semibold text-danger-700" data-testid="deviation-count">
        {countOf(deviations.length, 'deviation')}
      </p>
      <ol aria-label="Deviations" className="flex flex-col gap-2">
        {deviations.map(({ entryId, at, deviation }) => {
          const step = steps[deviation.stepIndex];
          const against = measuredAgainst(deviation, step);
          return (
            <li
              key={entryId}
              className="grid grid-cols-[4.5rem_1fr] gap-x-3 rounded-lg border border-danger-200 bg-white px-3 py-2 text-sm break-inside-avoid"
            >
              <time dateTime={at} className="font-medium text-ink-700 tabular-nums">
                {clockTime(at, withDate)}
              </time>
              <div className="flex min-w-0 flex-col gap-0.5">
                <p className="font-semibold text-danger-700">
                  {deviationReasonLabels[deviation.reason]}
                </p>
                <p className="text-ink-900">
                  <span className="font-medium">Step {deviation.stepIndex + 1}:</span>{' '}
                  {step?.text ?? '(the step is no longer in the procedure)'}
                </p>
                <p className="text-ink-900">{deviation.message}</p>
                {against && <p className="text-ink-800 tabular-nums">{against}</p>}
                {deviation.instruction && (
                  <p className="text-ink-800">
                    <span className="font-medium">What to do:</span> {deviation.instruction}
                  </p>
                )}
              </div>
            </li>
          );
        })}
      </ol>
    </div>
  );
}
