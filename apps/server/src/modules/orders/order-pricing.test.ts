import { describe, expect, it } from 'vitest';
import { priceOrder, type PricedLineInput } from './order-pricing';

const order = {
  feeRule: 'value' as const,
  shippingFeeMinor: 995,
  hazardousFeeMinor: 1500,
  currency: 'EUR',
};
const powder: PricedLineInput = {
  id: 1,
  packs: 1,
  packSize: 500,
  packUnit: 'g',
  unitPriceMinor: 4999,
  hazardous: false,
  densityGPerMl: null,
};
const acid: PricedLineInput = {
  id: 2,
  packs: 2,
  packSize: 1,
  packUnit: 'L',
  unitPriceMinor: 1200,
  hazardous: true,
  densityGPerMl: 1.84,
};

describe('priceOrder', () => {
  it('when part of a line is unclaimed, then shares plus the unclaimed rest add up to the total', () => {
    const cost = priceOrder(
      order,
      [powder, acid],
      [
        { id: 10, lineId: 1, userId: 5, forLab: false, quantity: 100 },
        { id: 11, lineId: 2, userId: 6, forLab: false, quantity: 2 },
      ],
    );
    expect(cost.goodsMinor).toBe(4999 + 2400);
    expect(cost.hazardousFeeMinor).toBe(1500);
    expect(cost.totalMinor).toBe(4999 + 2400 + 995 + 1500);
    expect(cost.lines[0]?.unclaimedQuantity).toBeCloseTo(400, 9);
    const shares = cost.shares.reduce((sum, share) => sum + share.amountMinor, 0);
    expect(shares + cost.unclaimedMinor).toBe(cost.totalMinor);
  });

  it('when everything is claimed, then the shares alone add up to the total and nothing is unclaimed', () => {
    const cost = priceOrder(
      { ...order, feeRule: 'member' },
      [powder],
      [
        { id: 10, lineId: 1, userId: 5, forLab: false, quantity: 100 },
        { id: 11, lineId: 1, userId: 6, forLab: false, quantity: 300 },
        { id: 12, lineId: 1, userId: null, forLab: true, quantity: 100 },
      ],
    );
    expect(cost.hazardousFeeMinor).toBe(0);
    expect(cost.unclaimedMinor).toBe(0);
    expect(cost.shares.reduce((sum, share) => sum + share.amountMinor, 0)).toBe(4999 + 995);
  });

  it('when fees go by mass, then a litre of a dense liquid weighs by its density', () => {
    const cost = priceOrder(
      { ...order, feeRule: 'mass' },
      [powder, acid],
      [
        { id: 10, lineId: 1, userId: 5, forLab: false, quantity: 500 },
        { id: 11, lineId: 2, userId: 6, forLab: false, quantity: 2 },
      ],
    );
    // 500 g against 2 L × 1.84 g/mL = 3680 g: fees 2495 split 500 : 3680
    expect(cost.shares.map((share) => share.feesMinor)).toEqual([298, 2197]);
  });
});
