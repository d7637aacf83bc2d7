import { describe, expect, it } from 'vitest';
import { can, permissionMatrix, permissions, roles } from './roles';
import { chemicalCreateSchema, chemicalPatchSchema } from './chemicals';
import { listQuerySchema, parseSort } from './list';
import { ghsCodes, hazardStatementSchema } from './hazards';

describe('permission matrix', () => {
  it('when the role is admin, then it holds every permission', () => {
    for (const permission of permissions) expect(can('admin', permission)).toBe(true);
  });

  it('when a role is lower, then it holds a subset of the role above it', () => {
    const order = [...roles];
    for (let i = 1; i < order.length; i++) {
      const upper = new Set(permissionMatrix[order[i - 1]!]);
      for (const p of permissionMatrix[order[i]!])
        expect(upper.has(p), `${order[i]} ${p}`).toBe(true);
    }
  });

  it('when the role is viewer, then it may only read', () => {
    expect(permissionMatrix.viewer.every((p) => p.endsWith('.read'))).toBe(true);
    expect(can('viewer', 'chemicals.write')).toBe(false);
  });
});

describe('chemical schemas', () => {
  it('when a create body has only a name and state, then the defaults are filled', () => {
    const parsed = chemicalCreateSchema.parse({ name: 'Sodium chloride', physicalState: 'solid' });
    expect(parsed).toMatchObject({
      defaultPurityPercent: 100,
      storageGroup: 'low-hazard',
      synonyms: [],
    });
  });

  it('when a field is wrong, then the error names that field and says why', () => {
    const result = chemicalCreateSchema.safeParse({
      name: 'Ethanol',
      physicalState: 'liquid',
      casNumber: '64-17-6', // CAS check digit rule: the check digit of 64-17-? is 5
      formula: 'C2H6Xx',
      ghsPictograms: ['GHS02', 'GHS10'],
      reorderPoint: -1,
    });
    expect(result.success).toBe(false);
    const byPath = Object.fromEntries(
      result.error!.issues.map((i) => [i.path.join('.'), i.message]),
    );
    expect(byPath.casNumber).toMatch(/check digit/i);
    expect(byPath.formula).toMatch(/Xx/);
    expect(byPath['ghsPictograms.1']).toMatch(/GHS01 to GHS09/);
    expect(byPath.reorderPoint).toMatch(/negative/);
  });

  it('when a patch leaves fields out, then nothing is defaulted', () => {
    expect(chemicalPatchSchema.parse({ density: 0.789 })).toEqual({ density: 0.789 });
  });

  it('when a body has an unknown field, then it is refused', () => {
    expect(chemicalPatchSchema.safeParse({ colour: 'red' }).success).toBe(false);
  });
});

describe('list queries', () => {
  const schema = listQuerySchema(['name', 'createdAt'], 'name.asc');

  it('when nothing is given, then page 1 of 25 sorted by the default is asked', () => {
    expect(schema.parse({})).toEqual({ q: '', sort: 'name.asc', page: 1, pageSize: 25 });
  });

  it('when the sort field is unknown, then the message lists the choices', () => {
    const result = schema.safeParse({ sort: 'colour.asc' });
    expect(result.error?.issues[0]?.message).toContain('name.asc');
  });

  it('when a sort is split, then field and direction come apart', () => {
    expect(parseSort('createdAt.desc')).toEqual({ field: 'createdAt', direction: 'desc' });
  });
});

describe('hazard codes', () => {
  it('when codes are listed, then GHS01 to GHS09 are all there', () => {
    expect(ghsCodes).toHaveLength(9); // UN GHS Annex 1: nine pictograms
  });

  it('when an H-statement has a suffix letter, then it is accepted', () => {
    expect(hazardStatementSchema.safeParse('H361d').success).toBe(true);
    expect(hazardStatementSchema.safeParse('X361').success).toBe(false);
  });
});
