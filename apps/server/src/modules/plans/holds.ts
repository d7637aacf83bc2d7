import {
  allocateHolds,
  formatDate,
  formatQuantity,
  holdsTakenBy,
  type ContainerHold,
  type HoldWarning,
  type StockUnit,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import type { HoldRow } from './plans.repository';

/** Below this a hold is not worth a question (quantities are kept to a millionth). */
const tolerance = 1e-6;

function amount(value: number, unit: StockUnit): string {
  return formatQuantity(value, unit);
}

function byContainer(rows: HoldRow[]): Map<number, HoldRow[]> {
  const map = new Map<number, HoldRow[]>();
  for (const row of rows) map.set(row.containerId, [...(map.get(row.containerId) ?? []), row]);
  return map;
}

/**
 * What plans hold of each container now: the reservations in force, each never more than is
 * left of it (see `allocateHolds`), oldest first; holds drawn down to nothing are left out.
 */
export async function holdsOfContainers(
  repos: Repositories,
  containers: readonly { id: number; quantity: number }[],
  today: string,
): Promise<Map<number, ContainerHold[]>> {
  const rows = byContainer(
    await repos.plans.holdsOn(
      containers.map((c) => c.id),
      today,
    ),
  );
  const result = new Map<number, ContainerHold[]>();
  for (const container of containers) {
    const claims = rows.get(container.id) ?? [];
    const held = allocateHolds(container.quantity, claims);
    result.set(
      container.id,
      claims
        .map((claim) => ({
          reservationId: claim.id,
          planId: claim.planId,
          planTitle: claim.planTitle,
          plannedOn: claim.plannedOn,
          until: claim.until,
          quantity: held.get(claim.id) ?? 0,
          reservedQuantity: claim.quantity,
          unit: claim.unit,
        }))
        .filter((hold) => hold.quantity > tolerance),
    );
  }
  return result;
}

/**
 * What each of these reservations holds now (reservations not in force on `today` keep what
 * they were made with): in force, never more than is left of it in its container.
 */
export async function heldNowOf(
  repos: Repositories,
  reservations: readonly { id: number; containerId: number; containerQuantity: number }[],
  today: string,
): Promise<Map<number, number>> {
  const quantities = new Map(reservations.map((r) => [r.containerId, r.containerQuantity]));
  const rows = byContainer(await repos.plans.holdsOn([...quantities.keys()], today));
  const held = new Map<number, number>();
  for (const [containerId, claims] of rows) {
    for (const [id, amount] of allocateHolds(quantities.get(containerId) ?? 0, claims)) {
      held.set(id, amount);
    }
  }
  return held;
}

/** A draw from one container, in its stock unit. */
export interface PlannedDraw {
  container: { id: number; labelCode: string; quantity: number; unit: StockUnit };
  drawn: number;
}

/**
 * What draws would take from plans' holds: one warning per plan and container that would be
 * left less than it holds. Draws from one container add up. The plan of `exceptPlanId` (a run
 * recorded from it, whose holds are released by the recording) is not protected from itself.
 */
export async function holdWarningsFor(
  repos: Repositories,
  draws: readonly PlannedDraw[],
  options: { today: string; exceptPlanId?: number | null },
): Promise<HoldWarning[]> {
  const totals = new Map<number, PlannedDraw>();
  for (const draw of draws) {
    const seen = totals.get(draw.container.id);
    totals.set(draw.container.id, {
      container: seen?.container ?? draw.container,
      drawn: (seen?.drawn ?? 0) + draw.drawn,
    });
  }
  const rows = byContainer(await repos.plans.holdsOn([...totals.keys()], options.today));
  const warnings: HoldWarning[] = [];
  for (const { container, drawn } of totals.values()) {
    const claims = (rows.get(container.id) ?? []).filter(
      (claim) => claim.planId !== options.exceptPlanId,
    );
    const taken = holdsTakenBy(container.quantity, drawn, claims, tolerance);
    for (const claim of claims) {
      const change = taken.get(claim.id);
      if (!change) continue;
      const [heldBefore, heldAfter] = change;
      const loses = heldBefore - heldAfter;
      warnings.push({
        kind: 'hold',
        message:
          `${amount(heldBefore, container.unit)} of ${container.labelCode} is held for plan #${claim.planId} ` +
          `(${claim.planTitle}, planned for ${formatDate(claim.plannedOn)}); this draw leaves it ` +
          `${amount(heldAfter, container.unit)}, so that plan loses ${amount(loses, container.unit)}.`,
        planId: claim.planId,
        planTitle: claim.planTitle,
        plannedOn: claim.plannedOn,
        until: claim.until,
        containerId: container.id,
        labelCode: container.labelCode,
        heldBefore,
        heldAfter,
        loses,
        unit: container.unit,
      });
    }
  }
  return warnings;
}

/**
 * Refuses (409 `confirmation_required`, nothing written) draws that take from plans' holds
 * unless the person confirmed; the warnings name each plan and what it loses.
 */
export async function requireHoldsConfirmed(
  repos: Repositories,
  draws: readonly PlannedDraw[],
  options: { today: string; exceptPlanId?: number | null; confirmed: boolean },
): Promise<void> {
  if (options.confirmed) return;
  const warnings = await holdWarningsFor(repos, draws, options);
  if (warnings.length === 0) return;
  const plans = [...new Set(warnings.map((w) => `#${w.planId}`))].join(', ');
  throw AppError.confirmationRequired(
    `This takes stock held for plan ${plans}. ${warnings.map((w) => w.message).join(' ')} Nothing was recorded: confirm to draw anyway.`,
    warnings,
  );
}
