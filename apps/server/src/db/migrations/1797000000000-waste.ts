import {
  type MigrationInterface,
  type QueryRunner,
  Table,
  type TableColumnOptions,
  type TableForeignKeyOptions,
} from 'typeorm';

const id: TableColumnOptions = {
  name: 'id',
  type: 'integer',
  isPrimary: true,
  isGenerated: true,
  generationStrategy: 'increment',
};
const varchar = (name: string, length: number, isNullable = false): TableColumnOptions => ({
  name,
  type: 'varchar',
  length: String(length),
  isNullable,
});
const integer = (name: string, isNullable = false): TableColumnOptions => ({
  name,
  type: 'integer',
  isNullable,
});
const text = (name: string): TableColumnOptions => ({ name, type: 'text', isNullable: false });

function fk(
  name: string,
  column: string,
  table: string,
  onDelete: 'RESTRICT' | 'SET NULL' | 'CASCADE',
): TableForeignKeyOptions {
  return {
    name,
    columnNames: [column],
    referencedTableName: table,
    referencedColumnNames: ['id'],
    onDelete,
    onUpdate: 'NO ACTION',
  };
}

/**
 * Chemical waste: the pickups that close waste containers (`waste_pickups`), the containers
 * (`waste_containers`, label codes `LW-W…` numbered apart from stock labels), what went into
 * them (`waste_additions`, each from a run, a ledger entry or by hand, with its chemicals in
 * `waste_addition_chemicals`) and the places marked as accumulation areas (`waste_areas`, each with its waste-accumulation
 * rule set).
 */
export class Waste1797000000000 implements MigrationInterface {
  name = 'Waste1797000000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'waste_pickups',
        columns: [
          id,
          varchar('picked_up_on', 10),
          varchar('contractor', 200),
          varchar('manifest_number', 60),
          text('notes'),
          integer('recorded_by_id', true),
          varchar('created_at', 24),
        ],
        foreignKeys: [fk('waste_pickups_recorded_by_fk', 'recorded_by_id', 'users', 'SET NULL')],
        indices: [{ name: 'waste_pickups_picked_up_on_idx', columnNames: ['picked_up_on'] }],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'waste_containers',
        columns: [
          id,
          varchar('label_code', 20),
          integer('label_number'),
          varchar('title', 120),
          integer('location_id'),
          { name: 'capacity', type: 'double precision', isNullable: false },
          varchar('capacity_unit', 8),
          varchar('form', 8),
          text('characteristics'),
          { name: 'acutely_hazardous', type: 'boolean', isNullable: false },
          varchar('accumulation_start_on', 10, true),
          varchar('status', 12),
          integer('pickup_id', true),
          text('notes'),
          varchar('created_at', 24),
          varchar('updated_at', 24),
        ],
        foreignKeys: [
          fk('waste_containers_location_fk', 'location_id', 'locations', 'RESTRICT'),
          fk('waste_containers_pickup_fk', 'pickup_id', 'waste_pickups', 'RESTRICT'),
        ],
        indices: [
          { name: 'waste_containers_label_unique', columnNames: ['label_code'], isUnique: true },
          {
            name: 'waste_containers_label_number_unique',
            columnNames: ['label_number'],
            isUnique: true,
          },
          { name: 'waste_containers_status_location_idx', columnNames: ['status', 'location_id'] },
          { name: 'waste_containers_location_idx', columnNames: ['location_id'] },
          { name: 'waste_containers_pickup_idx', columnNames: ['pickup_id'] },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'waste_additions',
        columns: [
          id,
          integer('waste_container_id'),
          varchar('description', 300),
          { name: 'quantity', type: 'double precision', isNullable: false },
          varchar('unit', 8),
          integer('run_id', true),
          integer('ledger_entry_id', true),
          integer('added_by_id', true),
          varchar('added_at', 24),
        ],
        foreignKeys: [
          fk('waste_additions_container_fk', 'waste_container_id', 'waste_containers', 'RESTRICT'),
          fk('waste_additions_run_fk', 'run_id', 'runs', 'RESTRICT'),
          fk('waste_additions_ledger_entry_fk', 'ledger_entry_id', 'ledger_entries', 'RESTRICT'),
          fk('waste_additions_added_by_fk', 'added_by_id', 'users', 'SET NULL'),
        ],
        indices: [
          { name: 'waste_additions_container_idx', columnNames: ['waste_container_id'] },
          { name: 'waste_additions_run_idx', columnNames: ['run_id'] },
          { name: 'waste_additions_ledger_entry_idx', columnNames: ['ledger_entry_id'] },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'waste_addition_chemicals',
        columns: [id, integer('waste_addition_id'), integer('chemical_id')],
        foreignKeys: [
          fk(
            'waste_addition_chemicals_addition_fk',
            'waste_addition_id',
            'waste_additions',
            'RESTRICT',
          ),
          fk('waste_addition_chemicals_chemical_fk', 'chemical_id', 'chemicals', 'RESTRICT'),
        ],
        indices: [
          {
            name: 'waste_addition_chemicals_unique',
            columnNames: ['waste_addition_id', 'chemical_id'],
            isUnique: true,
          },
          { name: 'waste_addition_chemicals_chemical_idx', columnNames: ['chemical_id'] },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'waste_areas',
        columns: [id, integer('location_id'), integer('rule_set_id'), varchar('created_at', 24)],
        foreignKeys: [
          fk('waste_areas_location_fk', 'location_id', 'locations', 'RESTRICT'),
          fk('waste_areas_rule_set_fk', 'rule_set_id', 'rule_sets', 'RESTRICT'),
        ],
        indices: [
          { name: 'waste_areas_location_unique', columnNames: ['location_id'], isUnique: true },
          { name: 'waste_areas_rule_set_idx', columnNames: ['rule_set_id'] },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('waste_areas');
    await queryRunner.dropTable('waste_addition_chemicals');
    await queryRunner.dropTable('waste_additions');
    await queryRunner.dropTable('waste_containers');
    await queryRunner.dropTable('waste_pickups');
  }
}
