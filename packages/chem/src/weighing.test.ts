import { describe, expect, it } from 'vitest';
import { weighByDifference } from './weighing';

// Weighing by difference: drawn = balance − (gross − tare). // common practice, no source
describe('weighByDifference', () => {
  const solid = { tareMass: 150, balance: 250, stockUnit: 'g' as const, density: null };

  it('when a solid container is weighed, then net and drawn follow from the tare', () => {
    const result = weighByDifference({ ...solid, grossMass: 380, unit: 'g' });
    expect(result).toEqual({ ok: true, netMass: 230, net: 230, drawn: 20 });
  });

  it('when the gross mass is given in kg, then it is converted before subtracting', () => {
    const result = weighByDifference({ ...solid, grossMass: 0.38, unit: 'kg' });
    expect(result.ok && result.drawn).toBeCloseTo(20, 9);
  });

  it('when a liquid counted in mL is weighed, then the net mass goes through the density', () => {
    // ethanol 0.7893 g/mL at 20 °C (reference chemicals.tsv, MERCK)
    const result = weighByDifference({
      grossMass: 278.93,
      unit: 'g',
      tareMass: 200,
      balance: 120,
      stockUnit: 'mL',
      density: 0.7893,
    });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.netMass).toBeCloseTo(78.93, 9);
    expect(result.net).toBeCloseTo(100, 6); // 78.93 g / 0.7893 g/mL
    expect(result.drawn).toBeCloseTo(20, 6);
  });

  it('when the gross is below the tare, then it is refused as below_tare', () => {
    expect(weighByDifference({ ...solid, grossMass: 149, unit: 'g' })).toMatchObject({
      ok: false,
      problem: 'below_tare',
    });
  });

  it('when there is no tare, no density or a volume unit, then the problem is named', () => {
    expect(weighByDifference({ ...solid, tareMass: null, grossMass: 200, unit: 'g' })).toEqual({
      ok: false,
      problem: 'no_tare',
    });
    expect(weighByDifference({ ...solid, grossMass: 200, unit: 'mL' })).toEqual({
      ok: false,
      problem: 'not_a_mass',
    });
    expect(
      weighByDifference({ ...solid, stockUnit: 'mL', grossMass: 200, unit: 'g' }),
    ).toMatchObject({ ok: false, problem: 'no_density' });
  });

  it('when the container weighs more than its balance allows, then it is above_balance', () => {
    expect(weighByDifference({ ...solid, grossMass: 420, unit: 'g' })).toMatchObject({
      ok: false,
      problem: 'above_balance',
      net: 270,
    });
  });
});
