/**
 * How the packs of an order line are shared out: shares take from the packs in turn (lowest
 * share id first), so a share of whole packs gets whole packs and part-pack shares fill a pack
 * before the next is opened. A share that spans two packs gets a portion from each.
 */

/** Quantities are kept in whole millionths (db/quantities): anything below is rounding. */
const epsilon = 1e-6;

export interface PortionShare {
  id: number;
  quantity: number;
}

export interface PackPortion<S extends PortionShare> {
  share: S;
  /** In the line's pack unit. */
  quantity: number;
}

export interface PackPlan<S extends PortionShare> {
  portions: PackPortion<S>[];
  /** Pack-unit amount no share takes from this pack. */
  rest: number;
}

/** The portions of each of `packs` packs of `packSize`; throws when the shares need more. */
export function planPacks<S extends PortionShare>(
  packs: number,
  packSize: number,
  shares: readonly S[],
): PackPlan<S>[] {
  const plans: PackPlan<S>[] = Array.from({ length: packs }, () => ({
    portions: [],
    rest: packSize,
  }));
  let pack = 0;
  for (const share of [...shares].sort((a, b) => a.id - b.id)) {
    let wanted = share.quantity;
    while (wanted > epsilon) {
      const plan = plans[pack];
      if (!plan) throw new RangeError('The shares take more than the packs hold.');
      const taken = Math.min(wanted, plan.rest);
      if (taken > epsilon) plan.portions.push({ share, quantity: taken });
      plan.rest -= taken;
      wanted -= taken;
      if (plan.rest <= epsilon) {
        plan.rest = 0;
        pack++;
      }
    }
  }
  return plans;
}
