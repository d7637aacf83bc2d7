import { bulkDensityMissingMessage, measuringDensity, type MeasuredMaterial } from './conversions';
import { ChemError } from './errors';
import { convert, parseUnit } from './units';
import { requirePositive, show } from './validation';

/** An id as the caller keeps it (a database id or a code). */
export type PackId = number | string;

/** One catalogue pack a supplier sells. */
export interface CataloguePack {
  id: PackId;
  supplierId: PackId;
  /** Size of one pack in `packUnit` (500 for a 500 g bottle). */
  packSize: number;
  /** Any mass or volume unit {@link parseUnit} accepts: g, kg, mg, mL, L… */
  packUnit: string;
  /** Price of one pack, a whole number of minor units (cents). */
  priceMinor: number;
  /** Shipped as dangerous goods: the supplier's hazardous-goods fee applies. */
  hazardous: boolean;
}

/** What a supplier charges on top of the packs, each a whole number of minor units ≥ 0. */
export interface SupplierFees {
  supplierId: PackId;
  /** Charged once per order. */
  shippingFeeMinor: number;
  /** Charged once per order that holds at least one hazardous pack. */
  hazardousFeeMinor: number;
  /** The supplier takes no order whose packs are worth less than this; 0 for none. */
  minimumOrderMinor: number;
}

/** What to buy and from what. */
export interface PackChoiceInput {
  /** How much to buy, in `unit` (more than 0). */
  quantity: number;
  /** The stock unit the quantity is counted in. */
  unit: 'g' | 'mL';
  packs: readonly CataloguePack[];
  suppliers: readonly SupplierFees[];
  /**
   * The material, for packs sold in the other dimension (a liquid sold by mass, a solid by
   * volume): its {@link measuringDensity} converts them. Without it such packs are skipped.
   */
  material?: MeasuredMaterial;
  /**
   * A combination buying more than this many times the quantity ranks after every
   * combination that does not, however cheap per gram: a club wants what it asked for, not
   * a drum. Default 2. // common practice, no source
   */
  maxOverbuyFactor?: number;
  /** Combinations of more packs than this are not considered. Default 20. */
  maxPacks?: number;
  /**
   * Different packs in one combination at most, default 3 (a line of four pack sizes of one
   * chemical is not how anyone orders; the limit also keeps the search small). 1 gives the
   * best single catalogue item. // common practice, no source
   */
  maxPackKinds?: number;
}

/** How many of one pack a combination takes. */
export interface ChosenPack {
  packId: PackId;
  count: number;
  packSize: number;
  packUnit: string;
  /** One pack in the stock unit (converted through the density when sold in the other). */
  amountPerPack: number;
  priceMinor: number;
  hazardous: boolean;
}

/** A set of packs from one supplier that covers the quantity, with the supplier's fees. */
export interface PackCombination {
  supplierId: PackId;
  /** Largest pack first. */
  packs: ChosenPack[];
  packCount: number;
  /** What the packs hold together, in the stock unit. */
  amount: number;
  /** Packs only. */
  goodsMinor: number;
  shippingFeeMinor: number;
  /** The supplier's hazardous-goods fee when a chosen pack is hazardous, else 0. */
  hazardousFeeMinor: number;
  /** goods + shipping + hazardous-goods fee. */
  totalMinor: number;
  /** totalMinor per g (or per mL) bought: a decimal number of minor units. */
  pricePerUnitMinor: number;
  /** amount ÷ quantity asked for. */
  coverFactor: number;
  /** amount ≤ maxOverbuyFactor × quantity. */
  withinOverbuyLimit: boolean;
  minimumOrderMinor: number;
  /** The packs alone are worth less than the supplier's minimum order. */
  belowMinimumOrder: boolean;
  /** What is missing to reach the minimum order (0 when reached). */
  minimumOrderShortMinor: number;
}

/** A pack or a supplier that could not be used, and why. */
export interface SkippedPack {
  packId: PackId;
  supplierId: PackId;
  reason: string;
}

export interface UncoveredSupplier {
  supplierId: PackId;
  reason: string;
}

/** The outcome of {@link choosePacks}. */
export interface PackChoice {
  quantity: number;
  unit: 'g' | 'mL';
  /** The best combination, or null when no supplier's packs can cover the quantity. */
  chosen: PackCombination | null;
  /** The best combination of every supplier that can cover the quantity, best first. */
  alternatives: PackCombination[];
  /** Packs left out: wrong dimension without a density, unknown unit, bad size or price. */
  skipped: SkippedPack[];
  /** Suppliers with usable packs that cannot cover the quantity within `maxPacks`. */
  uncovered: UncoveredSupplier[];
  /** The rule, in words, for the page. */
  rule: string;
}

// Amounts are compared as whole millionths of the stock unit, as the ledger stores them, so
// that sums of packs are exact and ties are real ties.
const MICRO = 1_000_000;

/** Combinations examined per supplier before the search stops (a safety bound). */
const MAX_COMBINATIONS = 200_000;

export const PACK_CHOICE_RULE =
  'Packs from one supplier (up to three kinds) that together cover the quantity, no pack more than needed; ' +
  'the lowest price per g (or mL) including shipping and, when a pack is hazardous, the ' +
  'hazardous-goods fee wins. Buying more than the overbuy limit ranks last. Ties go to the ' +
  'lower total, then fewer packs, then the supplier and packs listed first.';

interface UsablePack {
  pack: CataloguePack;
  amountMicro: number;
  position: number;
}

interface Candidate {
  fees: SupplierFees;
  supplierPosition: number;
  counts: { usable: UsablePack; count: number }[];
  amountMicro: number;
  packCount: number;
  goodsMinor: number;
  totalMinor: number;
  within: boolean;
  /** Pack positions, for the last tie-break. */
  key: number[];
}

function isMinorAmount(value: unknown): value is number {
  return typeof value === 'number' && Number.isSafeInteger(value) && value >= 0;
}

function requireFee(value: number, what: string, supplierId: PackId): number {
  if (!isMinorAmount(value)) {
    throw new ChemError(
      'invalid_integer',
      `supplier ${String(supplierId)}: ${what} must be a whole number of minor units (cents) of 0 or more, got ${String(value)}`,
    );
  }
  return value;
}

/** One pack in the stock unit, or why it cannot be counted in it. */
function packAmount(
  pack: CataloguePack,
  unit: 'g' | 'mL',
  material: MeasuredMaterial | undefined,
): { amount: number } | { reason: string } {
  if (typeof pack.packSize !== 'number' || !Number.isFinite(pack.packSize) || pack.packSize <= 0) {
    return { reason: `pack size must be more than 0, got ${String(pack.packSize)}` };
  }
  if (!isMinorAmount(pack.priceMinor)) {
    return {
      reason: `price must be a whole number of minor units (cents) of 0 or more, got ${String(pack.priceMinor)}`,
    };
  }
  let packUnit;
  try {
    packUnit = parseUnit(pack.packUnit);
  } catch (error) {
    if (error instanceof ChemError) return { reason: error.message };
    throw error;
  }
  const target = unit === 'g' ? 'mass' : 'volume';
  if (packUnit.dimension === target) {
    return { amount: convert(pack.packSize, packUnit.symbol, unit) };
  }
  if (packUnit.dimension === 'amount') {
    return { reason: `sold in ${packUnit.symbol}: an amount of substance is not a pack size` };
  }
  const density = material ? measuringDensity(material) : null;
  const sold = `${show(pack.packSize)} ${packUnit.symbol}`;
  if (density === null || !(density > 0)) {
    return {
      reason:
        material?.physicalState === 'solid'
          ? bulkDensityMissingMessage(sold, unit)
          : `density missing: ${sold} cannot be counted in ${unit} without the density (g/mL)`,
    };
  }
  const base = convert(pack.packSize, packUnit.symbol, packUnit.dimension === 'mass' ? 'g' : 'mL');
  return { amount: packUnit.dimension === 'mass' ? base / density : base * density };
}

/** Exact comparison of two prices per unit: a.total / a.amount against b.total / b.amount. */
function comparePerUnit(a: Candidate, b: Candidate): number {
  const left = BigInt(a.totalMinor) * BigInt(b.amountMicro);
  const right = BigInt(b.totalMinor) * BigInt(a.amountMicro);
  return left < right ? -1 : left > right ? 1 : 0;
}

function compareKeys(a: number[], b: number[]): number {
  for (let i = 0; i < Math.min(a.length, b.length); i++) {
    const d = (a[i] ?? 0) - (b[i] ?? 0);
    if (d !== 0) return d;
  }
  return a.length - b.length;
}

/** The ranking: within the overbuy limit, per unit, total, pack count, supplier, packs. */
function compareCandidates(a: Candidate, b: Candidate): number {
  if (a.within !== b.within) return a.within ? -1 : 1;
  return (
    comparePerUnit(a, b) ||
    a.totalMinor - b.totalMinor ||
    a.packCount - b.packCount ||
    a.supplierPosition - b.supplierPosition ||
    compareKeys(a.key, b.key)
  );
}

/**
 * Choose the catalogue packs that cover a quantity at the lowest price per g (or per mL),
 * the supplier's fees included. A combination takes packs of one supplier only (one order
 * goes to one supplier): its shipping fee counts once, its hazardous-goods fee once when any
 * chosen pack is hazardous. Only combinations in which every pack is needed are considered
 * (taking any one pack away leaves the quantity uncovered), of at most `maxPackKinds` packs.
 *
 * Ranking, deterministic: combinations within the overbuy limit first; then the lower price
 * per unit (compared exactly as integers); then the lower total; then fewer packs; then the
 * supplier listed first in `suppliers`; then the packs listed first in `packs`.
 *
 * A supplier's minimum order is compared with the packs alone (fees not counted) and
 * reported, not enforced: a shared order usually holds other lines that reach it.
 *
 * Example: 450 g from 500 g packs at 40.00 with 12.00 shipping is 5200 minor for 500 g,
 * 10.4 minor per g.
 *
 * @throws ChemError `not_positive` (quantity), `invalid_integer` (a supplier's fee),
 *   `out_of_range` (maxOverbuyFactor below 1, maxPacks not a whole number ≥ 1)
 */
export function choosePacks(input: PackChoiceInput): PackChoice {
  const quantity = requirePositive(input.quantity, 'quantity to buy');
  const unit = input.unit;
  if (unit !== 'g' && unit !== 'mL') {
    throw new ChemError('unknown_unit', `quantity to buy must be in g or mL, got ${String(unit)}`);
  }
  const factor = input.maxOverbuyFactor ?? 2;
  if (!Number.isFinite(factor) || factor < 1) {
    throw new ChemError('out_of_range', `overbuy limit must be 1 or more, got ${show(factor)}`);
  }
  const maxPacks = input.maxPacks ?? 20;
  if (!Number.isSafeInteger(maxPacks) || maxPacks < 1) {
    throw new ChemError('out_of_range', `pack limit must be a whole number of 1 or more`);
  }
  const maxKinds = input.maxPackKinds ?? 3;
  if (!Number.isSafeInteger(maxKinds) || maxKinds < 1) {
    throw new ChemError('out_of_range', `pack kinds limit must be a whole number of 1 or more`);
  }
  const quantityMicro = Math.round(quantity * MICRO);
  const limitMicro = factor * quantityMicro;

  const fees = new Map<PackId, { fees: SupplierFees; position: number }>();
  input.suppliers.forEach((supplier, position) => {
    requireFee(supplier.shippingFeeMinor, 'shipping fee', supplier.supplierId);
    requireFee(supplier.hazardousFeeMinor, 'hazardous-goods fee', supplier.supplierId);
    requireFee(supplier.minimumOrderMinor, 'minimum order', supplier.supplierId);
    if (!fees.has(supplier.supplierId)) fees.set(supplier.supplierId, { fees: supplier, position });
  });

  const skipped: SkippedPack[] = [];
  const bySupplier = new Map<PackId, UsablePack[]>();
  input.packs.forEach((pack, position) => {
    if (!fees.has(pack.supplierId)) {
      skipped.push({
        packId: pack.id,
        supplierId: pack.supplierId,
        reason: `no fees known for supplier ${String(pack.supplierId)}`,
      });
      return;
    }
    const sized = packAmount(pack, unit, input.material);
    if ('reason' in sized) {
      skipped.push({ packId: pack.id, supplierId: pack.supplierId, reason: sized.reason });
      return;
    }
    const amountMicro = Math.round(sized.amount * MICRO);
    if (amountMicro <= 0) {
      skipped.push({
        packId: pack.id,
        supplierId: pack.supplierId,
        reason: `pack holds less than a millionth of a ${unit}`,
      });
      return;
    }
    const list = bySupplier.get(pack.supplierId) ?? [];
    list.push({ pack, amountMicro, position });
    bySupplier.set(pack.supplierId, list);
  });

  const best: Candidate[] = [];
  const uncovered: UncoveredSupplier[] = [];
  const suppliersInOrder = [...bySupplier.entries()].sort(
    (a, b) => (fees.get(a[0])?.position ?? 0) - (fees.get(b[0])?.position ?? 0),
  );
  for (const [supplierId, usable] of suppliersInOrder) {
    const entry = fees.get(supplierId);
    if (!entry) continue;
    const found = bestForSupplier(usable, entry, quantityMicro, limitMicro, maxPacks, maxKinds);
    if (found) best.push(found);
    else {
      uncovered.push({
        supplierId,
        reason: `the quantity needs more than ${maxPacks} packs from this supplier`,
      });
    }
  }
  best.sort(compareCandidates);
  const alternatives = best.map((candidate) => present(candidate, quantity));
  return {
    quantity,
    unit,
    chosen: alternatives[0] ?? null,
    alternatives,
    skipped,
    uncovered,
    rule: PACK_CHOICE_RULE,
  };
}

function bestForSupplier(
  usable: UsablePack[],
  entry: { fees: SupplierFees; position: number },
  quantityMicro: number,
  limitMicro: number,
  maxPacks: number,
  maxKinds: number,
): Candidate | null {
  // Largest pack first, then cheaper, then listed first: the search order is fixed.
  const types = [...usable].sort(
    (a, b) =>
      b.amountMicro - a.amountMicro ||
      a.pack.priceMinor - b.pack.priceMinor ||
      a.position - b.position,
  );
  const counts = types.map(() => 0);
  let best: Candidate | null = null;
  let examined = 0;

  const consider = () => {
    examined++;
    let amountMicro = 0;
    let goodsMinor = 0;
    let packCount = 0;
    let hazardous = false;
    const chosen: Candidate['counts'] = [];
    types.forEach((type, index) => {
      const count = counts[index] ?? 0;
      if (count === 0) return;
      amountMicro += count * type.amountMicro;
      goodsMinor += count * type.pack.priceMinor;
      packCount += count;
      hazardous ||= type.pack.hazardous;
      chosen.push({ usable: type, count });
    });
    const totalMinor =
      goodsMinor + entry.fees.shippingFeeMinor + (hazardous ? entry.fees.hazardousFeeMinor : 0);
    const candidate: Candidate = {
      fees: entry.fees,
      supplierPosition: entry.position,
      counts: chosen,
      amountMicro,
      packCount,
      goodsMinor,
      totalMinor,
      within: amountMicro <= limitMicro,
      key: chosen.flatMap(({ usable: type, count }) => Array<number>(count).fill(type.position)),
    };
    if (!best || compareCandidates(candidate, best) < 0) best = candidate;
  };

  // Every leaf is a cover in which each pack is needed: the last type taken is the smallest
  // chosen, and it is taken only as often as needed to reach the quantity.
  const search = (index: number, amountMicro: number, packCount: number, sizes: number) => {
    if (examined >= MAX_COMBINATIONS) return;
    if (amountMicro >= quantityMicro) {
      consider();
      return;
    }
    const type = types[index];
    if (!type || packCount >= maxPacks || sizes >= maxKinds) return;
    const needed = Math.ceil((quantityMicro - amountMicro) / type.amountMicro);
    const most = Math.min(needed, maxPacks - packCount);
    for (let count = most; count >= 0; count--) {
      counts[index] = count;
      search(
        index + 1,
        amountMicro + count * type.amountMicro,
        packCount + count,
        sizes + (count > 0 ? 1 : 0),
      );
    }
    counts[index] = 0;
  };
  search(0, 0, 0, 0);
  return best;
}

function present(candidate: Candidate, quantity: number): PackCombination {
  const fees = candidate.fees;
  const hazardous = candidate.counts.some(({ usable }) => usable.pack.hazardous);
  const amount = candidate.amountMicro / MICRO;
  const short = Math.max(0, fees.minimumOrderMinor - candidate.goodsMinor);
  return {
    supplierId: fees.supplierId,
    packs: candidate.counts.map(({ usable, count }) => ({
      packId: usable.pack.id,
      count,
      packSize: usable.pack.packSize,
      packUnit: usable.pack.packUnit,
      amountPerPack: usable.amountMicro / MICRO,
      priceMinor: usable.pack.priceMinor,
      hazardous: usable.pack.hazardous,
    })),
    packCount: candidate.packCount,
    amount,
    goodsMinor: candidate.goodsMinor,
    shippingFeeMinor: fees.shippingFeeMinor,
    hazardousFeeMinor: hazardous ? fees.hazardousFeeMinor : 0,
    totalMinor: candidate.totalMinor,
    pricePerUnitMinor: (candidate.totalMinor * MICRO) / candidate.amountMicro,
    coverFactor: amount / quantity,
    withinOverbuyLimit: candidate.within,
    minimumOrderMinor: fees.minimumOrderMinor,
    belowMinimumOrder: short > 0,
    minimumOrderShortMinor: short,
  };
}
