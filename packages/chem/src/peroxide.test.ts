import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import { addDays, addMonths, peroxideTestDue } from './peroxide';

describe('peroxide test-or-discard dates', () => {
  it('when a class A container was opened, then it is due 3 months later', () => {
    expect(
      peroxideTestDue({ peroxideClass: 'A', openedOn: '2025-01-15', receivedOn: '2024-12-01' }),
    ).toMatchObject({ dueOn: '2025-04-15', basis: 'opened' }); // EHS peroxide guidance: class A 3 months
  });

  it('when a class B or D container was opened, then it is due 12 months later', () => {
    for (const peroxideClass of ['B', 'D'] as const) {
      expect(
        peroxideTestDue({ peroxideClass, openedOn: '2025-03-01', receivedOn: '2025-01-10' }).dueOn,
      ).toBe('2026-03-01'); // EHS peroxide guidance: classes B and D 12 months
    }
  });

  it('when a class C monomer is inhibited it is due in 12 months, uninhibited within a day', () => {
    const base = { peroxideClass: 'C' as const, openedOn: '2025-06-10', receivedOn: '2025-06-01' };
    expect(peroxideTestDue(base).dueOn).toBe('2026-06-10'); // EHS peroxide guidance: class C inhibited 12 months
    expect(peroxideTestDue({ ...base, inhibited: false }).dueOn).toBe('2025-06-11'); // EHS peroxide guidance: uninhibited 24 hours
  });

  it('when a container is still sealed, then it is due 18 months after receipt', () => {
    expect(
      peroxideTestDue({ peroxideClass: 'B', openedOn: null, receivedOn: '2025-02-01' }),
    ).toMatchObject({ dueOn: '2026-08-01', basis: 'unopened' }); // EHS peroxide guidance: unopened 18 months
  });

  it("when the maker's expiry comes before 18 months, then the expiry is the date", () => {
    expect(
      peroxideTestDue({
        peroxideClass: 'B',
        openedOn: null,
        receivedOn: '2025-02-01',
        expiresOn: '2025-12-31',
      }),
    ).toMatchObject({ dueOn: '2025-12-31', basis: 'expiry' }); // EHS peroxide guidance: or the maker's expiry
  });

  it('when a month is shorter, then the date falls on its last day', () => {
    expect(addMonths('2025-08-31', 6)).toBe('2026-02-28'); // calendar arithmetic
    expect(addMonths('2024-11-30', 3)).toBe('2025-02-28'); // calendar arithmetic
    expect(addMonths('2023-11-29', 3)).toBe('2024-02-29'); // calendar arithmetic, leap year
    expect(addDays('2025-12-31', 1)).toBe('2026-01-01'); // calendar arithmetic
  });

  it('when a date is not a date, then a ChemError says how to write one', () => {
    expect(() =>
      peroxideTestDue({ peroxideClass: 'A', openedOn: '2025-02-30', receivedOn: '2025-01-01' }),
    ).toThrow(ChemError);
    expect(() => addMonths('yesterday', 1)).toThrow(/2025-03-01/);
  });
});
