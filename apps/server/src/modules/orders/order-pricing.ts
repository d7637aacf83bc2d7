import { splitOrderCost, toBaseUnit, type CostPortion } from '@lotwise/chem';
import type { OrderLineRow } from './order-line.entity';
import type { OrderRow } from './order.entity';
import type { OrderShareRow } from './order-share.entity';

/**
 * What an order costs and who pays what: the one place an order's money is worked out. The
 * order page, checkout, refunds, receipts and exports all read these numbers.
 */

/** An order line with what pricing needs of its chemical. */
export interface PricedLineInput extends Pick<
  OrderLineRow,
  'id' | 'packs' | 'packSize' | 'packUnit' | 'unitPriceMinor' | 'hazardous'
> {
  /** g/mL, to weigh a liquid's share for the `mass` fee rule; null when unknown. */
  densityGPerMl: number | null;
}

export type PricedShareInput = Pick<
  OrderShareRow,
  'id' | 'lineId' | 'userId' | 'forLab' | 'quantity'
>;

export interface ShareCost {
  shareId: number;
  goodsMinor: number;
  feesMinor: number;
  amountMinor: number;
}

export interface LineCost {
  lineId: number;
  totalMinor: number;
  /** Pack-unit amount nobody has claimed yet. */
  unclaimedQuantity: number;
  /** Its part of the line price and of the fees, while it is unclaimed. */
  unclaimedMinor: number;
}

export interface OrderCost {
  currency: string;
  goodsMinor: number;
  shippingFeeMinor: number;
  /** The supplier's hazardous-goods fee, when a line is hazardous; otherwise 0. */
  hazardousFeeMinor: number;
  feesMinor: number;
  /** Goods plus fees: what the supplier is paid, and what the shares add up to when all is claimed. */
  totalMinor: number;
  lines: LineCost[];
  shares: ShareCost[];
  /** The part of the total no share pays yet (0 once claims are closed). */
  unclaimedMinor: number;
}

const unclaimedPayer = 'unclaimed';
/** Quantities are kept in whole millionths (db/quantities): anything below is rounding. */
const quantityEpsilon = 1e-6;

function massInGrams(quantity: number, line: PricedLineInput): number {
  const base = toBaseUnit({ value: quantity, unit: line.packUnit });
  if (base.dimension === 'mass') return base.value;
  if (base.dimension === 'volume' && line.densityGPerMl !== null) {
    return base.value * line.densityGPerMl;
  }
  return 0;
}

/**
 * The cost of an order as it stands: each line's price split over its shares by quantity,
 * the fees split over the shares by the order's fee rule, and the unclaimed rest of each line
 * carried as one more portion so that shares plus unclaimed always add up to the total.
 */
export function priceOrder(
  order: Pick<OrderRow, 'feeRule' | 'shippingFeeMinor' | 'hazardousFeeMinor' | 'currency'>,
  lines: readonly PricedLineInput[],
  shares: readonly PricedShareInput[],
): OrderCost {
  const hazardous = lines.some((line) => line.hazardous && line.packs > 0);
  const hazardousFeeMinor = hazardous ? order.hazardousFeeMinor : 0;
  const feesMinor = lines.length > 0 ? order.shippingFeeMinor + hazardousFeeMinor : 0;
  const layout = lines.map((line) => {
    const lineShares = shares.filter((share) => share.lineId === line.id);
    const ordered = line.packs * line.packSize;
    const claimed = lineShares.reduce((sum, share) => sum + share.quantity, 0);
    const unclaimed = ordered - claimed > quantityEpsilon ? ordered - claimed : 0;
    const portions: CostPortion[] = lineShares.map((share) => ({
      quantity: share.quantity,
      massG: massInGrams(share.quantity, line),
      payer: share.forLab || share.userId === null ? 'lab' : `user:${share.userId}`,
    }));
    if (unclaimed > 0 || portions.length === 0) {
      portions.push({
        quantity: unclaimed > 0 ? unclaimed : ordered,
        massG: massInGrams(unclaimed > 0 ? unclaimed : ordered, line),
        payer: unclaimedPayer,
      });
    }
    return {
      line,
      lineShares,
      unclaimed,
      hasUnclaimedPortion: portions.length > lineShares.length,
      totalMinor: line.packs * line.unitPriceMinor,
      portions,
    };
  });
  const costs = splitOrderCost(
    layout.map((item) => ({ totalMinor: item.totalMinor, portions: item.portions })),
    feesMinor,
    order.feeRule,
  );
  const shareCosts: ShareCost[] = [];
  const lineCosts: LineCost[] = [];
  layout.forEach((item, lineIndex) => {
    const lineCost = costs[lineIndex] ?? [];
    item.lineShares.forEach((share, shareIndex) => {
      const cost = lineCost[shareIndex] ?? { goodsMinor: 0, feesMinor: 0, amountMinor: 0 };
      shareCosts.push({ shareId: share.id, ...cost });
    });
    const rest = item.hasUnclaimedPortion ? lineCost[item.lineShares.length] : undefined;
    lineCosts.push({
      lineId: item.line.id,
      totalMinor: item.totalMinor,
      unclaimedQuantity: item.unclaimed,
      unclaimedMinor: rest?.amountMinor ?? 0,
    });
  });
  const goodsMinor = layout.reduce((sum, item) => sum + item.totalMinor, 0);
  return {
    currency: order.currency,
    goodsMinor,
    shippingFeeMinor: lines.length > 0 ? order.shippingFeeMinor : 0,
    hazardousFeeMinor,
    feesMinor,
    totalMinor: goodsMinor + feesMinor,
    lines: lineCosts,
    shares: shareCosts,
    unclaimedMinor: lineCosts.reduce((sum, line) => sum + line.unclaimedMinor, 0),
  };
}
