import {
  type MigrationInterface,
  type QueryRunner,
  TableColumn,
  TableForeignKey,
} from 'typeorm';

/**
 * Imports of more than one kind: `kind` says what the file holds (stock, or a supplier's price
 * list) and `supplier_id` names the supplier of a price list. Rows from before are stock.
 * Adding the foreign key rebuilds `imports` on SQLite; reverting does too.
 */
export class ImportKinds1796730000000 implements MigrationInterface {
  name = 'ImportKinds1796730000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.addColumns('imports', [
      new TableColumn({ name: 'kind', type: 'varchar', length: '12', default: "'stock'" }),
      new TableColumn({ name: 'supplier_id', type: 'integer', isNullable: true }),
    ]);
    await queryRunner.createForeignKey(
      'imports',
      new TableForeignKey({
        name: 'imports_supplier_fk',
        columnNames: ['supplier_id'],
        referencedTableName: 'suppliers',
        referencedColumnNames: ['id'],
        onDelete: 'SET NULL',
        onUpdate: 'NO ACTION',
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropForeignKey('imports', 'imports_supplier_fk');
    await queryRunner.dropColumns('imports', ['kind', 'supplier_id']);
  }
}
