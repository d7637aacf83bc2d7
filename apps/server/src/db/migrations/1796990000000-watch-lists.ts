import {
  type MigrationInterface,
  type QueryRunner,
  Table,
  type TableColumnOptions,
  type TableForeignKeyOptions,
} from 'typeorm';
import { watchListPresets } from './1796990000000-watch-list-presets';

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
const text = (name: string): TableColumnOptions => ({ name, type: 'text' });
const boolean = (name: string): TableColumnOptions => ({ name, type: 'boolean' });

function fk(
  name: string,
  column: string,
  table: string,
  onDelete: 'RESTRICT' | 'SET NULL',
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
 * Watch lists of restricted and reportable substances (`watch_lists`, `watch_list_entries`),
 * with the built-in presets (EU explosives precursors, US DEA Lists I and II), none chosen;
 * and a shared order's approval of the watched chemicals on its lines
 * (`order_watch_approvals`, one per order at most).
 */
export class WatchLists1796990000000 implements MigrationInterface {
  name = 'WatchLists1796990000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'watch_lists',
        columns: [
          id,
          varchar('preset_key', 60, true),
          varchar('jurisdiction', 120),
          varchar('name', 200),
          varchar('source', 300),
          varchar('edition', 120),
          text('notes'),
          boolean('built_in'),
          boolean('chosen'),
          varchar('created_at', 24),
          varchar('updated_at', 24),
        ],
        indices: [
          { name: 'watch_lists_name_unique', columnNames: ['name'], isUnique: true },
          { name: 'watch_lists_preset_key_unique', columnNames: ['preset_key'], isUnique: true },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'watch_list_entries',
        columns: [
          id,
          integer('list_id'),
          varchar('substance', 200),
          varchar('cas_number', 12),
          { name: 'threshold_percent', type: 'double precision', isNullable: true },
          varchar('threshold_basis', 60),
          varchar('comparison', 12),
          text('action'),
          varchar('source', 300),
        ],
        foreignKeys: [fk('watch_list_entries_list_fk', 'list_id', 'watch_lists', 'RESTRICT')],
        indices: [
          { name: 'watch_list_entries_list_idx', columnNames: ['list_id'] },
          { name: 'watch_list_entries_cas_idx', columnNames: ['cas_number'] },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'order_watch_approvals',
        columns: [
          id,
          integer('order_id'),
          integer('approved_by_id', true),
          text('reason'),
          text('chemical_ids'),
          varchar('approved_at', 24),
        ],
        foreignKeys: [
          fk('order_watch_approvals_order_fk', 'order_id', 'orders', 'RESTRICT'),
          fk('order_watch_approvals_approved_by_fk', 'approved_by_id', 'users', 'SET NULL'),
        ],
        indices: [
          { name: 'order_watch_approvals_order_unique', columnNames: ['order_id'], isUnique: true },
        ],
      }),
    );
    const now = new Date().toISOString();
    const postgres = queryRunner.connection.driver.options.type === 'postgres';
    const insert = async (table: string, values: Record<string, unknown>) => {
      const columns = Object.keys(values);
      const marks = columns.map((_, i) => (postgres ? `$${i + 1}` : '?'));
      await queryRunner.query(
        `INSERT INTO "${table}" (${columns.map((c) => `"${c}"`).join(', ')}) VALUES (${marks.join(', ')})`,
        // SQLite binds no booleans: 1/0 there, true/false on PostgreSQL.
        Object.values(values).map((v) => (typeof v === 'boolean' && !postgres ? Number(v) : v)),
      );
    };
    for (const preset of watchListPresets) {
      await insert('watch_lists', {
        preset_key: preset.key,
        jurisdiction: preset.jurisdiction,
        name: preset.name,
        source: preset.source,
        edition: preset.edition,
        notes: preset.notes,
        built_in: true,
        chosen: false,
        created_at: now,
        updated_at: now,
      });
      const [row] = (await queryRunner.query(
        `SELECT id FROM "watch_lists" WHERE preset_key = ${postgres ? '$1' : '?'}`,
        [preset.key],
      )) as { id: number }[];
      for (const entry of preset.entries) {
        await insert('watch_list_entries', {
          list_id: Number(row!.id),
          substance: entry.substance,
          cas_number: entry.casNumber,
          threshold_percent: entry.thresholdPercent,
          threshold_basis: entry.thresholdBasis,
          comparison: entry.comparison,
          action: entry.action,
          source: entry.source,
        });
      }
    }
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('order_watch_approvals');
    await queryRunner.dropTable('watch_list_entries');
    await queryRunner.dropTable('watch_lists');
  }
}
