import { describe, expect, it } from 'vitest';
import { reorderState, stockDisplay } from './stock';

describe('stockDisplay', () => {
  it('when a total reaches 1000 g or mL, then it reads in kg or L', () => {
    expect(stockDisplay(2500, 'mL').text).toBe('2.5 L'); // SI: 1 L = 1000 mL
    expect(stockDisplay(12345, 'g').text).toBe('12.3 kg'); // SI prefix; 3 figures: common practice, no source
  });

  it('when a total is below 1, then it reads in mg or µL', () => {
    expect(stockDisplay(0.25, 'g').text).toBe('250 mg'); // SI: 1 g = 1000 mg
    expect(stockDisplay(0.5, 'mL').text).toBe('500 µL'); // SI: 1 mL = 1000 µL
  });

  it('when a total is in between, then the balance or glassware rule rounds it', () => {
    expect(stockDisplay(123.456, 'g').text).toBe('123.5 g'); // BALANCE_RULE, common practice, no source
    expect(stockDisplay(68.3, 'mL').text).toBe('68 mL'); // GLASSWARE_RULE, common practice, no source
    expect(stockDisplay(0, 'g').text).toBe('0 g');
  });
});

describe('reorderState', () => {
  it('when there is no reorder point, then none; below, at and above follow the total', () => {
    expect(reorderState(10, null)).toBe('none');
    expect(reorderState(99.9, 100)).toBe('below');
    expect(reorderState(100.00000001, 100)).toBe('at'); // float sums: common practice, no source
    expect(reorderState(250, 100)).toBe('ok');
  });
});
