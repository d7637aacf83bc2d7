import { type MigrationInterface, type QueryRunner, Table, TableForeignKey } from 'typeorm';

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
const double = (name: string, isNullable = false) => ({
  name,
  type: 'double precision',
  isNullable,
});

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
 * Preparations: procedures and their lines, prep plans with reservations, runs with the
 * draws they made (provenance) and the portions of product they put into stock.
 */
export class Preparations1796500000000 implements MigrationInterface {
  name = 'Preparations1796500000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'procedures',
        columns: [
          id,
          { name: 'title', type: 'varchar', length: '200' },
          { name: 'reference', type: 'text' },
          { name: 'base_scale', type: 'text' },
          double('expected_yield_percent', true),
          double('melting_low_c', true),
          double('melting_high_c', true),
          { name: 'cautions', type: 'text' },
          { name: 'caution_flags', type: 'text' },
          { name: 'created_by_id', type: 'integer', isNullable: true },
          ...timestamps,
        ],
        indices: [{ name: 'procedures_title_idx', columnNames: ['title'] }],
        foreignKeys: [fk('procedures_created_by_fk', 'created_by_id', 'users', 'SET NULL')],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'procedure_lines',
        columns: [
          id,
          { name: 'procedure_id', type: 'integer' },
          { name: 'position', type: 'integer' },
          { name: 'chemical_id', type: 'integer' },
          { name: 'role', type: 'varchar', length: '20' },
          double('quantity', true),
          { name: 'unit', type: 'varchar', length: '8', isNullable: true },
          double('coefficient', true),
          { name: 'optional', type: 'boolean' },
          { name: 'notes', type: 'text' },
          { name: 'concentration', type: 'text', isNullable: true },
          double('solution_density', true),
          { name: 'dissolved_in_chemical_id', type: 'integer', isNullable: true },
          double('dissolved_in_quantity', true),
          { name: 'dissolved_in_unit', type: 'varchar', length: '8', isNullable: true },
        ],
        indices: [
          { name: 'procedure_lines_procedure_idx', columnNames: ['procedure_id', 'position'] },
          { name: 'procedure_lines_chemical_idx', columnNames: ['chemical_id'] },
        ],
        foreignKeys: [
          fk('procedure_lines_procedure_fk', 'procedure_id', 'procedures', 'RESTRICT'),
          fk('procedure_lines_chemical_fk', 'chemical_id', 'chemicals', 'RESTRICT'),
          fk(
            'procedure_lines_dissolved_in_fk',
            'dissolved_in_chemical_id',
            'chemicals',
            'RESTRICT',
          ),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'prep_plans',
        columns: [
          id,
          { name: 'procedure_id', type: 'integer' },
          double('scale_factor'),
          { name: 'benches', type: 'integer' },
          double('overage_percent'),
          { name: 'planned_on', type: 'varchar', length: '10' },
          { name: 'status', type: 'varchar', length: '10' },
          { name: 'notes', type: 'text' },
          { name: 'created_by_id', type: 'integer', isNullable: true },
          { name: 'run_id', type: 'integer', isNullable: true },
          ...timestamps,
        ],
        indices: [
          { name: 'prep_plans_procedure_idx', columnNames: ['procedure_id'] },
          { name: 'prep_plans_status_idx', columnNames: ['status', 'planned_on'] },
        ],
        foreignKeys: [
          fk('prep_plans_procedure_fk', 'procedure_id', 'procedures', 'RESTRICT'),
          fk('prep_plans_created_by_fk', 'created_by_id', 'users', 'SET NULL'),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'reservations',
        columns: [
          id,
          { name: 'plan_id', type: 'integer' },
          { name: 'container_id', type: 'integer' },
          { name: 'requirement_index', type: 'integer', isNullable: true },
          double('quantity'),
          { name: 'unit', type: 'varchar', length: '4' },
          { name: 'until', type: 'varchar', length: '10' },
          { name: 'status', type: 'varchar', length: '10' },
          { name: 'released_reason', type: 'varchar', length: '12', isNullable: true },
          { name: 'released_at', type: 'varchar', length: '24', isNullable: true },
          { name: 'created_by_id', type: 'integer', isNullable: true },
          { name: 'created_at', type: 'varchar', length: '24' },
        ],
        indices: [
          { name: 'reservations_container_idx', columnNames: ['container_id', 'status'] },
          { name: 'reservations_plan_idx', columnNames: ['plan_id', 'status'] },
        ],
        foreignKeys: [
          fk('reservations_plan_fk', 'plan_id', 'prep_plans', 'RESTRICT'),
          fk('reservations_container_fk', 'container_id', 'containers', 'RESTRICT'),
          fk('reservations_created_by_fk', 'created_by_id', 'users', 'SET NULL'),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'runs',
        columns: [
          id,
          { name: 'procedure_id', type: 'integer' },
          { name: 'plan_id', type: 'integer', isNullable: true },
          double('scale_factor'),
          { name: 'status', type: 'varchar', length: '10' },
          { name: 'performed_by_id', type: 'integer', isNullable: true },
          { name: 'performed_on', type: 'varchar', length: '10', isNullable: true },
          double('theoretical_yield_g', true),
          double('crude_mass_g', true),
          double('product_mass_g', true),
          double('percent_yield', true),
          double('crude_percent_yield', true),
          { name: 'yield_flag', type: 'text', isNullable: true },
          double('melting_low_c', true),
          double('melting_high_c', true),
          { name: 'appearance', type: 'text' },
          { name: 'observation_notes', type: 'text' },
          { name: 'notes', type: 'text' },
          { name: 'actual_lines', type: 'text', isNullable: true },
          { name: 'stoichiometry', type: 'text', isNullable: true },
          { name: 'warnings', type: 'text' },
          { name: 'notices', type: 'text' },
          { name: 'recorded_at', type: 'varchar', length: '24', isNullable: true },
          ...timestamps,
        ],
        indices: [
          { name: 'runs_procedure_idx', columnNames: ['procedure_id', 'status'] },
          { name: 'runs_plan_idx', columnNames: ['plan_id'] },
        ],
        foreignKeys: [
          fk('runs_procedure_fk', 'procedure_id', 'procedures', 'RESTRICT'),
          fk('runs_plan_fk', 'plan_id', 'prep_plans', 'RESTRICT'),
          fk('runs_performed_by_fk', 'performed_by_id', 'users', 'SET NULL'),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'run_inputs',
        columns: [
          id,
          { name: 'run_id', type: 'integer' },
          { name: 'line_index', type: 'integer', isNullable: true },
          { name: 'purpose', type: 'text' },
          { name: 'container_id', type: 'integer' },
          { name: 'lot_id', type: 'integer' },
          { name: 'chemical_id', type: 'integer' },
          { name: 'ledger_entry_id', type: 'integer' },
          double('quantity'),
          { name: 'unit', type: 'varchar', length: '4' },
          double('purity_percent'),
        ],
        indices: [
          { name: 'run_inputs_run_idx', columnNames: ['run_id'] },
          { name: 'run_inputs_lot_idx', columnNames: ['lot_id'] },
          { name: 'run_inputs_chemical_idx', columnNames: ['chemical_id'] },
          { name: 'run_inputs_container_idx', columnNames: ['container_id'] },
        ],
        foreignKeys: [
          fk('run_inputs_run_fk', 'run_id', 'runs', 'RESTRICT'),
          fk('run_inputs_container_fk', 'container_id', 'containers', 'RESTRICT'),
          fk('run_inputs_lot_fk', 'lot_id', 'lots', 'RESTRICT'),
          fk('run_inputs_chemical_fk', 'chemical_id', 'chemicals', 'RESTRICT'),
          fk('run_inputs_ledger_entry_fk', 'ledger_entry_id', 'ledger_entries', 'RESTRICT'),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'run_products',
        columns: [
          id,
          { name: 'run_id', type: 'integer' },
          { name: 'line_index', type: 'integer' },
          { name: 'label', type: 'varchar', length: '80' },
          { name: 'lot_id', type: 'integer' },
          { name: 'container_id', type: 'integer' },
          { name: 'chemical_id', type: 'integer' },
          double('quantity'),
          { name: 'unit', type: 'varchar', length: '4' },
          double('mass_g', true),
          double('percent_yield', true),
          { name: 'created_at', type: 'varchar', length: '24' },
        ],
        indices: [
          { name: 'run_products_run_idx', columnNames: ['run_id'] },
          { name: 'run_products_lot_idx', columnNames: ['lot_id'] },
        ],
        foreignKeys: [
          fk('run_products_run_fk', 'run_id', 'runs', 'RESTRICT'),
          fk('run_products_lot_fk', 'lot_id', 'lots', 'RESTRICT'),
          fk('run_products_container_fk', 'container_id', 'containers', 'RESTRICT'),
          fk('run_products_chemical_fk', 'chemical_id', 'chemicals', 'RESTRICT'),
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('run_products');
    await queryRunner.dropTable('run_inputs');
    await queryRunner.dropTable('runs');
    await queryRunner.dropTable('reservations');
    await queryRunner.dropTable('prep_plans');
    await queryRunner.dropTable('procedure_lines');
    await queryRunner.dropTable('procedures');
  }
}
