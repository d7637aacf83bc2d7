import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The age of the oldest queued e-mail, read on every metrics scrape: with only
 * `outbox_created_at_idx` SQLite walks every sent message older than it to find it.
 */
export class OutboxQueuedAge1796900000000 implements MigrationInterface {
  name = 'OutboxQueuedAge1796900000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      'CREATE INDEX "outbox_status_created_idx" ON "outbox" ("status", "created_at")',
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP INDEX "outbox_status_created_idx"');
  }
}
