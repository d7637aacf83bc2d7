import {
  choosePacks,
  convert,
  dimensionOf,
  measuringDensity,
  type MeasuredMaterial,
  type PackChoice,
  type PackCombination,
} from '@lotwise/chem';
import type { PackOffer, StockUnit } from '@lotwise/shared';
import type { OfferRow, PendingLineRow } from './reorder.repository';

/**
 * An amount in a pack's unit turned into the chemical's stock unit (or back): by units alone
 * within a dimension, through the measuring density (bulk density for a solid) across.
 * Null when that density is not known.
 */
export function convertAmount(
  value: number,
  from: string,
  to: string,
  material: MeasuredMaterial,
): number | null {
  const source = dimensionOf(from);
  const target = dimensionOf(to);
  if (source === target) return convert(value, from, to);
  const density = measuringDensity(material);
  if (density === null || !(density > 0)) return null;
  if (source === 'mass' && target === 'volume')
    return convert(convert(value, from, 'g') / density, 'mL', to);
  if (source === 'volume' && target === 'mass')
    return convert(convert(value, from, 'mL') * density, 'g', to);
  return null;
}

/** What the pending order lines of one chemical hold, in its stock unit (unconvertible left out). */
export function onOrderAmount(
  lines: readonly PendingLineRow[],
  unit: StockUnit,
  material: MeasuredMaterial,
): number {
  let total = 0;
  for (const line of lines) {
    const amount = convertAmount(line.packs * line.packSize, line.packUnit, unit, material);
    if (amount !== null) total += amount;
  }
  return Math.round(total * 1e6) / 1e6;
}

/** The catalogue's packs and the suppliers' fees for {@link choosePacks}. */
export function choosePacksFrom(
  offers: readonly OfferRow[],
  quantity: number,
  unit: StockUnit,
  material: MeasuredMaterial,
  options: { maxPackKinds?: number } = {},
): PackChoice {
  const suppliers = new Map<number, OfferRow>();
  for (const offer of offers)
    if (!suppliers.has(offer.supplierId)) suppliers.set(offer.supplierId, offer);
  return choosePacks({
    ...options,
    quantity,
    unit,
    material,
    packs: offers.map((offer) => ({
      id: offer.catalogItemId,
      supplierId: offer.supplierId,
      packSize: offer.packSize,
      packUnit: offer.packUnit,
      priceMinor: offer.priceMinor,
      hazardous: offer.hazardous,
    })),
    suppliers: [...suppliers.values()].map((offer) => ({
      supplierId: offer.supplierId,
      shippingFeeMinor: offer.shippingFeeMinor,
      hazardousFeeMinor: offer.hazardousFeeMinor,
      minimumOrderMinor: offer.minimumOrderMinor,
    })),
  });
}

/** A combination from packages/chem as the API presents it. */
export function presentOffer(combination: PackCombination, offers: readonly OfferRow[]): PackOffer {
  const byId = new Map(offers.map((offer) => [offer.catalogItemId, offer]));
  const supplierId = Number(combination.supplierId);
  const supplierName = offers.find((offer) => offer.supplierId === supplierId)?.supplierName ?? '';
  return {
    supplier: { id: supplierId, name: supplierName },
    packs: combination.packs.map((pack) => ({
      catalogItemId: Number(pack.packId),
      supplierSku: byId.get(Number(pack.packId))?.sku ?? '',
      count: pack.count,
      packSize: pack.packSize,
      packUnit: pack.packUnit,
      amountPerPack: pack.amountPerPack,
      priceMinor: pack.priceMinor,
      hazardous: pack.hazardous,
    })),
    packCount: combination.packCount,
    amount: combination.amount,
    goodsMinor: combination.goodsMinor,
    shippingFeeMinor: combination.shippingFeeMinor,
    hazardousFeeMinor: combination.hazardousFeeMinor,
    totalMinor: combination.totalMinor,
    pricePerUnitMinor: combination.pricePerUnitMinor,
    withinOverbuyLimit: combination.withinOverbuyLimit,
    minimumOrderMinor: combination.minimumOrderMinor,
    belowMinimumOrder: combination.belowMinimumOrder,
    minimumOrderShortMinor: combination.minimumOrderShortMinor,
  };
}

/** Why a pack choice offers nothing, and which catalogue items were left out, in words. */
export function choiceNotes(choice: PackChoice, offers: readonly OfferRow[]): string[] {
  const byId = new Map(offers.map((offer) => [offer.catalogItemId, offer]));
  const notes = choice.skipped.map((skip) => {
    const offer = byId.get(Number(skip.packId));
    return `${offer?.supplierName ?? 'Supplier'} ${offer?.sku ?? ''}: ${skip.reason}`.replace(
      '  ',
      ' ',
    );
  });
  for (const supplier of choice.uncovered) {
    const name = offers.find(
      (offer) => offer.supplierId === Number(supplier.supplierId),
    )?.supplierName;
    notes.push(`${name ?? 'Supplier'}: ${supplier.reason}`);
  }
  return notes;
}
