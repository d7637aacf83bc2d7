import { describe, expect, it } from 'vitest';
import { meltingComparison } from './run-views';

// Acetylsalicylic acid melts at about 135–136 °C. // from memory (CRC Handbook of Chemistry and Physics lists 135 °C)
const aspirin = { low: 135, high: 136 };

describe('meltingComparison', () => {
  it('when the measured range lies within the literature range and is sharp, then it agrees', () => {
    expect(meltingComparison({ low: 135, high: 136 }, aspirin)).toEqual({
      agrees: true,
      text: 'agrees with the literature range (135–136 °C)',
    });
    // within 1 °C of the range on either side: a thermometer reading // common practice, no source
    expect(meltingComparison({ low: 134.5, high: 136.5 }, aspirin)?.agrees).toBe(true);
  });

  it('when it starts well below the literature range, then it does not agree: impure or wet', () => {
    expect(meltingComparison({ low: 131, high: 133 }, aspirin)).toEqual({
      agrees: false,
      text: 'starts 4.0 °C below the literature range (135–136 °C): probably impure or still wet',
    });
  });

  it('when it ends above the literature range, then the thermometer and identity are to check', () => {
    expect(meltingComparison({ low: 136, high: 138 }, aspirin)?.text).toMatch(
      /^ends 2.0 °C above the literature range/,
    );
  });

  it('when it is wider than 2 °C, then it does not agree even inside the range', () => {
    // a pure compound melts within about 2 °C // common practice, no source
    expect(meltingComparison({ low: 130, high: 140 }, { low: 128, high: 142 })).toEqual({
      agrees: false,
      text: 'a range 10.0 °C wide (more than 2 °C) suggests impurity',
    });
  });

  it('when either range is missing, then there is nothing to compare', () => {
    expect(meltingComparison(null, aspirin)).toBeNull();
    expect(meltingComparison({ low: 135, high: 136 }, null)).toBeNull();
  });
});
