import { describe, expect, it } from 'vitest';
import { consumptionRate } from './consumption';
import { ChemError } from './errors';
import { planReorder } from './reorder';

// The arithmetic below is worked by hand beside each check; the reorder rules themselves
// (reorder point with a fixed quantity, or order up to a level) are common practice, no source.

describe('planReorder: days left', () => {
  it('when 300 g is on hand at 10 g a day with a 100 g reorder point, then 30 days are left and the point is reached in 20', () => {
    const plan = planReorder({
      onHand: 300,
      ratePerDay: 10,
      reorderPoint: 100,
      reorderQuantity: 500,
      asOf: '2026-03-01T00:00:00Z',
    });
    // 300 / 10 = 30 days; (300 − 100) / 10 = 20 days
    expect(plan.daysLeft).toBe(30);
    expect(plan.daysToReorderPoint).toBe(20);
    expect(plan.emptyOn?.toISOString()).toBe('2026-03-31T00:00:00.000Z');
    expect(plan.reorderPointOn?.toISOString()).toBe('2026-03-21T00:00:00.000Z');
    expect(plan.due).toBe(false);
    expect(plan.quantityToBuy).toBe(500);
    expect(plan.rule).toBe('reorder-quantity');
  });

  it('when the rate comes from eight weeks of draws, then the days follow from it', () => {
    // 56 days, 7 draws of 40 g: 280 g / 56 d = 5 g a day; 180 g left -> 36 days, 16 to 100 g.
    const balances = [{ at: '2026-01-05T00:00:00Z', quantity: 460 }];
    for (let week = 1; week <= 7; week++) {
      balances.push({
        at: new Date(Date.UTC(2026, 0, 5 + week * 7)).toISOString(),
        quantity: 460 - 40 * week,
      });
    }
    balances.push({ at: '2026-03-02T00:00:00Z', quantity: 180 });
    const rate = consumptionRate(balances);
    expect(rate.spanDays).toBe(56);
    expect(rate.ratePerDay).toBe(5);
    const plan = planReorder({
      onHand: 180,
      ratePerDay: rate.ratePerDay,
      reorderPoint: 100,
      reorderQuantity: 250,
      asOf: '2026-03-02T00:00:00Z',
    });
    expect(plan.daysLeft).toBe(36);
    expect(plan.daysToReorderPoint).toBe(16);
    expect(plan.reorderPointOn?.toISOString()).toBe('2026-03-18T00:00:00.000Z');
  });

  it('when nothing is being used, then no days are counted but a stock at the point is still due', () => {
    const idle = planReorder({
      onHand: 300,
      ratePerDay: null,
      reorderPoint: 100,
      asOf: '2026-03-01',
    });
    expect(idle).toMatchObject({
      daysLeft: null,
      daysToReorderPoint: null,
      emptyOn: null,
      reorderPointOn: null,
      due: false,
    });
    const zero = planReorder({ onHand: 80, ratePerDay: 0, reorderPoint: 100, asOf: '2026-03-01' });
    expect(zero.daysLeft).toBeNull();
    expect(zero.due).toBe(true);
    expect(zero.daysToReorderPoint).toBe(0);
    expect(zero.reorderPointOn?.toISOString()).toBe('2026-03-01T00:00:00.000Z');
  });
});

describe('planReorder: quantity to buy', () => {
  it('when the stock is at the reorder point, then one reorder quantity is bought', () => {
    const plan = planReorder({
      onHand: 100,
      ratePerDay: 10,
      reorderPoint: 100,
      reorderQuantity: 500,
      asOf: '2026-03-01',
    });
    expect(plan.due).toBe(true);
    expect(plan.quantityToBuy).toBe(500);
  });

  it('when the stock has fallen far below the point, then enough whole reorder quantities to lift it above', () => {
    // 10 g on hand, point 300 g, Q 100 g: 10 + 2 × 100 = 210 is still below, 10 + 3 × 100 = 310 above
    expect(
      planReorder({
        onHand: 10,
        ratePerDay: 5,
        reorderPoint: 300,
        reorderQuantity: 100,
        asOf: '2026-03-01',
      }).quantityToBuy,
    ).toBe(300);
    // 0 g on hand, point 200 g, Q 100 g: 2 × 100 = 200 would sit at the point, so 3
    expect(
      planReorder({
        onHand: 0,
        ratePerDay: 5,
        reorderPoint: 200,
        reorderQuantity: 100,
        asOf: '2026-03-01',
      }).quantityToBuy,
    ).toBe(300);
  });

  it('when float noise would leave the stock just at the point, then one quantity more is bought', () => {
    // (100 − 99.7) / 0.1 is 2.9999999999999716 in floating point; 3 × 0.1 would reach 100.0 exactly
    const plan = planReorder({
      onHand: 99.7,
      ratePerDay: 1,
      reorderPoint: 100,
      reorderQuantity: 0.1,
      asOf: '2026-03-01',
    });
    expect(plan.quantityToBuy).toBeCloseTo(0.4, 12);
  });

  it('when a target level is given, then the stock is bought up to it', () => {
    // not yet due: bought when the stock reaches 100 g -> 1000 − 100 = 900 g
    expect(
      planReorder({
        onHand: 400,
        ratePerDay: 10,
        reorderPoint: 100,
        targetLevel: 1000,
        asOf: '2026-03-01',
      }),
    ).toMatchObject({ quantityToBuy: 900, rule: 'target-level' });
    // due now with 60 g: 1000 − 60 = 940 g
    expect(
      planReorder({
        onHand: 60,
        ratePerDay: 10,
        reorderPoint: 100,
        targetLevel: 1000,
        asOf: '2026-03-01',
      }).quantityToBuy,
    ).toBe(940);
  });

  it('when neither a reorder quantity nor a target level is known, then the quantity is null', () => {
    expect(
      planReorder({ onHand: 60, ratePerDay: 10, reorderPoint: 100, asOf: '2026-03-01' }),
    ).toMatchObject({ quantityToBuy: null, rule: 'none', due: true });
  });

  it('when inputs conflict or are out of range, then a ChemError names the problem', () => {
    const base = { onHand: 60, ratePerDay: 10, reorderPoint: 100, asOf: '2026-03-01' };
    expect(() => planReorder({ ...base, reorderQuantity: 50, targetLevel: 500 })).toThrow(
      'either a reorder quantity or a target level',
    );
    expect(() => planReorder({ ...base, targetLevel: 100 })).toThrow(
      'target level (100) must be above the reorder point (100)',
    );
    expect(() => planReorder({ ...base, reorderQuantity: 0 })).toThrow(ChemError);
    expect(() => planReorder({ ...base, onHand: -1 })).toThrow('stock on hand cannot be negative');
    expect(() => planReorder({ ...base, asOf: 'soon' })).toThrow('"soon" is not a date');
  });
});
