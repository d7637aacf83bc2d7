import { ChemError } from './errors';
import { requireFinite, requireNonNegative } from './validation';

/** A stock balance at a moment: quantity in any one unit (the same for all balances). */
export interface DatedBalance {
  /** A Date, or an ISO 8601 string such as "2025-03-01" or "2025-03-01T09:30:00Z". */
  at: Date | string;
  quantity: number;
}

/** Consumption worked out from dated balances. */
export interface ConsumptionRate {
  /** Quantity used per day, or null when the history is too short to tell. */
  ratePerDay: number | null;
  /** Sum of the decreases between consecutive balances. */
  consumed: number;
  /** Sum of the increases (deliveries), which are not consumption. */
  received: number;
  /** Days between the first and the last balance. */
  spanDays: number;
  /** The latest balance, or null for an empty history. */
  latest: { at: Date; quantity: number } | null;
  /** Why ratePerDay is null. */
  reason?: 'fewer than two balances' | 'all balances at the same time';
}

const DAY_MS = 86_400_000;

function toDate(at: Date | string, index: number): Date {
  const date = at instanceof Date ? at : new Date(at);
  if (Number.isNaN(date.getTime())) {
    throw new ChemError(
      'invalid_date',
      `balance ${index + 1}: "${String(at)}" is not a date; use a form such as 2025-03-01`,
    );
  }
  return date;
}

/**
 * Consumption rate from dated balances: the decreases between consecutive balances (in date
 * order) over the days covered. Increases are deliveries and are left out, so a delivery
 * between two balances hides whatever was used in that interval: feed balances that follow
 * each movement for the best estimate.
 *
 * @throws ChemError `invalid_date`, `negative_quantity`, `not_a_number`
 */
export function consumptionRate(balances: readonly DatedBalance[]): ConsumptionRate {
  const points = balances
    .map((balance, index) => ({
      at: toDate(balance.at, index),
      quantity: requireNonNegative(balance.quantity, `balance ${index + 1}`),
      index,
    }))
    .sort((a, b) => a.at.getTime() - b.at.getTime() || a.index - b.index);
  let consumed = 0;
  let received = 0;
  for (let i = 1; i < points.length; i++) {
    const change = (points[i]?.quantity ?? 0) - (points[i - 1]?.quantity ?? 0);
    if (change < 0) consumed -= change;
    else received += change;
  }
  const first = points[0];
  const last = points[points.length - 1];
  const latest = last ? { at: last.at, quantity: last.quantity } : null;
  const spanDays = first && last ? (last.at.getTime() - first.at.getTime()) / DAY_MS : 0;
  if (points.length < 2) {
    return {
      ratePerDay: null,
      consumed,
      received,
      spanDays,
      latest,
      reason: 'fewer than two balances',
    };
  }
  if (spanDays === 0) {
    return {
      ratePerDay: null,
      consumed,
      received,
      spanDays,
      latest,
      reason: 'all balances at the same time',
    };
  }
  return { ratePerDay: consumed / spanDays, consumed, received, spanDays, latest };
}

/**
 * Days until the stock falls to a threshold (0 by default; pass the reorder point to get
 * days until reordering) at a consumption rate. Null when nothing is being used (rate null
 * or 0): the stock is not running out. 0 when already at or below the threshold.
 *
 * @throws ChemError `negative_quantity`, `not_a_number`
 */
export function daysOfStockLeft(
  currentQuantity: number,
  ratePerDay: number | null,
  threshold = 0,
): number | null {
  requireNonNegative(currentQuantity, 'current quantity');
  requireNonNegative(threshold, 'threshold');
  if (ratePerDay === null) return null;
  requireFinite(ratePerDay, 'consumption rate');
  if (ratePerDay <= 0) return null;
  return Math.max(0, (currentQuantity - threshold) / ratePerDay);
}

/** Consumption rate plus how long the latest balance lasts. */
export interface StockForecast extends ConsumptionRate {
  /** Days from the latest balance until the threshold is reached, or null. */
  daysLeft: number | null;
  /** The moment the threshold is reached at this rate, or null. */
  runsOutAt: Date | null;
}

/**
 * {@link consumptionRate} and {@link daysOfStockLeft} for the latest balance, with the date
 * the stock reaches the threshold (0 by default, or the reorder point).
 */
export function forecastStock(balances: readonly DatedBalance[], threshold = 0): StockForecast {
  const rate = consumptionRate(balances);
  const daysLeft = rate.latest
    ? daysOfStockLeft(rate.latest.quantity, rate.ratePerDay, threshold)
    : null;
  const runsOutAt =
    daysLeft === null || !rate.latest
      ? null
      : new Date(rate.latest.at.getTime() + daysLeft * DAY_MS);
  return { ...rate, daysLeft, runsOutAt };
}
