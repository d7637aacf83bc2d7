import { describe, expect, it } from 'vitest';
import { splitOrderCost, type CostLine, type OrderFeeRule } from './money';

const amounts = (result: ReturnType<typeof splitOrderCost>) =>
  result.map((line) => line.map((portion) => portion.amountMinor));
const total = (result: ReturnType<typeof splitOrderCost>) =>
  result.flat().reduce((sum, portion) => sum + portion.amountMinor, 0);

// A 500 g pack at 49.99 split 100 g / 400 g, and two 1 L bottles at 12.00 taken by one
// member, with 9.95 shipping and 15.00 hazardous-goods fee. Worked by hand below.
const lines: CostLine[] = [
  {
    totalMinor: 4999,
    portions: [
      { quantity: 100, massG: 100, payer: 'ana' },
      { quantity: 400, massG: 400, payer: 'ben' },
    ],
  },
  { totalMinor: 2400, portions: [{ quantity: 2000, massG: 1580, payer: 'ben' }] },
];

describe('splitOrderCost', () => {
  it('when fees are split by value, then goods follow quantity and fees follow goods, to the cent', () => {
    const result = splitOrderCost(lines, 2495, 'value');
    // goods: 4999 × 1/5 = 999.8 -> 999 + 1 (largest remainder) = 1000; 3999.2 -> 3999
    expect(result[0]?.map((p) => p.goodsMinor)).toEqual([1000, 3999]);
    // fees by goods 1000 : 3999 : 2400 of 7399: 337.20, 1348.55, 809.24 -> 337, 1349, 809
    expect(result.flat().map((p) => p.feesMinor)).toEqual([337, 1349, 809]);
    expect(total(result)).toBe(4999 + 2400 + 2495);
  });

  it('when fees are split equally per member, then each member carries the same fee', () => {
    const result = splitOrderCost(lines, 2495, 'member');
    // 2495 / 2 = 1247.5 -> ana 1248 (earlier), ben 1247, ben's split 3999 : 2400 -> 779, 468
    expect(result.flat().map((p) => p.feesMinor)).toEqual([1248, 779, 468]);
    expect(total(result)).toBe(9894);
  });

  it('when fees are split by mass, then the heavier portion pays more', () => {
    const result = splitOrderCost(lines, 2495, 'mass');
    // 100 : 400 : 1580 of 2080 g -> 119.95, 479.81, 1895.24 -> 120, 480, 1895
    expect(result.flat().map((p) => p.feesMinor)).toEqual([120, 480, 1895]);
    expect(total(result)).toBe(9894);
  });

  it('when amounts tie, then the earlier portion gets the cent, every time', () => {
    const even: CostLine[] = [
      {
        totalMinor: 1000,
        portions: [1, 1, 1].map((quantity, i) => ({ quantity, massG: 1, payer: `m${i}` })),
      },
    ];
    for (const rule of ['value', 'member', 'mass'] as OrderFeeRule[]) {
      const first = amounts(splitOrderCost(even, 100, rule));
      // goods 1000 / 3 -> 334, 333, 333; fees 100 / 3 -> 34, 33, 33 (by value, member or mass alike)
      expect(first).toEqual([[368, 366, 366]]);
      expect(amounts(splitOrderCost(even, 100, rule))).toEqual(first);
    }
  });

  it('when a portion is worth nothing, then it pays no value-based fee', () => {
    const free: CostLine[] = [
      { totalMinor: 0, portions: [{ quantity: 5, massG: 5, payer: 'sample' }] },
      { totalMinor: 1000, portions: [{ quantity: 10, massG: 10, payer: 'ana' }] },
    ];
    expect(amounts(splitOrderCost(free, 500, 'value'))).toEqual([[0], [1500]]);
    // every portion free: the fee is shared equally instead
    const allFree: CostLine[] = [
      {
        totalMinor: 0,
        portions: [
          { quantity: 5, massG: 5, payer: 'a' },
          { quantity: 5, massG: 5, payer: 'b' },
        ],
      },
    ];
    expect(amounts(splitOrderCost(allFree, 101, 'value'))).toEqual([[51, 50]]);
  });

  it('when one member takes everything, then they pay the whole total', () => {
    const one: CostLine[] = [
      { totalMinor: 12345, portions: [{ quantity: 1, massG: 0, payer: 'a' }] },
    ];
    for (const rule of ['value', 'member', 'mass'] as OrderFeeRule[]) {
      expect(amounts(splitOrderCost(one, 995, rule))).toEqual([[13340]]);
    }
  });

  it('when many random orders are split, then the parts always add up to the total exactly', () => {
    let seed = 7;
    const random = () => {
      seed = (seed * 16807) % 2147483647;
      return seed / 2147483647;
    };
    for (let round = 0; round < 300; round++) {
      const made: CostLine[] = Array.from({ length: 1 + Math.floor(random() * 4) }, () => ({
        totalMinor: Math.floor(random() * 100000),
        portions: Array.from({ length: 1 + Math.floor(random() * 5) }, () => ({
          quantity: 0.001 + random() * 500,
          massG: random() * 500,
          payer: `m${Math.floor(random() * 3)}`,
        })),
      }));
      const fees = Math.floor(random() * 5000);
      const goods = made.reduce((sum, line) => sum + line.totalMinor, 0);
      for (const rule of ['value', 'member', 'mass'] as OrderFeeRule[]) {
        const result = splitOrderCost(made, fees, rule);
        expect(total(result)).toBe(goods + fees);
        result.flat().forEach((p) => {
          expect(Number.isInteger(p.amountMinor)).toBe(true);
          expect(p.amountMinor).toBeGreaterThanOrEqual(0);
        });
      }
    }
  });

  it('when the fees are not whole cents, then it refuses', () => {
    expect(() => splitOrderCost(lines, 12.5, 'value')).toThrow(/whole number/);
  });
});
