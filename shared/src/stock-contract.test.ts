import { SEGREGATION_GROUPS } from '@lotwise/chem';
import { describe, expect, it } from 'vitest';
import { chemicalCreateBodySchema, chemicalPatchBodySchema } from './chemicals';
import {
  drawSchema,
  formatLabelCode,
  labelCodeToLookUp,
  normalizeLabelCode,
  parseLabelCode,
} from './containers';
import { isIsoDate } from './dates';
import { storageGroupCodes } from './hazards';
import { permissionMatrix } from './roles';

describe('stock contract', () => {
  it('when storage groups are listed here and in @lotwise/chem, then they are the same codes', () => {
    expect([...storageGroupCodes].sort()).toEqual([...SEGREGATION_GROUPS].sort());
  });

  it('when a label code is formatted or read back, then LW- and five digits round-trip', () => {
    expect(formatLabelCode(42)).toBe('LW-00042');
    expect(formatLabelCode(123456)).toBe('LW-123456');
    expect(parseLabelCode(' lw-42 ')).toBe(42);
    expect(normalizeLabelCode('LW 00042')).toBe('LW-00042');
    expect(parseLabelCode('LW-00000')).toBeNull();
    expect(parseLabelCode('aspirin')).toBeNull();
  });

  it('when a code is looked up, then LW- codes are made canonical and other label codes kept as written', () => {
    expect(labelCodeToLookUp('lw-42')).toBe('LW-00042');
    expect(labelCodeToLookUp(' FW/B-117 ')).toBe('FW/B-117');
    expect(labelCodeToLookUp('not a code')).toBeNull();
    expect(labelCodeToLookUp('A'.repeat(21))).toBeNull();
    expect(labelCodeToLookUp('https://lab.example.test/stock/c/LW-00042')).toBeNull();
  });

  it('when a draw gives both or neither of amount and grossMass, then the message says which to give', () => {
    const both = drawSchema.safeParse({ amount: 1, grossMass: 2, unit: 'g' });
    expect(both.error?.issues[0]?.message).toMatch(/either amount .* or grossMass/);
    expect(drawSchema.safeParse({ amount: 1, unit: 'mL' }).success).toBe(true);
    expect(drawSchema.safeParse({ grossMass: 1, unit: 'mL' }).success).toBe(false);
  });

  it('when extraHazardGroups is sent, then the body schemas take it and still refuse unknown fields', () => {
    const parsed = chemicalCreateBodySchema.parse({
      name: 'Sodium nitrite',
      physicalState: 'solid',
      storageGroup: 'oxidizer',
      extraHazardGroups: ['gas-with-acid'],
    });
    expect(parsed.extraHazardGroups).toEqual(['gas-with-acid']);
    expect(chemicalPatchBodySchema.safeParse({ colour: 'red' }).success).toBe(false);
    expect(chemicalPatchBodySchema.safeParse({ extraHazardGroups: ['lava'] }).success).toBe(false);
  });

  it('when a date is checked, then only real calendar dates pass', () => {
    expect(isIsoDate('2024-02-29')).toBe(true);
    expect(isIsoDate('2025-02-29')).toBe(false);
    expect(isIsoDate('2025-2-1')).toBe(false);
  });

  it('when members and viewers are compared, then members may draw and only admins run maintenance', () => {
    expect(permissionMatrix.member).toContain('stock.draw');
    expect(permissionMatrix.viewer).not.toContain('stock.draw');
    expect(permissionMatrix.manager).not.toContain('maintenance.run');
  });
});
