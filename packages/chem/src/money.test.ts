import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import { splitByWeights } from './money';

const sum = (parts: number[]) => parts.reduce((a, b) => a + b, 0);

describe('splitByWeights (largest remainder)', () => {
  it('when 10.00 is split three ways, then the extra cent goes to the first', () => {
    expect(splitByWeights(1000, [1, 1, 1])).toEqual([334, 333, 333]);
  });

  it('when shares are exact, then each gets exactly its share', () => {
    expect(splitByWeights(100, [0.1, 0.2, 0.7])).toEqual([10, 20, 70]);
    expect(splitByWeights(3000, [250, 500, 250])).toEqual([750, 1500, 750]);
  });

  it('when remainders differ, then the largest remainders get the cents left over', () => {
    // 100 × [0.333, 0.333, 0.334] = 33.3, 33.3, 33.4 -> floors 33, 33, 33, one cent left
    expect(splitByWeights(100, [0.333, 0.333, 0.334])).toEqual([33, 33, 34]);
    // 7 by 2:3:5 -> 1.4, 2.1, 3.5 -> floors 1, 2, 3; the cent goes to 3.5
    expect(splitByWeights(7, [2, 3, 5])).toEqual([1, 2, 4]);
  });

  it('when remainders tie, then the larger weight wins, then the earlier position', () => {
    // 2 by 1:3 -> 0.5 and 1.5: both remainders 0.5, the larger weight gets the cent
    expect(splitByWeights(2, [1, 3])).toEqual([0, 2]);
    // 1 by 1:2:1:2 -> remainders 1/6, 1/3, 1/6, 1/3: weights tie too, the earlier one wins
    expect(splitByWeights(1, [1, 2, 1, 2])).toEqual([0, 1, 0, 0]);
    expect(splitByWeights(1, [1, 1])).toEqual([1, 0]);
  });

  it('when weights include zeros, then those parts get nothing', () => {
    expect(splitByWeights(999, [0, 1, 0, 2])).toEqual([0, 333, 0, 666]);
  });

  it('when the total is a refund, then the parts are negative and still add up', () => {
    const parts = splitByWeights(-1000, [1, 1, 1]);
    expect(parts).toEqual([-334, -333, -333]);
    expect(splitByWeights(0, [1, 2])).toEqual([0, 0]);
  });

  it('when many awkward splits are made, then the parts always add up exactly to the total', () => {
    let seed = 12345;
    const next = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (let round = 0; round < 500; round++) {
      const total = Math.floor(next() * 1_000_000);
      const weights = Array.from({ length: 1 + Math.floor(next() * 12) }, () =>
        Number((next() * 50).toFixed(3)),
      );
      if (sum(weights) === 0) continue;
      const parts = splitByWeights(total, weights);
      expect(sum(parts)).toBe(total);
      parts.forEach((part, index) => {
        const exact = (total * (weights[index] ?? 0)) / sum(weights);
        expect(Math.abs(part - exact)).toBeLessThan(1 + 1e-6);
        expect(Number.isInteger(part)).toBe(true);
      });
    }
  });

  it('when the same split is asked twice, then it gives the same parts', () => {
    expect(splitByWeights(1001, [3, 3, 3, 1])).toEqual(splitByWeights(1001, [3, 3, 3, 1]));
  });

  it('when the input is bad, then the error says what to fix', () => {
    const cases: [() => unknown, string, string][] = [
      [() => splitByWeights(10.5, [1]), 'invalid_integer', 'whole number of minor units'],
      [() => splitByWeights(10, []), 'invalid_weights', 'at least one weight'],
      [() => splitByWeights(10, [0, 0]), 'invalid_weights', 'at least one must be above 0'],
      [
        () => splitByWeights(10, [1, -1]),
        'invalid_weights',
        'weight 2 must be a number of 0 or more',
      ],
      [() => splitByWeights(10, [1, Number.NaN]), 'invalid_weights', 'weight 2'],
    ];
    for (const [fn, code, text] of cases) {
      try {
        fn();
        throw new Error('expected a ChemError');
      } catch (error) {
        expect(error).toBeInstanceOf(ChemError);
        expect((error as ChemError).code).toBe(code);
        expect((error as ChemError).message).toContain(text);
      }
    }
  });
});
