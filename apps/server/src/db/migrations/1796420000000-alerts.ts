import { type MigrationInterface, type QueryRunner, Table, TableForeignKey } from 'typeorm';

/** Alerts: the outbox of e-mails and each person's alert preferences. */
export class Alerts1796420000000 implements MigrationInterface {
  name = 'Alerts1796420000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'outbox',
        columns: [
          {
            name: 'id',
            type: 'integer',
            isPrimary: true,
            isGenerated: true,
            generationStrategy: 'increment',
          },
          { name: 'user_id', type: 'integer', isNullable: true },
          { name: 'recipient_email', type: 'varchar', length: '254' },
          { name: 'kind', type: 'varchar', length: '40' },
          { name: 'subject', type: 'varchar', length: '300' },
          { name: 'text', type: 'text' },
          { name: 'html', type: 'text' },
          { name: 'link', type: 'varchar', length: '500', isNullable: true },
          { name: 'dedup_key', type: 'varchar', length: '200', isNullable: true },
          { name: 'delivery', type: 'varchar', length: '10' },
          { name: 'status', type: 'varchar', length: '10' },
          { name: 'attempts', type: 'integer' },
          { name: 'last_error', type: 'text', isNullable: true },
          { name: 'next_attempt_at', type: 'varchar', length: '24', isNullable: true },
          { name: 'created_at', type: 'varchar', length: '24' },
          { name: 'updated_at', type: 'varchar', length: '24' },
          { name: 'sent_at', type: 'varchar', length: '24', isNullable: true },
        ],
        indices: [
          { name: 'outbox_status_next_idx', columnNames: ['status', 'next_attempt_at'] },
          {
            name: 'outbox_dedup_idx',
            columnNames: ['recipient_email', 'dedup_key', 'created_at'],
          },
          { name: 'outbox_created_at_idx', columnNames: ['created_at'] },
        ],
        foreignKeys: [
          new TableForeignKey({
            name: 'outbox_user_fk',
            columnNames: ['user_id'],
            referencedTableName: 'users',
            referencedColumnNames: ['id'],
            onDelete: 'SET NULL',
          }),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'alert_preferences',
        columns: [
          { name: 'user_id', type: 'integer', isPrimary: true },
          { name: 'delivery', type: 'varchar', length: '10' },
          { name: 'kinds', type: 'text' },
          { name: 'updated_at', type: 'varchar', length: '24' },
        ],
        foreignKeys: [
          new TableForeignKey({
            name: 'alert_preferences_user_fk',
            columnNames: ['user_id'],
            referencedTableName: 'users',
            referencedColumnNames: ['id'],
            onDelete: 'CASCADE',
          }),
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('alert_preferences');
    await queryRunner.dropTable('outbox');
  }
}
