import {
  type MigrationInterface,
  type QueryRunner,
  Table,
  TableColumn,
  TableForeignKey,
} from 'typeorm';

const id = {
  name: 'id',
  type: 'integer',
  isPrimary: true,
  isGenerated: true,
  generationStrategy: 'increment' as const,
};
const timestamps = [
  { name: 'created_at', type: 'varchar', length: '24' },
  { name: 'updated_at', type: 'varchar', length: '24' },
];

function fk(name: string, column: string, table: string, onDelete: 'RESTRICT' | 'SET NULL') {
  return new TableForeignKey({
    name,
    columnNames: [column],
    referencedTableName: table,
    referencedColumnNames: ['id'],
    onDelete,
  });
}

/**
 * Stock: locations, lots, containers, their append-only ledger, stocktakes, and the extra
 * incompatibility groups of a chemical.
 */
export class Stock1796250000000 implements MigrationInterface {
  name = 'Stock1796250000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.addColumn(
      'chemicals',
      new TableColumn({ name: 'extra_hazard_groups', type: 'text', isNullable: true }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'locations',
        columns: [
          id,
          { name: 'name', type: 'varchar', length: '120' },
          { name: 'kind', type: 'varchar', length: '12' },
          { name: 'parent_id', type: 'integer', isNullable: true },
          { name: 'path', type: 'text' },
          { name: 'id_path', type: 'varchar', length: '400' },
          { name: 'depth', type: 'integer' },
          { name: 'storage_groups', type: 'text' },
          { name: 'notes', type: 'text' },
          ...timestamps,
        ],
        indices: [
          { name: 'locations_parent_idx', columnNames: ['parent_id'] },
          { name: 'locations_id_path_idx', columnNames: ['id_path'] },
        ],
        foreignKeys: [fk('locations_parent_fk', 'parent_id', 'locations', 'RESTRICT')],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'lots',
        columns: [
          id,
          { name: 'chemical_id', type: 'integer' },
          { name: 'source', type: 'varchar', length: '10' },
          { name: 'supplier_name', type: 'varchar', length: '200', isNullable: true },
          { name: 'supplier_lot_number', type: 'varchar', length: '80', isNullable: true },
          { name: 'grade', type: 'varchar', length: '80', isNullable: true },
          { name: 'purity_percent', type: 'double precision', isNullable: true },
          { name: 'received_on', type: 'varchar', length: '10' },
          { name: 'expires_on', type: 'varchar', length: '10', isNullable: true },
          { name: 'made_by_run_id', type: 'integer', isNullable: true },
          { name: 'certificate_file_name', type: 'varchar', length: '255', isNullable: true },
          { name: 'certificate_stored_name', type: 'varchar', length: '100', isNullable: true },
          { name: 'notes', type: 'text' },
          ...timestamps,
        ],
        indices: [
          { name: 'lots_chemical_idx', columnNames: ['chemical_id'] },
          { name: 'lots_expires_on_idx', columnNames: ['expires_on'] },
        ],
        foreignKeys: [fk('lots_chemical_fk', 'chemical_id', 'chemicals', 'RESTRICT')],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'containers',
        columns: [
          id,
          { name: 'label_code', type: 'varchar', length: '20' },
          { name: 'label_number', type: 'integer', isNullable: true },
          { name: 'lot_id', type: 'integer' },
          { name: 'chemical_id', type: 'integer' },
          { name: 'location_id', type: 'integer' },
          { name: 'status', type: 'varchar', length: '10' },
          { name: 'quantity', type: 'double precision' },
          { name: 'unit', type: 'varchar', length: '4' },
          { name: 'tare_mass', type: 'double precision', isNullable: true },
          { name: 'capacity', type: 'double precision', isNullable: true },
          { name: 'capacity_unit', type: 'varchar', length: '8', isNullable: true },
          { name: 'opened_on', type: 'varchar', length: '10', isNullable: true },
          { name: 'expires_on', type: 'varchar', length: '10', isNullable: true },
          { name: 'peroxide_due_on', type: 'varchar', length: '10', isNullable: true },
          { name: 'notes', type: 'text' },
          ...timestamps,
        ],
        indices: [
          { name: 'containers_label_code_unique', columnNames: ['label_code'], isUnique: true },
          {
            name: 'containers_label_number_unique',
            columnNames: ['label_number'],
            isUnique: true,
          },
          { name: 'containers_chemical_status_idx', columnNames: ['chemical_id', 'status'] },
          { name: 'containers_lot_idx', columnNames: ['lot_id'] },
          { name: 'containers_location_idx', columnNames: ['location_id'] },
          { name: 'containers_status_idx', columnNames: ['status'] },
          { name: 'containers_expires_on_idx', columnNames: ['expires_on'] },
          { name: 'containers_peroxide_due_on_idx', columnNames: ['peroxide_due_on'] },
        ],
        foreignKeys: [
          fk('containers_lot_fk', 'lot_id', 'lots', 'RESTRICT'),
          fk('containers_chemical_fk', 'chemical_id', 'chemicals', 'RESTRICT'),
          fk('containers_location_fk', 'location_id', 'locations', 'RESTRICT'),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'ledger_entries',
        columns: [
          id,
          { name: 'container_id', type: 'integer' },
          { name: 'reason', type: 'varchar', length: '12' },
          { name: 'quantity', type: 'double precision' },
          { name: 'unit', type: 'varchar', length: '4' },
          { name: 'balance_after', type: 'double precision' },
          { name: 'note', type: 'text' },
          { name: 'user_id', type: 'integer', isNullable: true },
          { name: 'run_id', type: 'integer', isNullable: true },
          { name: 'order_id', type: 'integer', isNullable: true },
          { name: 'stocktake_id', type: 'integer', isNullable: true },
          { name: 'from_location_id', type: 'integer', isNullable: true },
          { name: 'to_location_id', type: 'integer', isNullable: true },
          { name: 'related_container_id', type: 'integer', isNullable: true },
          { name: 'created_at', type: 'varchar', length: '24' },
        ],
        indices: [
          { name: 'ledger_entries_container_idx', columnNames: ['container_id', 'id'] },
          { name: 'ledger_entries_created_at_idx', columnNames: ['created_at'] },
        ],
        foreignKeys: [
          fk('ledger_entries_container_fk', 'container_id', 'containers', 'RESTRICT'),
          fk('ledger_entries_user_fk', 'user_id', 'users', 'SET NULL'),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'stocktakes',
        columns: [
          id,
          { name: 'location_id', type: 'integer' },
          { name: 'include_sublocations', type: 'boolean' },
          { name: 'user_id', type: 'integer', isNullable: true },
          { name: 'note', type: 'text' },
          { name: 'summary', type: 'text' },
          { name: 'created_at', type: 'varchar', length: '24' },
        ],
        indices: [{ name: 'stocktakes_location_idx', columnNames: ['location_id'] }],
        foreignKeys: [
          fk('stocktakes_location_fk', 'location_id', 'locations', 'RESTRICT'),
          fk('stocktakes_user_fk', 'user_id', 'users', 'SET NULL'),
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('stocktakes');
    await queryRunner.dropTable('ledger_entries');
    await queryRunner.dropTable('containers');
    await queryRunner.dropTable('lots');
    await queryRunner.dropTable('locations');
    await queryRunner.dropColumn('chemicals', 'extra_hazard_groups');
  }
}
