import { Link } from 'react-router';
import { Archive } from 'lucide-react';
import type { ContainerHold } from '@lotwise/shared';
import { paths } from '../../config/paths';
import { formatAmount, formatDate } from '../../lib/format';

/**
 * What is free of a container: its balance minus what plans hold of it now. A run from a plan
 * may take that plan's own hold without being asked, so `ownPlanId`'s holds count as free.
 */
export function freeOf(
  container: { quantity: number; holds: ContainerHold[] },
  ownPlanId: number | null = null,
): number {
  const held = container.holds
    .filter((hold) => hold.planId !== ownPlanId)
    .reduce((sum, hold) => sum + hold.quantity, 0);
  return Math.max(0, container.quantity - held);
}

function HoldLine({ hold }: { hold: ContainerHold }) {
  return (
    <li className="tabular-nums">
      <strong>{formatAmount(hold.quantity, hold.unit)}</strong> for{' '}
      <Link to={paths.plan(hold.planId)} className="text-accent-700 underline underline-offset-2">
        plan #{hold.planId} · {hold.planTitle}
      </Link>
      , planned for {formatDate(hold.plannedOn)}
      {hold.until !== hold.plannedOn && <> (held until {formatDate(hold.until)})</>}
      {hold.reservedQuantity > hold.quantity && (
        <span className="text-ink-600">
          {' '}
          — {formatAmount(hold.reservedQuantity, hold.unit)} was reserved; the rest has been drawn
          since
        </span>
      )}
    </li>
  );
}

/** Each hold: how much, for which plan (linked) and date. */
export function HoldList({ holds, className }: { holds: ContainerHold[]; className?: string }) {
  return (
    <ul className={className ?? 'flex flex-col gap-0.5'}>
      {holds.map((hold) => (
        <HoldLine key={hold.reservationId} hold={hold} />
      ))}
    </ul>
  );
}

/**
 * What plans hold of a container, for which plan and date, and what is free to draw without
 * being asked. Nothing when no plan holds it.
 */
export function ContainerHolds({
  container,
  compact = false,
  ownPlanId = null,
}: {
  container: { quantity: number; unit: string; holds: ContainerHold[] };
  /** One box beside a form (draw dialog, run line) rather than a page section. */
  compact?: boolean;
  /** The plan a run is recorded from: its own holds are taken without a question. */
  ownPlanId?: number | null;
}) {
  if (container.holds.length === 0) return null;
  const free = freeOf(container, ownPlanId);
  const onlyOwn = container.holds.every((hold) => hold.planId === ownPlanId);
  return (
    <section
      aria-label="Held for plans"
      className={
        compact
          ? 'rounded-md border border-warn-200 bg-warn-50 px-3 py-2 text-sm text-warn-700'
          : 'rounded-lg border border-warn-200 bg-warn-50 px-4 py-3 text-sm text-warn-700'
      }
    >
      <p className="flex items-center gap-1.5 font-semibold">
        <Archive aria-hidden="true" className="size-4" />
        Held for {container.holds.length === 1 ? 'a plan' : `${container.holds.length} plans`}
      </p>
      <HoldList holds={container.holds} className="mt-1 flex list-disc flex-col gap-0.5 pl-5" />
      {onlyOwn ? (
        <p className="mt-1">
          This run is recorded from that plan, so it takes the hold without asking.
        </p>
      ) : (
        <p className="mt-1 tabular-nums">
          Free to draw without asking: <strong>{formatAmount(free, container.unit)}</strong>.
          Drawing more asks for confirmation and takes it from the plan.
        </p>
      )}
    </section>
  );
}
