import { ChemError } from './errors';
import { show } from './validation';

/**
 * Split an integer total in minor units (cents) by weights so that the parts add up to
 * exactly the total: the largest remainder method. Each part first gets the whole-cent
 * floor of its share; the cents left over go one each to the largest fractional remainders.
 * Ties go to the larger weight, then to the earlier position, so the same input always
 * gives the same split. A negative total (a refund) is split like its absolute value.
 *
 * splitByWeights(1000, [1, 1, 1]) -> [334, 333, 333]
 *
 * @param totalMinor integer amount in minor units
 * @param weights one weight ≥ 0 per part (grams used, head count…), at least one above 0
 * @throws ChemError `invalid_integer` for a non-integer total, `invalid_weights`
 */
export function splitByWeights(totalMinor: number, weights: readonly number[]): number[] {
  if (!Number.isSafeInteger(totalMinor)) {
    throw new ChemError(
      'invalid_integer',
      `total must be a whole number of minor units (cents), got ${String(totalMinor)}`,
    );
  }
  if (weights.length === 0) {
    throw new ChemError('invalid_weights', 'nothing to split between: give at least one weight');
  }
  weights.forEach((weight, index) => {
    if (typeof weight !== 'number' || !Number.isFinite(weight) || weight < 0) {
      throw new ChemError(
        'invalid_weights',
        `weight ${index + 1} must be a number of 0 or more, got ${String(weight)}`,
      );
    }
  });
  const sum = weights.reduce((a, b) => a + b, 0);
  if (!(sum > 0) || !Number.isFinite(sum)) {
    throw new ChemError(
      'invalid_weights',
      `weights add up to ${show(sum)}: at least one must be above 0`,
    );
  }
  const sign = totalMinor < 0 ? -1 : 1;
  const total = Math.abs(totalMinor);
  const shares = weights.map((weight, index) => {
    let exact = (total * weight) / sum;
    // Snap float noise (2.9999999999 for an exact 3) before taking the floor.
    const nearest = Math.round(exact);
    if (Math.abs(exact - nearest) < 1e-9 * Math.max(1, exact)) exact = nearest;
    const floor = Math.floor(exact);
    return { index, weight, floor, remainder: exact - floor };
  });
  let left = total - shares.reduce((a, share) => a + share.floor, 0);
  const order = [...shares].sort(
    (a, b) => b.remainder - a.remainder || b.weight - a.weight || a.index - b.index,
  );
  const parts = shares.map((share) => share.floor);
  for (let k = 0; left > 0 && order.length > 0; k = (k + 1) % order.length) {
    const share = order[k];
    if (!share) break;
    parts[share.index] = (parts[share.index] ?? 0) + 1;
    left--;
  }
  return parts.map((part) => (part === 0 ? 0 : sign * part));
}

/** How an order's fees are shared (see {@link splitOrderCost}). */
export type OrderFeeRule = 'value' | 'member' | 'mass';

/** One person's (or the lab's, or the unclaimed rest's) part of one order line. */
export interface CostPortion {
  /** Amount of the line's product in this portion, in the line's pack unit; ≥ 0. */
  quantity: number;
  /** Mass of the portion in grams, for the `mass` fee rule (a volume times its density). */
  massG: number;
  /** Who pays: portions with the same key are one member for the `member` rule. */
  payer: string;
}

/** One order line: its price in minor units and how its quantity is divided. */
export interface CostLine {
  totalMinor: number;
  portions: readonly CostPortion[];
}

/** What one portion costs: its part of the line price plus its part of the fees. */
export interface PortionCost {
  goodsMinor: number;
  feesMinor: number;
  amountMinor: number;
}

/**
 * Splits a pooled order's cost over its portions, to the cent.
 *
 * 1. Each line's price is split over its portions in proportion to their quantities
 *    (largest remainder, {@link splitByWeights}), so the portions of a line add up to its price.
 * 2. The fees (shipping, hazardous goods) are split over all portions of all lines:
 *    - `value`: in proportion to each portion's goods amount;
 *    - `mass`: in proportion to each portion's mass in grams;
 *    - `member`: equally per payer, then over that payer's portions by goods amount.
 *    When every weight is 0 (free samples; or nothing but volumes of unknown density) the
 *    fees are split equally over the portions instead.
 *
 * Every portion's `amountMinor` is `goodsMinor + feesMinor`, and all of them add up exactly to
 * the lines' prices plus the fees. Ties go to the earlier portion (lines in order, portions in
 * order), so the same order always splits the same way.
 *
 * @returns per line, per portion, in the order given
 * @throws ChemError `invalid_integer` for non-integer amounts, `invalid_weights` for a line
 *   with portions whose quantities are all 0 or negative
 */
export function splitOrderCost(
  lines: readonly CostLine[],
  feesMinor: number,
  rule: OrderFeeRule,
): PortionCost[][] {
  if (!Number.isSafeInteger(feesMinor) || feesMinor < 0) {
    throw new ChemError(
      'invalid_integer',
      `fees must be a whole number of minor units (cents) of 0 or more, got ${String(feesMinor)}`,
    );
  }
  const goods = lines.map((line, index) => {
    if (line.portions.length === 0) {
      if (line.totalMinor !== 0) {
        throw new ChemError(
          'invalid_weights',
          `line ${index + 1} costs ${String(line.totalMinor)} but has no portion to pay it`,
        );
      }
      return [];
    }
    return splitByWeights(
      line.totalMinor,
      line.portions.map((portion) => portion.quantity),
    );
  });
  const flat = lines.flatMap((line, lineIndex) =>
    line.portions.map((portion, portionIndex) => ({
      portion,
      goods: goods[lineIndex]?.[portionIndex] ?? 0,
    })),
  );
  const fees =
    flat.length === 0 || feesMinor === 0 ? flat.map(() => 0) : feeParts(flat, feesMinor, rule);
  let k = 0;
  return goods.map((lineGoods) =>
    lineGoods.map((goodsMinor) => {
      const feesPart = fees[k++] ?? 0;
      return { goodsMinor, feesMinor: feesPart, amountMinor: goodsMinor + feesPart };
    }),
  );
}

function equalOrBy(weights: number[], total: number): number[] {
  return weights.some((weight) => weight > 0)
    ? splitByWeights(total, weights)
    : splitByWeights(
        total,
        weights.map(() => 1),
      );
}

function feeParts(
  flat: readonly { portion: CostPortion; goods: number }[],
  feesMinor: number,
  rule: OrderFeeRule,
): number[] {
  if (rule === 'value')
    return equalOrBy(
      flat.map((item) => item.goods),
      feesMinor,
    );
  if (rule === 'mass') {
    return equalOrBy(
      flat.map((item) =>
        Number.isFinite(item.portion.massG) ? Math.max(0, item.portion.massG) : 0,
      ),
      feesMinor,
    );
  }
  // member: equal per payer (in order of first appearance), then by value within a payer
  const payers: string[] = [];
  for (const item of flat)
    if (!payers.includes(item.portion.payer)) payers.push(item.portion.payer);
  const perPayer = splitByWeights(
    feesMinor,
    payers.map(() => 1),
  );
  const parts = flat.map(() => 0);
  payers.forEach((payer, payerIndex) => {
    const indices = flat.flatMap((item, index) => (item.portion.payer === payer ? [index] : []));
    const within = equalOrBy(
      indices.map((index) => flat[index]?.goods ?? 0),
      perPayer[payerIndex] ?? 0,
    );
    indices.forEach((index, j) => {
      parts[index] = within[j] ?? 0;
    });
  });
  return parts;
}
