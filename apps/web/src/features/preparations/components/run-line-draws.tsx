import { Info, Plus } from 'lucide-react';
import type { PlanDetail, Procedure, ProcedureLineView } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { formatAmount } from '../../../lib/format';
import { roleLabels } from '../labels';
import { ContainerDraw, newDraw } from './container-draw';
import { Section } from './page-parts';
import type { LineDraw } from './run-record-body';

/** Says where a filled-in draw came from, while it still holds what was filled in. */
function SourceNote({
  draw,
  plan,
  line,
}: {
  draw: LineDraw;
  plan: PlanDetail | undefined;
  line: ProcedureLineView;
}) {
  const source = draw.source;
  if (!source || draw.mode !== 'amount' || draw.amount !== String(source.amount)) return null;
  if (source.kind !== 'planned' && draw.containerId !== source.containerId) return null;
  const label =
    plan?.reservations.find((r) => String(r.containerId) === draw.containerId)?.labelCode ??
    plan?.stockCheck.lines
      .flatMap((l) => l.take)
      .find((t) => String(t.containerId) === draw.containerId)?.labelCode;
  const amount = formatAmount(source.amount, source.unit);
  const text =
    source.kind === 'held'
      ? `Filled in from plan #${plan?.id}: ${amount} from ${label}, held for this plan.`
      : source.kind === 'suggested'
        ? `Filled in from plan #${plan?.id}: ${amount} from ${label}, as its stock check suggests.`
        : `Filled in: the planned ${amount} of ${line.chemical.name}.${draw.containerId ? '' : ' Choose the container it came from.'}`;
  return (
    <p
      className="flex items-start gap-1.5 text-xs text-ink-700"
      data-testid={`draw-source-${line.index}`}
    >
      <Info aria-hidden="true" className="mt-0.5 size-3.5 shrink-0 text-accent-600" />
      <span>{text} Saving draws this from stock; change it to what was really taken.</span>
    </p>
  );
}

/** "What was really used": each line's draws from named containers. */
export function RunLineDraws({
  procedure,
  plan,
  scaleFactor,
  draws,
  onChange,
}: {
  procedure: Procedure;
  plan: PlanDetail | undefined;
  scaleFactor: number;
  draws: Record<number, LineDraw[]>;
  onChange: (update: (all: Record<number, LineDraw[]>) => Record<number, LineDraw[]>) => void;
}) {
  return (
    <Section id="used-heading" title="What was really used">
      <p className="text-sm text-ink-600">
        Name the container each amount came from. Weighing the container before and after is the
        most exact: the tare cancels out. Every line that is not optional needs what was drawn — the
        yield is worked out only from amounts drawn from stock here.
        {plan
          ? ' The planned amounts are filled in from the containers held for the plan (or suggested by its stock check): change them to what was really taken.'
          : ''}{' '}
        An optional line left empty was not used.
      </p>
      <ol className="flex flex-col gap-3">
        {procedure.lines
          .filter((line) => line.role !== 'product')
          .map((line) => {
            const planned =
              line.quantity !== null && line.unit
                ? `planned ${formatAmount(line.quantity * scaleFactor, line.unit)}`
                : undefined;
            return (
              <li
                key={line.index}
                aria-label={`Line ${line.index + 1}: ${line.chemical.name}`}
                className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-white px-4 py-3"
              >
                <p className="text-sm">
                  <span className="font-semibold text-ink-900">
                    {line.index + 1}. {line.chemical.name}
                  </span>{' '}
                  <span className="text-ink-600">
                    {roleLabels[line.role]}
                    {planned && ` · ${planned}`}
                    {line.optional ? ' · optional: leave empty if not used' : ' · required'}
                  </span>
                </p>
                {(draws[line.index] ?? []).map((draw, drawIndex) => (
                  <div key={draw.key} className="flex flex-col gap-1">
                    <ContainerDraw
                      chemicalId={line.chemicalId}
                      planId={plan?.id ?? null}
                      value={draw}
                      label={`Line ${line.index + 1} draw ${drawIndex + 1}`}
                      plannedHint={drawIndex === 0 ? planned : undefined}
                      onChange={(next) =>
                        onChange((all) => ({
                          ...all,
                          [line.index]: all[line.index]!.map((d) =>
                            d.key === draw.key ? { ...next, source: d.source } : d,
                          ),
                        }))
                      }
                      onRemove={() =>
                        onChange((all) => ({
                          ...all,
                          [line.index]: all[line.index]!.filter((d) => d.key !== draw.key),
                        }))
                      }
                    />
                    <SourceNote draw={draw} plan={plan} line={line} />
                  </div>
                ))}
                <Button
                  size="sm"
                  className="self-start"
                  icon={<Plus aria-hidden="true" className="size-4" />}
                  onClick={() =>
                    onChange((all) => ({
                      ...all,
                      [line.index]: [
                        ...(all[line.index] ?? []),
                        newDraw('', line.chemical.stockUnit),
                      ],
                    }))
                  }
                >
                  Another container for {line.chemical.name}
                </Button>
              </li>
            );
          })}
      </ol>
    </Section>
  );
}
