import { TriangleAlert } from 'lucide-react';
import type { DeviationView, TimelineStepView } from '@lotwise/shared';
import { formatMinutes } from '@lotwise/chem';
import { deviationReasonLabels } from '../labels';

/** What the step asked for, against which the deviation is measured. */
export function measuredAgainst(deviation: DeviationView, step: TimelineStepView | undefined) {
  if (!step) return null;
  if (deviation.reason === 'reading-outside-window')
    return step.windowText ? `Window: ${step.windowText}` : null;
  if (deviation.reason === 'hold-point-skipped')
    return step.holdPoint ? `Hold point: do not go on until ${step.holdPoint}` : null;
  return step.durationMinutes !== null ? `Planned: ${formatMinutes(step.durationMinutes)}` : null;
}

/**
 * A deviation marked in words beside the entry that made it (the word "Deviation", what
 * happened, the window or time, and what the step says to do), not by colour alone.
 */
export function DeviationNote({
  deviation,
  step,
}: {
  deviation: DeviationView;
  step: TimelineStepView | undefined;
}) {
  const against = measuredAgainst(deviation, step);
  return (
    <div className="mt-1 rounded-md border border-danger-200 bg-danger-50 px-2.5 py-1.5 text-sm break-inside-avoid">
      <p className="flex items-start gap-1.5 font-semibold text-danger-700">
        <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
        <span>Deviation: {deviationReasonLabels[deviation.reason]}</span>
      </p>
      <p className="text-ink-900">{deviation.message}</p>
      {against && <p className="text-ink-800">{against}</p>}
      {deviation.instruction && (
        <p className="text-ink-800">
          <span className="font-medium">What to do:</span> {deviation.instruction}
        </p>
      )}
    </div>
  );
}
