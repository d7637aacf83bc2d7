import { ChemError, canonicalFormula } from '@lotwise/chem';
import { type MigrationInterface, type QueryRunner, TableColumn } from 'typeorm';
import { withPlaceholders } from '../sql';

/**
 * The stored formula as it was read when it was saved: "CuSO4.5H2O" was then a hydrate, so
 * a dot between digits becomes "·" before normalizing. A formula that no longer reads
 * ("2H2O", once doubled) is left as it is, with the molar mass it was given.
 */
export function formulaAsStored(formula: string): string {
  try {
    return canonicalFormula(formula);
  } catch (error) {
    if (!(error instanceof ChemError) || error.code !== 'decimal_count') return formula;
    try {
      return canonicalFormula(formula.replace(/(\d)\.(?=\d)/g, '$1·'));
    } catch {
      return formula;
    }
  }
}

/**
 * Chemicals get an optional bulk (poured) density, used when a solid is measured by volume,
 * and every stored formula is rewritten in the one normal form (ASCII digits, "·" between
 * parts). `down` drops the column; the normalized formulas stay, as the earlier code reads
 * them with the same meaning.
 */
export class ChemicalMeasures1796630000000 implements MigrationInterface {
  name = 'ChemicalMeasures1796630000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.addColumn(
      'chemicals',
      new TableColumn({ name: 'bulk_density', type: 'double precision', isNullable: true }),
    );
    const rows: { id: number; formula: string; search_text: string }[] = await queryRunner.query(
      'SELECT id, formula, search_text FROM chemicals WHERE formula IS NOT NULL',
    );
    for (const row of rows) {
      const formula = formulaAsStored(row.formula);
      if (formula === row.formula) continue;
      const searchText = row.search_text
        .split('\n')
        .map((line) => (line === row.formula.toLowerCase() ? formula.toLowerCase() : line))
        .join('\n');
      const update = 'UPDATE chemicals SET formula = ?, search_text = ? WHERE id = ?';
      await queryRunner.query(withPlaceholders(queryRunner.connection, update), [
        formula,
        searchText,
        row.id,
      ]);
    }
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropColumn('chemicals', 'bulk_density');
  }
}
