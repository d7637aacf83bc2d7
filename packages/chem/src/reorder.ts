import { daysOfStockLeft } from './consumption';
import { ChemError } from './errors';
import { reorderState } from './stock';
import { requireFinite, requireNonNegative, requirePositive, show } from './validation';

/** What {@link planReorder} works from; quantities in the chemical's stock unit. */
export interface ReorderInput {
  /** Usable stock now. */
  onHand: number;
  /** Use per day ({@link consumptionRate}), or null when there is no history of use. */
  ratePerDay: number | null;
  /** Reorder when the stock is at or below this. */
  reorderPoint: number;
  /** Buy this much at a time (a fixed reorder quantity). */
  reorderQuantity?: number | null;
  /** Or: buy up to this level (must lie above the reorder point). */
  targetLevel?: number | null;
  /** Today: the dates are counted from here. A Date or an ISO 8601 string. */
  asOf: Date | string;
}

/** How the quantity to buy was found. */
export type ReorderRule = 'reorder-quantity' | 'target-level' | 'none';

/** When the stock runs low, and how much to buy. */
export interface ReorderPlan {
  /** Days until the stock is used up at the rate; null when nothing is being used. */
  daysLeft: number | null;
  /** Days until the reorder point is reached: 0 when at or below it; null when nothing is used. */
  daysToReorderPoint: number | null;
  /** The day the stock is used up, or null. */
  emptyOn: Date | null;
  /** The day the reorder point is reached (`asOf` when already reached), or null. */
  reorderPointOn: Date | null;
  /** At or below the reorder point now: time to buy. */
  due: boolean;
  /**
   * What to buy when the reorder point is reached (now, when `due`): null when neither a
   * reorder quantity nor a target level is known.
   */
  quantityToBuy: number | null;
  rule: ReorderRule;
}

const DAY_MS = 86_400_000;

function toDate(at: Date | string): Date {
  const date = at instanceof Date ? new Date(at.getTime()) : new Date(at);
  if (Number.isNaN(date.getTime())) {
    throw new ChemError(
      'invalid_date',
      `"${String(at)}" is not a date; use a form such as 2025-03-01`,
    );
  }
  return date;
}

/**
 * Days of stock left, the day the reorder point is reached and the quantity to buy.
 *
 * The quantity is bought when the stock reaches the reorder point, so it is worked out from
 * what is on hand then: the current stock when already at or below the reorder point,
 * otherwise the reorder point itself.
 * - With a reorder quantity Q: the smallest whole number of Q that lifts the stock above
 *   the reorder point (one Q normally; two or more when the stock has fallen far below).
 *   // common practice, no source
 * - With a target level S: S minus the stock at that moment (order up to S).
 *   // common practice, no source
 * - With neither: null (the lab has not said how much it buys).
 *
 * Example: 300 g on hand, 10 g used a day, reorder point 100 g, reorder quantity 500 g:
 * 30 days left, reorder point in 20 days, buy 500 g.
 *
 * @throws ChemError `negative_quantity`, `not_a_number`, `not_positive` (reorder quantity),
 *   `conflicting_inputs` (both a reorder quantity and a target level), `out_of_range`
 *   (target level not above the reorder point), `invalid_date`
 */
export function planReorder(input: ReorderInput): ReorderPlan {
  const onHand = requireNonNegative(input.onHand, 'stock on hand');
  const reorderPoint = requireNonNegative(input.reorderPoint, 'reorder point');
  const asOf = toDate(input.asOf);
  if (input.ratePerDay !== null) requireFinite(input.ratePerDay, 'consumption rate');
  const quantity = input.reorderQuantity ?? null;
  const target = input.targetLevel ?? null;
  if (quantity !== null && target !== null) {
    throw new ChemError(
      'conflicting_inputs',
      'give either a reorder quantity or a target level, not both',
    );
  }
  if (quantity !== null) requirePositive(quantity, 'reorder quantity');
  if (target !== null) {
    requireFinite(target, 'target level');
    if (target <= reorderPoint) {
      throw new ChemError(
        'out_of_range',
        `target level (${show(target)}) must be above the reorder point (${show(reorderPoint)})`,
      );
    }
  }

  const state = reorderState(onHand, reorderPoint);
  const due = state === 'below' || state === 'at';
  const daysLeft = daysOfStockLeft(onHand, input.ratePerDay);
  const daysToReorderPoint = due ? 0 : daysOfStockLeft(onHand, input.ratePerDay, reorderPoint);
  const after = (days: number | null) =>
    days === null ? null : new Date(asOf.getTime() + days * DAY_MS);

  const stockAtOrder = due ? onHand : reorderPoint;
  let quantityToBuy: number | null = null;
  let rule: ReorderRule = 'none';
  if (quantity !== null) {
    let times = Math.max(1, Math.floor((reorderPoint - stockAtOrder) / quantity) + 1);
    // Float noise (99.7 + 3 × 0.1) can leave the stock just at the point: one Q more then.
    if (reorderState(stockAtOrder + times * quantity, reorderPoint) !== 'ok') times++;
    quantityToBuy = times * quantity;
    rule = 'reorder-quantity';
  } else if (target !== null) {
    quantityToBuy = target - stockAtOrder;
    rule = 'target-level';
  }
  return {
    daysLeft,
    daysToReorderPoint,
    emptyOn: after(daysLeft),
    reorderPointOn: due ? asOf : after(daysToReorderPoint),
    due,
    quantityToBuy,
    rule,
  };
}
