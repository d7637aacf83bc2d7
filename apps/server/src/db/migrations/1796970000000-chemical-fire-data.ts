import type { MigrationInterface, QueryRunner } from 'typeorm';

const columns: [name: string, definition: string][] = [
  ['flash_point_c', 'double precision'],
  ['boiling_point_c', 'double precision'],
  ['flash_point_source', "varchar(120) NOT NULL DEFAULT ('')"],
  ['boiling_point_source', "varchar(120) NOT NULL DEFAULT ('')"],
];

/**
 * Chemicals get their fire data: flash point and boiling point (°C, null when not recorded)
 * and where each figure came from (empty when not said). The liquid class and GHS category
 * are worked out from them when read, never stored. Plain ALTER TABLE, so SQLite keeps the
 * table (and its indexes) as it is.
 */
export class ChemicalFireData1796970000000 implements MigrationInterface {
  name = 'ChemicalFireData1796970000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    for (const [name, definition] of columns) {
      await queryRunner.query(`ALTER TABLE "chemicals" ADD COLUMN "${name}" ${definition}`);
    }
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const [name] of [...columns].reverse()) {
      await queryRunner.query(`ALTER TABLE "chemicals" DROP COLUMN "${name}"`);
    }
  }
}
