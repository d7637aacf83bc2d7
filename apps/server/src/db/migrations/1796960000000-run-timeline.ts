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
const double = (name: string): TableColumnOptions => ({
  name,
  type: 'double precision',
  isNullable: true,
});
const text = (name: string, isNullable = false): TableColumnOptions => ({
  name,
  type: 'text',
  isNullable,
});

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
 * A run's timeline: the photos taken at the bench (`run_photos`) and every entry appended
 * while the run is under way (`run_timeline_entries`: readings, notes, photos, steps and
 * timers), each unique per run by the id the device gave it, so a resend is stored once.
 */
export class RunTimeline1796960000000 implements MigrationInterface {
  name = 'RunTimeline1796960000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'run_photos',
        columns: [
          id,
          integer('run_id'),
          varchar('client_id', 64),
          varchar('file_name', 255),
          varchar('stored_name', 64),
          integer('size'),
          varchar('content_type', 40),
          varchar('uploaded_at', 24),
          integer('uploaded_by_id', true),
        ],
        foreignKeys: [
          fk('run_photos_run_fk', 'run_id', 'runs', 'RESTRICT'),
          fk('run_photos_uploaded_by_fk', 'uploaded_by_id', 'users', 'SET NULL'),
        ],
        indices: [
          {
            name: 'run_photos_client_unique',
            columnNames: ['run_id', 'client_id'],
            isUnique: true,
          },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'run_timeline_entries',
        columns: [
          id,
          integer('run_id'),
          varchar('client_id', 64),
          varchar('kind', 12),
          varchar('at', 24),
          integer('step_index', true),
          double('temperature_c'),
          text('text'),
          integer('upload_id', true),
          double('duration_minutes'),
          varchar('ends_at', 24, true),
          varchar('timer_client_id', 64, true),
          varchar('deviation_reason', 30, true),
          integer('deviation_step_index', true),
          text('deviation_message', true),
          text('deviation_instruction', true),
          integer('recorded_by_id', true),
          varchar('received_at', 24),
        ],
        foreignKeys: [
          fk('run_timeline_entries_run_fk', 'run_id', 'runs', 'RESTRICT'),
          fk('run_timeline_entries_upload_fk', 'upload_id', 'run_photos', 'RESTRICT'),
          fk('run_timeline_entries_recorded_by_fk', 'recorded_by_id', 'users', 'SET NULL'),
        ],
        indices: [
          {
            name: 'run_timeline_entries_client_unique',
            columnNames: ['run_id', 'client_id'],
            isUnique: true,
          },
          { name: 'run_timeline_entries_run_at_idx', columnNames: ['run_id', 'at'] },
          { name: 'run_timeline_entries_upload_idx', columnNames: ['upload_id'] },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('run_timeline_entries');
    await queryRunner.dropTable('run_photos');
  }
}
