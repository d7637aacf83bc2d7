import { describe, expect, it } from 'vitest';
import * as chem from '@lotwise/chem';

// The contract other workspaces rely on (shared/src/chemicals.ts imports these two).
describe('package entry point', () => {
  it('when tryMolarMass is called through @lotwise/chem, then it returns a Result', () => {
    const good = chem.tryMolarMass('CuSO4·5H2O');
    expect(good.ok).toBe(true);
    if (good.ok) expect(good.value).toBeCloseTo(249.677, 9); // calc from CIAAW2021 (reference formula-masses.tsv)
    const bad = chem.tryMolarMass('C6H5Xx');
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.error).toBeInstanceOf(chem.ChemError);
      expect(bad.error).toBeInstanceOf(Error);
      expect(bad.error.name).toBe('ChemError');
      expect(bad.error.code).toBe('unknown_element');
      expect(bad.error.position).toBe(5);
      expect(bad.error.message).toBe('unknown element "Xx" at position 5');
    }
  });

  it('when validateCasNumber is called through @lotwise/chem, then it returns valid or a reason', () => {
    expect(chem.validateCasNumber('7732-18-5')).toEqual({ valid: true }); // CAS (reference cas-numbers.md)
    expect(chem.validateCasNumber('64-17-6')).toEqual({
      valid: false,
      reason: 'check digit should be 5',
    });
  });

  it('when a ChemError is built, then its code and details are kept', () => {
    const error = new chem.ChemError('density_missing', 'density missing', { lineIndex: 2 });
    expect(error).toMatchObject({
      code: 'density_missing',
      lineIndex: 2,
      message: 'density missing',
    });
    expect(error.position).toBeUndefined();
    expect(chem.CHEM_ERROR_CODES).toContain(error.code);
  });

  it('when toResult wraps a non-chemistry exception, then it is re-thrown as a bug', () => {
    expect(chem.toResult(() => 1)).toEqual({ ok: true, value: 1 });
    expect(() =>
      chem.toResult(() => {
        throw new TypeError('bug');
      }),
    ).toThrow(TypeError);
  });
});
