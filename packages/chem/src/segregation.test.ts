import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import {
  findStorageConflicts,
  incompatibility,
  INCOMPATIBLE_PAIRS,
  rulesBetween,
  SEGREGATION_GROUPS,
} from './segregation';

describe('compatibility table', () => {
  it('when a listed pair is asked in either order, then the same rule answers', () => {
    expect(incompatibility('organic-acid', 'base')).toBe(incompatibility('base', 'organic-acid')); // PP: acids with bases
    expect(incompatibility('inorganic-acid', 'base')?.source).toBe('Prudent Practices'); // PP: acids with bases
  });

  it('when oxidizers meet flammables or reducing metals, then they are kept apart', () => {
    expect(incompatibility('oxidizer', 'flammable')?.source).toBe('Prudent Practices'); // PP: oxidizers with flammables
    expect(incompatibility('oxidizer', 'reducer')?.source).toBe('Prudent Practices'); // PP: oxidizers with reducing agents
  });

  it('when organic and oxidizing mineral acids meet, then the CRC rule answers', () => {
    expect(incompatibility('organic-acid', 'inorganic-acid')?.source).toBe('CRC Handbook'); // CRC: oxidizing acids with organic acids
  });

  it('when bases meet flammables, then the rule is marked as practice without a source', () => {
    expect(incompatibility('base', 'flammable')?.source).toBe('common practice, no source'); // common practice, no source
  });

  it('when water-reactives meet acids, bases, oxidizers or metal powders, then all are flagged', () => {
    for (const other of ['organic-acid', 'inorganic-acid', 'base', 'oxidizer', 'reducer']) {
      expect(incompatibility('water-reactive', other), other).not.toBeNull(); // PP: water-reactives kept dry
    }
  });

  it('when low-hazard materials meet anything, or a group meets itself, then nothing is flagged', () => {
    for (const group of SEGREGATION_GROUPS) {
      expect(incompatibility('low-hazard', group), group).toBeNull(); // reference storage.md: general group has no row
      expect(incompatibility(group, group), group).toBeNull(); // reference storage.md: diagonal is "-"
    }
    expect(incompatibility('flammable', 'organic-acid')).toBeNull(); // reference storage.md: blank cell
  });

  it('when the table is read, then it holds the 18 cells of the reference, each once', () => {
    expect(INCOMPATIBLE_PAIRS).toHaveLength(18); // reference storage.md: 18 X cells
    const keys = INCOMPATIBLE_PAIRS.map((p) => [p.a, p.b].sort().join('|'));
    expect(new Set(keys).size).toBe(keys.length);
    for (const pair of INCOMPATIBLE_PAIRS) expect(pair.reason.length).toBeGreaterThan(10);
  });

  it('when a group is unknown, then the error lists the groups', () => {
    expect(() => incompatibility('explosive', 'base')).toThrow(ChemError);
    expect(() => incompatibility('explosive', 'base')).toThrow(/flammable, organic-acid/);
  });
});

describe('conflicts in one place', () => {
  it('when sodium nitrite carries gas-with-acid as well as oxidizer, then an acid beside it is flagged', () => {
    const nitrite = ['oxidizer', 'gas-with-acid']; // PP lists nitrites with oxidizers and with acids
    const rules = rulesBetween(nitrite, ['inorganic-acid']);
    expect(rules.map((r) => [r.a, r.b])).toEqual([
      ['inorganic-acid', 'oxidizer'],
      ['inorganic-acid', 'gas-with-acid'],
    ]);
    expect(rulesBetween(nitrite, ['organic-acid'])).toHaveLength(2); // PP: nitrites with acids
  });

  it('when a shelf holds an acid, a base and a salt, then only the acid/base pair is listed', () => {
    const conflicts = findStorageConflicts([
      { key: 'HCl', groups: ['inorganic-acid'] },
      { key: 'NaOH', groups: ['base'] },
      { key: 'NaCl', groups: ['low-hazard'] },
    ]);
    expect(conflicts).toHaveLength(1);
    expect(conflicts[0]).toMatchObject({ first: 'HCl', second: 'NaOH' }); // PP: acids with bases
  });
});
