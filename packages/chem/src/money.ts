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
