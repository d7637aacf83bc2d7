import { describe, expect, it } from 'vitest';
import { consumptionRate, daysOfStockLeft, forecastStock } from './consumption';
import { ChemError } from './errors';

describe('consumptionRate', () => {
  it('when balances fall steadily, then the rate is the drop per day', () => {
    const rate = consumptionRate([
      { at: '2025-03-01', quantity: 500 },
      { at: '2025-03-11', quantity: 400 },
      { at: '2025-03-21', quantity: 300 },
    ]);
    expect(rate.ratePerDay).toBe(10);
    expect(rate.consumed).toBe(200);
    expect(rate.spanDays).toBe(20);
    expect(rate.latest).toEqual({ at: new Date('2025-03-21'), quantity: 300 });
  });

  it('when a delivery raises the balance, then it is not counted as negative use', () => {
    const rate = consumptionRate([
      { at: '2025-03-01', quantity: 100 },
      { at: '2025-03-06', quantity: 50 },
      { at: '2025-03-07', quantity: 550 }, // a 500 g bottle arrived
      { at: '2025-03-11', quantity: 500 },
    ]);
    expect(rate.consumed).toBe(100);
    expect(rate.received).toBe(500);
    expect(rate.ratePerDay).toBe(10);
  });

  it('when balances come out of order, then they are sorted by date first', () => {
    const rate = consumptionRate([
      { at: new Date('2025-03-11T00:00:00Z'), quantity: 400 },
      { at: new Date('2025-03-01T00:00:00Z'), quantity: 500 },
    ]);
    expect(rate.ratePerDay).toBe(10);
  });

  it('when there is too little history, then the rate is null with the reason', () => {
    expect(consumptionRate([])).toMatchObject({
      ratePerDay: null,
      latest: null,
      reason: 'fewer than two balances',
    });
    expect(consumptionRate([{ at: '2025-03-01', quantity: 5 }]).reason).toBe(
      'fewer than two balances',
    );
    expect(
      consumptionRate([
        { at: '2025-03-01', quantity: 5 },
        { at: '2025-03-01', quantity: 4 },
      ]).reason,
    ).toBe('all balances at the same time');
  });

  it('when a date or quantity is bad, then the error names the balance', () => {
    try {
      consumptionRate([{ at: 'yesterday', quantity: 5 }]);
      throw new Error('expected a ChemError');
    } catch (error) {
      expect(error).toBeInstanceOf(ChemError);
      expect((error as ChemError).code).toBe('invalid_date');
      expect((error as ChemError).message).toContain('balance 1: "yesterday" is not a date');
    }
    expect(() => consumptionRate([{ at: '2025-03-01', quantity: -1 }])).toThrow(
      'balance 1 cannot be negative',
    );
  });
});

describe('daysOfStockLeft and forecastStock', () => {
  it('when 300 g is left at 10 g per day, then it lasts 30 days, 20 to a 100 g reorder point', () => {
    expect(daysOfStockLeft(300, 10)).toBe(30);
    expect(daysOfStockLeft(300, 10, 100)).toBe(20);
    expect(daysOfStockLeft(50, 10, 100)).toBe(0);
  });

  it('when nothing is being used, then the stock is not running out (null)', () => {
    expect(daysOfStockLeft(300, 0)).toBeNull();
    expect(daysOfStockLeft(300, null)).toBeNull();
  });

  it('when a forecast is made, then it gives the date the stock runs out', () => {
    const forecast = forecastStock([
      { at: '2025-03-01T00:00:00Z', quantity: 500 },
      { at: '2025-03-21T00:00:00Z', quantity: 300 },
    ]);
    expect(forecast.daysLeft).toBe(30);
    expect(forecast.runsOutAt?.toISOString()).toBe('2025-04-20T00:00:00.000Z');
    const reorder = forecastStock(
      [
        { at: '2025-03-01T00:00:00Z', quantity: 500 },
        { at: '2025-03-21T00:00:00Z', quantity: 300 },
      ],
      100,
    );
    expect(reorder.daysLeft).toBe(20);
    expect(forecastStock([]).runsOutAt).toBeNull();
  });

  it('when inputs are negative or not numbers, then they are refused', () => {
    expect(() => daysOfStockLeft(-1, 10)).toThrow(ChemError);
    expect(() => daysOfStockLeft(10, Number.NaN)).toThrow('finite number');
  });
});
