import type { ReactNode } from 'react';
import { formatMinutes, temperatureWindowText } from '@lotwise/chem';
import type { ProcedureStepView } from '@lotwise/shared';
import { Beaker, Clock, OctagonPause, Thermometer, type LucideIcon } from 'lucide-react';
import { cautionMeta } from './preparation-safety';

/** The procedure line a step adds, as the page at hand shows it. */
export interface StepLine {
  lineIndex: number;
  name: string;
  /** The amount at this page's scale, already written for the bench; null when unknown. */
  amount?: string | null;
}

function Detail({
  icon: Icon,
  label,
  children,
  tone = 'plain',
}: {
  icon: LucideIcon;
  label: string;
  children: ReactNode;
  tone?: 'plain' | 'warn';
}) {
  return (
    <p className="flex items-start gap-2">
      <Icon
        aria-hidden="true"
        className={`mt-0.5 size-4 shrink-0 ${tone === 'warn' ? 'text-warn-700' : 'text-ink-600'}`}
      />
      <span>
        <span className="font-medium text-ink-900">{label}</span> {children}
      </span>
    </p>
  );
}

/** One step: its text, then what goes with it (time, window, addition, caution, hold point). */
function Step({ step, line }: { step: ProcedureStepView; line: StepLine | undefined }) {
  const window = temperatureWindowText(step);
  const caution = step.caution ? cautionMeta[step.caution] : null;
  const number = step.index + 1;
  return (
    <li
      aria-label={`Step ${number}`}
      className="flex gap-3 border-b border-ink-200 py-3 break-inside-avoid last:border-b-0"
    >
      <span
        aria-hidden="true"
        className="flex size-7 shrink-0 items-center justify-center rounded-full border-2 border-ink-800 text-sm font-semibold tabular-nums"
      >
        {number}
      </span>
      <div className="flex min-w-0 flex-1 flex-col gap-1.5 text-sm text-ink-800">
        <p className="font-medium whitespace-pre-line text-ink-900">
          <span className="sr-only">Step {number}: </span>
          {step.text}
        </p>
        {line && (
          <Detail icon={Beaker} label="Add:">
            {line.name}
            {line.amount && (
              <>
                {' — '}
                <span className="font-semibold whitespace-nowrap tabular-nums">{line.amount}</span>
              </>
            )}
            {step.addition && <>, {step.addition}</>}
          </Detail>
        )}
        {!line && step.addition && (
          <Detail icon={Beaker} label="How to add:">
            {step.addition}
          </Detail>
        )}
        {step.durationMinutes !== null && (
          <Detail icon={Clock} label="Time:">
            <span className="tabular-nums">{formatMinutes(step.durationMinutes)}</span>
          </Detail>
        )}
        {window && (
          <Detail icon={Thermometer} label="Keep the temperature:">
            <span className="font-semibold tabular-nums">{window}</span>
            {step.outsideWindow && <span className="block">Outside it: {step.outsideWindow}</span>}
          </Detail>
        )}
        {caution && (
          <p className="flex items-start gap-2 font-medium text-ink-900">
            <caution.icon aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-warn-700" />
            <span>Caution: {caution.label}</span>
          </p>
        )}
        {step.holdPoint && (
          <p
            data-testid={`hold-point-${step.index}`}
            className="mt-1 flex items-start gap-2 rounded-md border-2 border-warn-700 bg-warn-50 px-3 py-2 font-medium text-ink-900 print:bg-transparent"
          >
            <OctagonPause aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-warn-700" />
            <span>
              <span className="font-semibold">Hold point:</span> do not go on until {step.holdPoint}
            </span>
          </p>
        )}
      </div>
    </li>
  );
}

/**
 * A procedure's steps, in order, for the procedure page, the plan and each bench of the
 * dispensing sheet. An addition names the line's chemical and, where the page knows its
 * scale, the amount that page already shows for it (`lines`); nothing is worked out here.
 * Nothing is drawn for a procedure without steps (`empty` is shown instead when given).
 */
export function ProcedureSteps({
  steps,
  lines,
  id,
  title = 'Steps',
  note,
  empty,
}: {
  steps: readonly ProcedureStepView[];
  lines: readonly StepLine[];
  /** Heading id: a page with several lists (one per bench) gives each its own. */
  id: string;
  title?: ReactNode;
  /** A line under the heading, e.g. which scale the amounts are at. */
  note?: ReactNode;
  empty?: ReactNode;
}) {
  if (steps.length === 0) return empty ? <>{empty}</> : null;
  const byIndex = new Map(lines.map((line) => [line.lineIndex, line]));
  return (
    <section aria-labelledby={id} className="flex flex-col gap-1">
      <h2 id={id} className="text-base font-semibold text-ink-900 break-after-avoid">
        {title}
      </h2>
      {note && <p className="text-xs text-ink-600">{note}</p>}
      <ol className="flex flex-col rounded-lg border border-ink-200 bg-white px-4 print:border-ink-400">
        {steps.map((step) => (
          <Step
            key={step.index}
            step={step}
            line={step.lineIndex === null ? undefined : byIndex.get(step.lineIndex)}
          />
        ))}
      </ol>
    </section>
  );
}
