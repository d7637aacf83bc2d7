import { describe, expect, it } from 'vitest';
import { formatAmount, formatMolarMass } from './format';

describe('format', () => {
  it('when an amount is shown, then it carries its unit at balance precision', () => {
    expect(formatAmount(250, 'g')).toBe('250.00 g');
    expect(formatAmount(1234.5, 'mL')).toBe('1,234.50 mL');
    expect(formatAmount(null, 'g')).toBe('—');
  });

  it('when a molar mass is shown, then it has two decimals and g/mol', () => {
    expect(formatMolarMass(180.156)).toBe('180.16 g/mol');
  });
});
