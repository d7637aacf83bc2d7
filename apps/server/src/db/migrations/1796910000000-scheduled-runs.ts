import { type MigrationInterface, type QueryRunner, Table } from 'typeorm';

/** When each lab-wide periodic job last started (see scheduled-run.entity.ts). */
export class ScheduledRuns1796910000000 implements MigrationInterface {
  name = 'ScheduledRuns1796910000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'scheduled_runs',
        columns: [
          { name: 'name', type: 'varchar', length: '60', isPrimary: true },
          { name: 'last_started_at', type: 'varchar', length: '24' },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('scheduled_runs');
  }
}
