import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { createDataSource, migrations } from '../data-source';
import { formulaAsStored } from './1796630000000-chemical-measures';

describe('chemical measures migration', () => {
  it('when formulas were stored as typed, then they are rewritten in the one normal form with the meaning they had', () => {
    expect(formulaAsStored('CuSO₄ . 5H₂O')).toBe('CuSO4·5H2O');
    expect(formulaAsStored('CuSO4*5H2O')).toBe('CuSO4·5H2O');
    // stored while "." between digits was read as a hydrate dot: it keeps that reading
    expect(formulaAsStored('CuSO4.5H2O')).toBe('CuSO4·5H2O');
    expect(formulaAsStored('HCl (aq)')).toBe('HCl(aq)');
    expect(formulaAsStored('NaCl')).toBe('NaCl');
    // no longer readable: left alone with the molar mass it was given
    expect(formulaAsStored('2H2O')).toBe('2H2O');
  });

  it('when the migration runs on a database with chemicals, then formulas and their search text change and down drops the bulk density', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-measures-'));
    const dataSource = createDataSource(path.join(dir, 'measures.sqlite'));
    await dataSource.initialize();
    try {
      const last = migrations.findIndex((m) => m.name === 'ChemicalMeasures1796630000000');
      await dataSource.runMigrations({ transaction: 'all' });
      for (let i = migrations.length - 1; i >= last; i--) {
        await dataSource.undoLastMigration({ transaction: 'all' });
      }
      const columns = async () =>
        ((await dataSource.query('PRAGMA table_info(chemicals)')) as { name: string }[]).map(
          (c) => c.name,
        );
      expect(await columns()).not.toContain('bulk_density');
      const now = '2026-01-01T00:00:00.000Z';
      await dataSource.query(
        `INSERT INTO chemicals (name, synonyms, formula, molar_mass, physical_state, default_purity_percent,
           ghs_pictograms, hazard_statements, storage_group, stock_unit, restricted, notes, search_text,
           created_at, updated_at)
         VALUES ('Blue vitriol', '[]', 'CuSO4.5H2O', 249.677, 'solid', 100, '[]', '[]', 'low-hazard', 'g', 0, '',
           'blue vitriol' || char(10) || 'cuso4.5h2o', ?, ?)`,
        [now, now],
      );
      await dataSource.runMigrations({ transaction: 'all' });
      const [row] = (await dataSource.query(
        'SELECT formula, search_text, molar_mass, bulk_density FROM chemicals',
      )) as { formula: string; search_text: string; molar_mass: number; bulk_density: null }[];
      expect(row).toEqual({
        formula: 'CuSO4·5H2O',
        search_text: 'blue vitriol\ncuso4·5h2o',
        molar_mass: 249.677,
        bulk_density: null,
      });
      await dataSource.query('PRAGMA foreign_keys = OFF');
      for (let i = migrations.length - 1; i >= last; i--) {
        await dataSource.undoLastMigration({ transaction: 'all' });
      }
      await dataSource.query('PRAGMA foreign_keys = ON');
      expect(await columns()).not.toContain('bulk_density');
    } finally {
      await dataSource.destroy();
    }
  });
});
